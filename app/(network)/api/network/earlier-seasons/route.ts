import { route } from "@/lib/http/route";
import { importRefusalResponse } from "@/lib/import/refusal";
import { importSeason } from "@/lib/queries/season-import";
import { confirmSeasonImportForm } from "../../../network/earlier-seasons/schema";
import { importInputOf } from "./files";

/** Imports two previewed files: the same files, season and status, and the preview's hash. */
export const POST = route({ roles: ["organiser"], body: confirmSeasonImportForm, bodyLimit: "seasonImport", accepts: "form" }, async ({ actor, body }) => {
  try {
    return { imported: await importSeason(actor, { ...(await importInputOf(body)), previewHash: body.previewHash }) };
  } catch (error) {
    return importRefusalResponse(error);
  }
});
