import { route } from "@/lib/http/route";
import { updateTag } from "@/lib/queries/checklist-tags";
import { parseId, tagSchema } from "../../../../../network/checklist/schema";

/** Renames a tag or changes its description; its slug stays. */
export const PATCH = route<typeof tagSchema, undefined, { id: string }>({ roles: ["organiser"], body: tagSchema }, async ({ actor, body, params }) => updateTag(actor, parseId(params.id), body));
