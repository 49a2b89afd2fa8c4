import { route } from "@/lib/http/route";
import { updateSeason } from "@/lib/queries/seasons";
import { seasonPatchSchema } from "../../../../network/seasons/schema";
import { parseId, WRITERS } from "../../transects/params";

/** Name and targets at any time; dates while the season is planned. */
export const PATCH = route<typeof seasonPatchSchema, undefined, { id: string }>({ roles: WRITERS, body: seasonPatchSchema }, async ({ actor, body, params }) => ({
  season: await updateSeason(actor, parseId(params.id), body),
}));
