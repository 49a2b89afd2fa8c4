// What importing a checklist file would do: every row read and checked against the checklist as
// it stands, and the result of applying the whole file checked as one (a name belongs to one
// entry; an aggregate covers species on the checklist). Pure: the server plans inside the import's
// transaction and writes exactly the plan it previewed.
import { readBoolean, readCovers, readMonths, readRank, readScientificName, readSynonyms, readTags, readVernacularName, type Cell } from "./cells";
import type { ChecklistColumn } from "./columns";
import { problem, sortProblems, type ImportProblem } from "./problems";
import { AGGREGATE_RANK, type TaxonRank } from "./ranks";
import type { CsvRow } from "./read-csv";
import { findTag, slugify, type TagRef } from "./tags";

/** An entry on the checklist as the plan needs it. */
export type SnapshotEntry = {
  id: string;
  scientificName: string;
  vernacularName: string;
  taxonRank: TaxonRank;
  sensitive: boolean;
  activeMonths: number[];
  tagIds: string[];
  synonyms: string[];
  /** For an aggregate: the entries it covers. */
  memberIds: string[];
};
export type ChecklistSnapshot = { entries: SnapshotEntry[]; tags: TagRef[] };

/** An entry's values as a person reads them: tags by label, covered species by scientific name. */
export type EntryValues = {
  scientificName: string;
  vernacularName: string;
  taxonRank: TaxonRank;
  sensitive: boolean;
  activeMonths: number[];
  tags: string[];
  synonyms: string[];
  covers: string[];
};
export type EntryField = keyof EntryValues;
export type FieldChange = { field: EntryField; before: EntryValues[EntryField]; after: EntryValues[EntryField] };

export type PlannedEntry = {
  line: number;
  /** The entry on the checklist this line changes; null for a new entry. */
  id: string | null;
  status: "new" | "changed" | "unchanged";
  values: EntryValues;
  changes: FieldChange[];
};
export type ImportPlan = {
  entries: PlannedEntry[];
  /** Tags the file names that are not on the checklist yet: the import creates them. */
  newTags: string[];
  counts: { added: number; changed: number; unchanged: number };
};
export type PlanResult = { ok: true; plan: ImportPlan } | { ok: false; problems: ImportProblem[] };

/** A file's row, or one entry's edit: `id` names the entry it changes (so its name can change too); without it a row is matched by scientific name. */
export type PlanRow = CsvRow & { id?: string };

const lower = (s: string) => s.toLowerCase();
const byText = (a: string, b: string) => (lower(a) < lower(b) ? -1 : lower(a) > lower(b) ? 1 : a < b ? -1 : a > b ? 1 : 0);
const sameSet = (a: readonly (string | number)[], b: readonly (string | number)[]) => a.length === b.length && a.every((x) => b.includes(x));

/** A line's entry while planning: covered species and tags by key (an entry's id, or "new:" and its name or slug). */
type Row = {
  line: number;
  existing: SnapshotEntry | null;
  key: string;
  values: Omit<EntryValues, "tags" | "covers">;
  tagKeys: string[];
  coversGiven: string[] | null;
  memberKeys: string[];
};

type Owner = { key: string; line: number | null; name: string; kind: "scientific" | "synonym" };

export function planChecklistImport(file: { columns: readonly ChecklistColumn[]; rows: readonly PlanRow[] }, snapshot: ChecklistSnapshot): PlanResult {
  const problems: ImportProblem[] = [];
  const entryByName = new Map(snapshot.entries.map((e) => [lower(e.scientificName), e]));
  const entryById = new Map(snapshot.entries.map((e) => [e.id, e]));
  const tagById = new Map(snapshot.tags.map((t) => [t.id, t]));
  const newTags = new Map<string, string>(); // slug → label as first written
  const lineOfName = new Map<string, number>();
  const rows: Row[] = [];

  for (const { line, cells, id } of file.rows) {
    const take = <T>(column: ChecklistColumn, read: (cell: string) => Cell<T>): T | undefined => {
      const cell = cells[column];
      if (cell === undefined) return undefined;
      const result = read(cell);
      if ("error" in result) {
        problems.push(problem(line, column, result.error));
        return undefined;
      }
      return result.value;
    };
    const name = take("scientific_name", readScientificName);
    if (name === undefined) continue;
    const earlier = lineOfName.get(lower(name));
    if (earlier !== undefined) {
      problems.push(problem(line, "scientific_name", `"${name}" is already on line ${earlier}; each entry can appear once.`));
      continue;
    }
    lineOfName.set(lower(name), line);
    const existing = (id === undefined ? entryByName.get(lower(name)) : entryById.get(id)) ?? null;
    const values: Row["values"] = existing
      ? { scientificName: name, vernacularName: existing.vernacularName, taxonRank: existing.taxonRank, sensitive: existing.sensitive, activeMonths: existing.activeMonths, synonyms: existing.synonyms }
      : { scientificName: name, vernacularName: "", taxonRank: "species", sensitive: false, activeMonths: [], synonyms: [] };
    const vernacular = take("vernacular_name", readVernacularName);
    if (vernacular !== undefined) values.vernacularName = vernacular;
    const rank = take("taxon_rank", readRank);
    if (rank !== undefined) values.taxonRank = rank;
    const sensitive = take("sensitive", readBoolean);
    if (sensitive !== undefined) values.sensitive = sensitive;
    const months = take("active_months", readMonths);
    if (months !== undefined) values.activeMonths = months;
    const synonyms = take("synonyms", readSynonyms);
    if (synonyms !== undefined) {
      values.synonyms = synonyms;
      if (synonyms.some((s) => lower(s) === lower(name))) problems.push(problem(line, "synonyms", "A synonym cannot be the entry's own scientific name."));
    }
    let tagKeys = existing?.tagIds ?? [];
    const tags = take("tags", readTags);
    if (tags !== undefined) {
      tagKeys = [
        ...new Set(
          tags.map((tag) => {
            const found = findTag(snapshot.tags, tag);
            if (found) return found.id;
            const slug = slugify(tag);
            if (!newTags.has(slug)) newTags.set(slug, tag);
            return `new:${slug}`;
          }),
        ),
      ];
    }
    const coversGiven = take("covers", readCovers) ?? null;
    rows.push({ line, existing, key: existing?.id ?? `new:${lower(name)}`, values, tagKeys, coversGiven, memberKeys: [] });
  }

  // The checklist after the import: entries the file leaves alone, then the file's.
  const inFile = new Set(rows.map((r) => r.key));
  const untouched = snapshot.entries.filter((e) => !inFile.has(e.id));
  const owners = new Map<string, Owner>();
  const where = (o: Owner) => (o.line === null ? `${o.name} on the checklist` : `${o.name} on line ${o.line}`);
  for (const e of untouched) {
    owners.set(lower(e.scientificName), { key: e.id, line: null, name: e.scientificName, kind: "scientific" });
    for (const s of e.synonyms) owners.set(lower(s), { key: e.id, line: null, name: e.scientificName, kind: "synonym" });
  }
  for (const r of rows) {
    const claim = (name: string, kind: Owner["kind"]) => {
      const other = owners.get(lower(name));
      if (other && other.key !== r.key) {
        if (kind === "scientific" && other.kind === "scientific") {
          problems.push(problem(r.line, "scientific_name", `"${name}" is already on the checklist as another entry (${other.name}).`));
        } else if (kind === "scientific") {
          problems.push(problem(r.line, "scientific_name", `"${name}" is a synonym of ${where(other)}. Merge the two entries, or remove the synonym first.`));
        } else if (other.kind === "scientific") {
          problems.push(problem(r.line, "synonyms", `"${name}" is the scientific name of another entry (${where(other)}); a name belongs to one entry only.`));
        } else {
          problems.push(problem(r.line, "synonyms", `"${name}" is already a synonym of ${where(other)}; a name belongs to one entry only.`));
        }
        return;
      }
      if (!other) owners.set(lower(name), { key: r.key, line: r.line, name: r.values.scientificName, kind });
    };
    claim(r.values.scientificName, "scientific");
    for (const s of r.values.synonyms) claim(s, "synonym");
  }

  // Aggregates and the species they cover, by key.
  const finalByName = new Map<string, { key: string; rank: TaxonRank; name: string }>();
  for (const e of untouched) finalByName.set(lower(e.scientificName), { key: e.id, rank: e.taxonRank, name: e.scientificName });
  for (const r of rows) finalByName.set(lower(r.values.scientificName), { key: r.key, rank: r.values.taxonRank, name: r.values.scientificName });
  const nameOf = new Map([...finalByName.values()].map((f) => [f.key, f.name]));
  for (const r of rows) {
    if (r.values.taxonRank !== AGGREGATE_RANK) {
      if (r.coversGiven?.length) problems.push(problem(r.line, "covers", "Only an aggregate (taxon_rank species_aggregate) covers other species."));
      continue;
    }
    if (r.coversGiven === null) {
      r.memberKeys = r.existing?.memberIds ?? [];
      continue;
    }
    const keys: string[] = [];
    for (const name of r.coversGiven) {
      const target = finalByName.get(lower(name));
      const owner = owners.get(lower(name));
      if (!target) {
        problems.push(
          problem(r.line, "covers", owner ? `"${name}" is a synonym of ${where(owner)}: name the species by its scientific name.` : `"${name}" is not on the checklist or in this file.`),
        );
      } else if (target.key === r.key) problems.push(problem(r.line, "covers", "An aggregate cannot cover itself."));
      else if (target.rank === AGGREGATE_RANK) problems.push(problem(r.line, "covers", `"${name}" is itself an aggregate; an aggregate covers species only.`));
      else keys.push(target.key);
    }
    if (keys.length === r.coversGiven.length && keys.length < 2) problems.push(problem(r.line, "covers", "An aggregate covers at least two species, separated by semicolons."));
    r.memberKeys = keys;
  }
  // A line that turns an entry into an aggregate while an aggregate the file leaves alone covers it.
  const rowByKey = new Map(rows.map((r) => [r.key, r]));
  for (const e of untouched) {
    for (const memberId of e.memberIds) {
      const member = rowByKey.get(memberId);
      if (member && member.values.taxonRank === AGGREGATE_RANK) {
        problems.push(problem(member.line, "taxon_rank", `${e.scientificName} covers this entry, so it cannot become an aggregate itself.`));
      }
    }
  }
  if (problems.length) return { ok: false, problems: sortProblems(problems) };

  const tagLabel = (key: string) => (key.startsWith("new:") ? newTags.get(key.slice(4))! : tagById.get(key)!.label);
  const usedNewTags = new Set<string>();
  const entries = rows.map((r): PlannedEntry => {
    r.tagKeys.filter((k) => k.startsWith("new:")).forEach((k) => usedNewTags.add(k));
    const values: EntryValues = {
      ...r.values,
      activeMonths: [...r.values.activeMonths].sort((a, b) => a - b),
      synonyms: [...r.values.synonyms].sort(byText),
      tags: r.tagKeys.map(tagLabel).sort(byText),
      covers: r.memberKeys.map((k) => nameOf.get(k)!).sort(byText),
    };
    if (!r.existing) return { line: r.line, id: null, status: "new", values, changes: [] };
    const e = r.existing;
    const before: EntryValues = {
      scientificName: e.scientificName,
      vernacularName: e.vernacularName,
      taxonRank: e.taxonRank,
      sensitive: e.sensitive,
      activeMonths: [...e.activeMonths].sort((a, b) => a - b),
      synonyms: [...e.synonyms].sort(byText),
      tags: e.tagIds.map(tagLabel).sort(byText),
      covers: e.memberIds.map((id) => entryById.get(id)?.scientificName ?? id).sort(byText),
    };
    // Lists compare as sets (of keys, so a covered species renamed in the same file is no change here).
    const differs: Record<EntryField, boolean> = {
      scientificName: before.scientificName !== values.scientificName,
      vernacularName: before.vernacularName !== values.vernacularName,
      taxonRank: before.taxonRank !== values.taxonRank,
      sensitive: before.sensitive !== values.sensitive,
      activeMonths: !sameSet(before.activeMonths, values.activeMonths),
      synonyms: before.synonyms.join("\n") !== values.synonyms.join("\n"),
      tags: !sameSet(e.tagIds, r.tagKeys),
      covers: !sameSet(e.memberIds, r.memberKeys),
    };
    const changes = (Object.keys(differs) as EntryField[]).filter((f) => differs[f]).map((field) => ({ field, before: before[field], after: values[field] }));
    return { line: r.line, id: e.id, status: changes.length ? "changed" : "unchanged", values, changes };
  });
  const count = (status: PlannedEntry["status"]) => entries.filter((e) => e.status === status).length;
  return {
    ok: true,
    plan: {
      entries,
      newTags: [...usedNewTags].map(tagLabel).sort(byText),
      counts: { added: count("new"), changed: count("changed"), unchanged: count("unchanged") },
    },
  };
}
