import { route } from "@/lib/http/route";
import { getTransect, updateTransect } from "@/lib/queries/transects";
import { transectPatchSchema } from "../../../../network/transects/schema";
import { parseId, READERS, WRITERS } from "../params";

export const GET = route<undefined, undefined, { id: string }>({ roles: READERS }, async ({ actor, params }) => ({ transect: await getTransect(actor, parseId(params.id)) }));

/** Details only; a new route goes to ./versions, so that it is dated. */
export const PATCH = route<typeof transectPatchSchema, undefined, { id: string }>({ roles: WRITERS, body: transectPatchSchema }, async ({ actor, body, params }) => {
  const id = parseId(params.id);
  await updateTransect(actor, id, body);
  return { transect: await getTransect(actor, id) };
});
