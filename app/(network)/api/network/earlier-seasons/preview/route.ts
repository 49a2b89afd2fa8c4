import { route } from "@/lib/http/route";
import { previewSeasonImport } from "@/lib/queries/season-import";
import { seasonImportForm } from "../../../../network/earlier-seasons/schema";
import { importInputOf } from "../files";

/** What importing the two files would write: counts, new recorders and every problem by file and line. Writes nothing. */
export const POST = route({ roles: ["organiser"], body: seasonImportForm, bodyLimit: "seasonImport", accepts: "form" }, async ({ body }) => previewSeasonImport(await importInputOf(body)));
