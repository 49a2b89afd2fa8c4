import { refusalResponse } from "@/lib/checklist/refusal";
import { route } from "@/lib/http/route";
import { previewChecklistImport } from "@/lib/queries/checklist-import";
import { checklistFileSchema } from "../../../../../network/checklist/schema";

/** What importing a checklist file would add and change, or every problem in it. Writes nothing. */
export const POST = route({ roles: ["organiser"], body: checklistFileSchema, bodyLimit: "checklistFile" }, async ({ body }) => {
  try {
    return await previewChecklistImport(body.text);
  } catch (error) {
    return refusalResponse(error);
  }
});
