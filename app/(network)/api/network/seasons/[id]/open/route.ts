import { route } from "@/lib/http/route";
import { openSeason } from "@/lib/queries/seasons";
import { parseId, WRITERS } from "../../../transects/params";

export const POST = route<undefined, undefined, { id: string }>({ roles: WRITERS }, async ({ actor, params }) => ({ season: await openSeason(actor, parseId(params.id)) }));
