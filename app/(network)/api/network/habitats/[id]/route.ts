import { route } from "@/lib/http/route";
import { deleteHabitatGroup, updateHabitatGroup } from "@/lib/queries/habitat-groups";
import { habitatGroupPatchSchema } from "../../../../network/habitats/schema";
import { parseId, WRITERS } from "../../transects/params";

export const PATCH = route<typeof habitatGroupPatchSchema, undefined, { id: string }>({ roles: WRITERS, body: habitatGroupPatchSchema }, async ({ actor, body, params }) => ({
  habitatGroup: await updateHabitatGroup(actor, parseId(params.id), body),
}));

/** Only a group without transects can be deleted (409 otherwise). */
export const DELETE = route<undefined, undefined, { id: string }>({ roles: WRITERS }, async ({ actor, params }) => {
  await deleteHabitatGroup(actor, parseId(params.id));
  return { deleted: true };
});
