import { route } from "@/lib/http/route";
import { personDetail, updatePerson } from "@/lib/queries/people";
import { personPatchSchema } from "../../../../network/people/schema";
import { parseId } from "../../transects/params";

export const GET = route<undefined, undefined, { id: string }>({ roles: ["organiser"] }, async ({ params }) => personDetail(parseId(params.id)));

export const PATCH = route<typeof personPatchSchema, undefined, { id: string }>({ roles: ["organiser"], body: personPatchSchema }, async ({ actor, body, params }) => ({
  person: await updatePerson(actor, { userId: parseId(params.id), ...body }),
}));
