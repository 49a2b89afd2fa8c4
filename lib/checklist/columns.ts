// The checklist file's columns. Lists inside a cell are separated by semicolons.

export const CHECKLIST_COLUMNS = [
  "scientific_name",
  "vernacular_name",
  "taxon_rank",
  "tags",
  "sensitive",
  "active_months",
  "synonyms",
  "covers",
] as const;
export type ChecklistColumn = (typeof CHECKLIST_COLUMNS)[number];

/** Every row names its entry; the other columns may be left out, and then leave those fields as they are. */
export const REQUIRED_COLUMNS = ["scientific_name", "vernacular_name"] as const satisfies readonly ChecklistColumn[];

/** What each column holds, for the import page and error messages. */
export const columnHelp: Record<ChecklistColumn, string> = {
  scientific_name: "The accepted scientific name; an entry already on the checklist is matched by it, in any letter case.",
  vernacular_name: "The name volunteers see first.",
  taxon_rank: "species, subspecies, species_aggregate, genus, family or other (empty means species).",
  tags: "Species tags by label or slug, separated by semicolons; a tag not yet on the checklist is created.",
  sensitive: "yes or no (true or false); empty means no. A sensitive species' positions are withheld.",
  active_months: "Usual months of activity as numbers: 4-9, 4;5;6, or 11-2 across the new year.",
  synonyms: "Other names of the entry, separated by semicolons.",
  covers: "For an aggregate only: the scientific names of the species it stands for (at least two), separated by semicolons.",
};

/** Header cells are matched without regard to case, and spaces or hyphens count as underscores. */
export function normaliseHeader(cell: string): string {
  return cell.trim().toLowerCase().replace(/[\s-]+/g, "_");
}

export function isChecklistColumn(name: string): name is ChecklistColumn {
  return (CHECKLIST_COLUMNS as readonly string[]).includes(name);
}
