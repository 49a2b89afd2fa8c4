import { z } from "zod";
import { statusForReviewer } from "@/lib/review/words";

// The earlier-seasons import form (multipart): the two CSV files, the season and what the
// sightings are stored as. The confirm step repeats them with the preview's hash.
const csvFile = (what: string) => z.instanceof(File, { message: `Choose the ${what} (a CSV file).` });

export const seasonImportForm = z.object({
  seasonId: z.uuid({ message: "Choose the season the files belong to." }),
  recordStatus: z.enum(["accepted", "pending"], { message: `Choose ${statusForReviewer.accepted.toLowerCase()} or ${statusForReviewer.pending.toLowerCase()}.` }),
  walks: csvFile("walks file"),
  sightings: csvFile("sightings file"),
});

export const confirmSeasonImportForm = seasonImportForm.extend({
  previewHash: z.string({ message: "Preview the files first." }).regex(/^[0-9a-f]{64}$/, { message: "Preview the files first." }),
});

export type SeasonImportForm = z.infer<typeof seasonImportForm>;
