import { z } from "zod";
import { invalid } from "@/lib/errors";
import { MAX_CHECKLIST_FILE_BYTES, MAX_LIST_ITEMS, MAX_NAME_LENGTH, MAX_TAG_DESCRIPTION_LENGTH, MAX_TAG_LENGTH, MAX_VERNACULAR_LENGTH } from "@/lib/checklist/limits";
import { AGGREGATE_RANK, TAXON_RANKS } from "@/lib/checklist/ranks";
import { slugify } from "@/lib/checklist/tags";
import { safeText } from "@/lib/validation/fields";

// The checklist's forms and route bodies: the pages validate with these and the route handlers
// validate the same again. Rules that need the checklist itself (a name belongs to one entry, an
// aggregate covers species on the checklist) are the planner's (lib/checklist/plan.ts).

const oneLine = (what: string, max: number) =>
  safeText(max)
    .pipe(z.string().min(1, { message: `Enter the ${what}.` }))
    .refine((s) => !/[\r\n]/.test(s), { message: `The ${what} must be on one line.` });

/** Names are listed with semicolons (synonyms, covered species, a file's cells), so they hold none. */
const listedName = (what: string, max: number) => oneLine(what, max).refine((s) => !s.includes(";"), { message: `The ${what} cannot contain a semicolon.` });

const MONTHS = "Months are 1 (January) to 12 (December).";

export const entrySchema = z
  .object({
    scientificName: listedName("scientific name", MAX_NAME_LENGTH),
    vernacularName: oneLine("vernacular name", MAX_VERNACULAR_LENGTH),
    taxonRank: z.enum(TAXON_RANKS, { message: "Choose a rank." }),
    sensitive: z.boolean({ message: "Say whether the species is sensitive." }),
    activeMonths: z.array(z.number({ message: MONTHS }).int({ message: MONTHS }).min(1, { message: MONTHS }).max(12, { message: MONTHS }), { message: MONTHS }).max(12, { message: MONTHS }),
    tagIds: z.array(z.uuid({ message: "Choose tags from the list." })).max(MAX_LIST_ITEMS),
    synonyms: z.array(listedName("synonym", MAX_NAME_LENGTH)).max(MAX_LIST_ITEMS, { message: `At most ${MAX_LIST_ITEMS} synonyms.` }),
    covers: z.array(z.uuid({ message: "Choose species from the checklist." })).max(MAX_LIST_ITEMS, { message: `At most ${MAX_LIST_ITEMS} species.` }),
  })
  .superRefine((entry, ctx) => {
    const seen = new Set<string>();
    for (const synonym of entry.synonyms) {
      const key = synonym.toLowerCase();
      if (key === entry.scientificName.toLowerCase()) ctx.addIssue({ code: "custom", path: ["synonyms"], message: "A synonym cannot be the entry's own scientific name." });
      else if (seen.has(key)) ctx.addIssue({ code: "custom", path: ["synonyms"], message: `"${synonym}" is listed twice.` });
      seen.add(key);
    }
    if (entry.taxonRank === AGGREGATE_RANK && new Set(entry.covers).size < 2) {
      ctx.addIssue({ code: "custom", path: ["covers"], message: "An aggregate covers at least two species: choose them." });
    }
    if (entry.taxonRank !== AGGREGATE_RANK && entry.covers.length > 0) {
      ctx.addIssue({ code: "custom", path: ["covers"], message: "Only an aggregate covers other species." });
    }
  });
export type EntryForm = z.infer<typeof entrySchema>;

export const tagSchema = z.object({
  label: listedName("tag's name", MAX_TAG_LENGTH).refine((s) => s === "" || slugify(s) !== "", { message: "A tag's name needs at least one letter or digit." }),
  description: safeText(MAX_TAG_DESCRIPTION_LENGTH)
    .nullish()
    .transform((s) => (s ? s : null)),
});
export type TagForm = z.input<typeof tagSchema>;

export const mergeSchema = z.object({
  keepId: z.uuid({ message: "Choose the entry to keep." }),
  foldId: z.uuid({ message: "Choose the entry to fold in." }),
});
export type MergeForm = z.infer<typeof mergeSchema>;

/** A checklist file, read in the browser (File.text()) and sent as JSON. */
export const checklistFileSchema = z.object({
  fileName: safeText(255).refine((name) => /\.csv$/i.test(name), { message: "Choose a CSV file (its name ends in .csv)." }),
  // The reader measures UTF-8 bytes exactly; more characters than that many bytes is too large anyway.
  text: z.string({ message: "Send the file's text." }).max(MAX_CHECKLIST_FILE_BYTES, { message: "The file is larger than 10 MB." }),
});

export const confirmImportSchema = checklistFileSchema.extend({
  previewHash: z.string().min(1).max(100, { message: "Preview the file before importing it." }),
});

export const idParams = z.object({ id: z.uuid({ message: "That is not a checklist id." }) });

/** Route segments are input too: a malformed id is a 400 with a field message, not a 500. */
export function parseId(raw: string | undefined): string {
  const parsed = idParams.shape.id.safeParse(raw);
  if (!parsed.success) throw invalid({ id: ["That is not a checklist id."] });
  return parsed.data;
}
