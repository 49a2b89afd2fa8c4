import { route } from "@/lib/http/route";
import { mergeEntries } from "@/lib/queries/checklist-merge";
import { mergeSchema } from "../../../../network/checklist/schema";

/** Folds one entry into another: { keepId, foldId }. */
export const POST = route({ roles: ["organiser"], body: mergeSchema }, async ({ actor, body }) => mergeEntries(actor, body));
