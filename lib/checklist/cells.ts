// One cell of a checklist file, read into its value or a reason it cannot be read.
import { MAX_LIST_ITEMS, MAX_NAME_LENGTH, MAX_TAG_LENGTH, MAX_VERNACULAR_LENGTH } from "./limits";
import { parseMonths } from "./months";
import { TAXON_RANKS, isTaxonRank, type TaxonRank } from "./ranks";
import { slugify } from "./tags";

export type Cell<T> = { value: T } | { error: string };

/** Spaces and tabs inside a name become one space; a line break is a mistake (often a stray quote). */
export function readName(cell: string, what: string, max: number): Cell<string> {
  if (/\n/.test(cell.trim())) return { error: `The ${what} must be on one line.` };
  const name = cell.trim().replace(/\s+/g, " ");
  if (name === "") return { error: `Enter the ${what}.` };
  if (name.length > max) return { error: `The ${what} can be at most ${max} characters.` };
  return { value: name };
}

/** Scientific names are listed with semicolons (synonyms, covered species), so they cannot hold one. */
export function readScientificName(cell: string): Cell<string> {
  const name = readName(cell, "scientific name", MAX_NAME_LENGTH);
  return "value" in name && name.value.includes(";") ? { error: "The scientific name cannot contain a semicolon (it separates names in lists)." } : name;
}
export const readVernacularName = (cell: string) => readName(cell, "vernacular name", MAX_VERNACULAR_LENGTH);

export function readRank(cell: string): Cell<TaxonRank> {
  const rank = cell.trim().toLowerCase().replace(/[\s-]+/g, "_");
  if (rank === "") return { value: "species" };
  return isTaxonRank(rank) ? { value: rank } : { error: `"${cell.trim()}" is not a taxon rank. Use one of: ${TAXON_RANKS.join(", ")}.` };
}

const TRUE = new Set(["yes", "true"]);
const FALSE = new Set(["no", "false", ""]);

export function readBoolean(cell: string): Cell<boolean> {
  const word = cell.trim().toLowerCase();
  if (TRUE.has(word)) return { value: true };
  if (FALSE.has(word)) return { value: false };
  return { error: `"${cell.trim()}" is not yes or no (true or false).` };
}

export function readMonths(cell: string): Cell<number[]> {
  const result = parseMonths(cell);
  return "error" in result ? result : { value: result.months };
}

/** A semicolon-separated list; blanks are dropped and repeats (in any letter case) kept once. */
function readList(cell: string, what: string, max: number): Cell<string[]> {
  const seen = new Set<string>();
  const items: string[] = [];
  for (const raw of cell.split(";")) {
    if (raw.trim() === "") continue;
    const item = readName(raw, what, max);
    if ("error" in item) return item;
    if (seen.has(item.value.toLowerCase())) continue;
    seen.add(item.value.toLowerCase());
    items.push(item.value);
  }
  if (items.length > MAX_LIST_ITEMS) return { error: `At most ${MAX_LIST_ITEMS} names, separated by semicolons.` };
  return { value: items };
}

export const readSynonyms = (cell: string) => readList(cell, "synonym", MAX_NAME_LENGTH);
export const readCovers = (cell: string) => readList(cell, "covered species' name", MAX_NAME_LENGTH);

export function readTags(cell: string): Cell<string[]> {
  const list = readList(cell, "tag", MAX_TAG_LENGTH);
  if ("error" in list) return list;
  const nameless = list.value.find((tag) => slugify(tag) === "");
  return nameless === undefined ? list : { error: `The tag "${nameless}" needs at least one letter or digit.` };
}
