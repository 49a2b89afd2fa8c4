import { REVIEWERS } from "@/lib/auth/roles";
import { route } from "@/lib/http/route";
import { checklistEntry, updateEntry } from "@/lib/queries/checklist";
import { entrySchema, parseId } from "../../../../network/checklist/schema";

export const GET = route<undefined, undefined, { id: string }>({ roles: REVIEWERS }, async ({ params }) => ({ entry: await checklistEntry(parseId(params.id)) }));

/** Edits one entry: every field is sent, as the form holds them. */
export const PATCH = route<typeof entrySchema, undefined, { id: string }>({ roles: ["organiser"], body: entrySchema }, async ({ actor, body, params }) => {
  const id = parseId(params.id);
  const { changed } = await updateEntry(actor, id, body);
  return { changed, entry: await checklistEntry(id) };
});
