import { refusalResponse } from "@/lib/checklist/refusal";
import { route } from "@/lib/http/route";
import { importChecklist } from "@/lib/queries/checklist-import";
import { confirmImportSchema } from "../../../../network/checklist/schema";

/** Imports a previewed checklist file: the same file and the preview's hash. */
export const POST = route({ roles: ["organiser"], body: confirmImportSchema, bodyLimit: "checklistFile" }, async ({ actor, body }) => {
  try {
    return { imported: await importChecklist(actor, body) };
  } catch (error) {
    return refusalResponse(error);
  }
});
