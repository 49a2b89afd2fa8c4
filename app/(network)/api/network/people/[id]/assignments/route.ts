import { db } from "@/db/client";
import { route } from "@/lib/http/route";
import { setAssignments } from "@/lib/queries/people";
import { assignmentsSchema } from "../../../../../network/people/schema";
import { parseId } from "../../../transects/params";

/** The person's side: `add` and `remove` are transect ids. */
export const POST = route<typeof assignmentsSchema, undefined, { id: string }>({ roles: ["organiser"], body: assignmentsSchema }, async ({ actor, body, params }) => {
  const userId = parseId(params.id);
  return db().transaction((tx) => setAssignments(tx, actor, { userId, add: body.add, remove: body.remove }));
});
