import { route } from "@/lib/http/route";
import { erasePerson } from "@/lib/queries/personal-data";
import { erasureSchema } from "../../../../../network/people/schema";
import { parseId } from "../../../transects/params";

/** Erases a person on request (lib/queries/personal-data.ts); the body confirms with their pseudonym. */
export const POST = route<typeof erasureSchema, undefined, { id: string }>({ roles: ["organiser"], body: erasureSchema }, async ({ actor, body, params }) => ({
  erased: await erasePerson(actor, parseId(params.id), body.confirm),
}));
