import { route } from "@/lib/http/route";
import { setRetired } from "@/lib/queries/transects";
import { parseId, WRITERS } from "../../params";

const answer = (t: { id: string; active: boolean; retiredAt: Date | null }) => ({ transect: { id: t.id, active: t.active, retiredAt: t.retiredAt?.toISOString() ?? null } });

/** Retire: nobody records on it any more; its walks, history and past seasons stay. */
export const POST = route<undefined, undefined, { id: string }>({ roles: WRITERS }, async ({ actor, params }) => answer(await setRetired(actor, parseId(params.id), true)));

/** Bring a retired transect back into use. */
export const DELETE = route<undefined, undefined, { id: string }>({ roles: WRITERS }, async ({ actor, params }) => answer(await setRetired(actor, parseId(params.id), false)));
