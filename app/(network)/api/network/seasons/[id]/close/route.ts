import { route } from "@/lib/http/route";
import { closeSeason } from "@/lib/queries/seasons";
import { parseId, WRITERS } from "../../../transects/params";

/** Closing starts the grace period; a closed season is not reopened (lib/seasons/rules.ts). */
export const POST = route<undefined, undefined, { id: string }>({ roles: WRITERS }, async ({ actor, params }) => ({ season: await closeSeason(actor, parseId(params.id)) }));
