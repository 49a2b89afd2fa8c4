import "server-only";
import { asc, eq, inArray, sql } from "drizzle-orm";
import { db, type Database, type Transaction } from "@/db/client";
import { species, speciesAggregateMembers, speciesMerges, speciesSynonyms } from "@/db/schema";
import type { Actor } from "@/lib/auth/guard";
import { CHECKLIST_COLUMNS, type ChecklistColumn } from "@/lib/checklist/columns";
import { planChecklistImport, type SnapshotEntry } from "@/lib/checklist/plan";
import type { TaxonRank } from "@/lib/checklist/ranks";
import { invalid, notFound } from "@/lib/errors";
import { applyPlan } from "./checklist-apply";
import { lockChecklist } from "./checklist-lock";
import { entryId, loadSnapshot } from "./checklist-snapshot";

export type ChecklistRow = {
  id: string;
  scientificName: string;
  vernacularName: string;
  taxonRank: TaxonRank;
  sensitive: boolean;
  activeMonths: number[];
  tags: { id: string; label: string }[];
  synonyms: string[];
  covers: { id: string; scientificName: string }[];
  coveredBy: { id: string; scientificName: string }[];
  sightings: number;
};

const entryColumns = {
  id: species.id,
  scientificName: species.scientificName,
  vernacularName: species.vernacularName,
  taxonRank: species.taxonRank,
  sensitive: species.sensitive,
  activeMonths: species.activeMonths,
  tags: sql<ChecklistRow["tags"]>`coalesce((select json_agg(json_build_object('id', t.id, 'label', t.label) order by lower(t.label)) from species_tag_links l join species_tags t on t.id = l.tag_id where l.species_id = ${entryId}), '[]'::json)`,
  synonyms: sql<string[]>`coalesce((select array_agg(y.name order by lower(y.name)) from species_synonyms y where y.species_id = ${entryId}), '{}')`,
  covers: sql<ChecklistRow["covers"]>`coalesce((select json_agg(json_build_object('id', c.id, 'scientificName', c.scientific_name) order by lower(c.scientific_name)) from species_aggregate_members m join species c on c.id = m.member_id where m.aggregate_id = ${entryId}), '[]'::json)`,
  coveredBy: sql<ChecklistRow["coveredBy"]>`coalesce((select json_agg(json_build_object('id', a.id, 'scientificName', a.scientific_name) order by lower(a.scientific_name)) from species_aggregate_members m join species a on a.id = m.aggregate_id where m.member_id = ${entryId}), '[]'::json)`,
};

/** Every entry with its tags, synonyms, aggregates and how many sightings name it, in checklist order. */
export async function listChecklist(): Promise<ChecklistRow[]> {
  const counts = db()
    .select({ speciesId: sql<string>`species_id`.as("species_id"), n: sql<number>`count(*)::int`.as("n") })
    .from(sql`sightings`)
    .groupBy(sql`species_id`)
    .as("counts");
  return db()
    .select({ ...entryColumns, sightings: sql<number>`coalesce(${counts.n}, 0)`.mapWith(Number) })
    .from(species)
    .leftJoin(counts, eq(counts.speciesId, species.id))
    .orderBy(asc(species.sortOrder), asc(species.scientificName));
}

export async function checklistEntry(id: string, tx: Database | Transaction = db()): Promise<ChecklistRow> {
  const [row] = await tx
    .select({ ...entryColumns, sightings: sql<number>`(select count(*) from sightings s where s.species_id = ${entryId})`.mapWith(Number) })
    .from(species)
    .where(eq(species.id, id))
    .limit(1);
  if (!row) throw notFound("That checklist entry");
  return row;
}

/** The species each aggregate stands for (aggregate id → member ids); all aggregates when no ids are given. */
export async function aggregateMembers(aggregateIds?: readonly string[], tx: Database | Transaction = db()): Promise<Map<string, string[]>> {
  const rows = await tx
    .select({ aggregateId: speciesAggregateMembers.aggregateId, memberId: speciesAggregateMembers.memberId })
    .from(speciesAggregateMembers)
    .where(aggregateIds ? inArray(speciesAggregateMembers.aggregateId, [...aggregateIds]) : sql`true`);
  const out = new Map<string, string[]>();
  for (const r of rows) out.set(r.aggregateId, [...(out.get(r.aggregateId) ?? []), r.memberId]);
  return out;
}

/**
 * Every name on the checklist, in lower case, to the entry it names: scientific names and
 * synonyms (for imports that name species either way). Names are unique across both.
 */
export async function speciesNameIndex(tx: Database | Transaction = db()): Promise<Map<string, { id: string; scientificName: string; synonym: boolean }>> {
  const [entries, synonyms] = await Promise.all([
    tx.select({ id: species.id, name: species.scientificName }).from(species),
    tx.select({ id: speciesSynonyms.speciesId, name: speciesSynonyms.name, scientificName: species.scientificName }).from(speciesSynonyms).innerJoin(species, eq(species.id, speciesSynonyms.speciesId)),
  ]);
  const out = new Map<string, { id: string; scientificName: string; synonym: boolean }>();
  for (const e of entries) out.set(e.name.toLowerCase(), { id: e.id, scientificName: e.name, synonym: false });
  for (const s of synonyms) out.set(s.name.toLowerCase(), { id: s.id, scientificName: s.scientificName, synonym: true });
  return out;
}

/** For ids of entries that were merged away (an old phone's sighting): the entry each was folded into. */
export async function mergedSpeciesTargets(ids: readonly string[], tx: Database | Transaction = db()): Promise<Map<string, string>> {
  if (ids.length === 0) return new Map();
  const rows = await tx.select({ from: speciesMerges.fromSpeciesId, into: speciesMerges.intoSpeciesId }).from(speciesMerges).where(inArray(speciesMerges.fromSpeciesId, [...ids]));
  return new Map(rows.map((r) => [r.from, r.into]));
}

/** An edit of one entry: its values, with the species it covers by scientific name. */
export type EntryInput = Omit<SnapshotEntry, "id" | "memberIds"> & { covers: string[] };

/** The edit form's field for each of the planner's columns. */
const fieldOf: Record<ChecklistColumn, keyof EntryInput> = {
  scientific_name: "scientificName",
  vernacular_name: "vernacularName",
  taxon_rank: "taxonRank",
  tags: "tagIds",
  sensitive: "sensitive",
  active_months: "activeMonths",
  synonyms: "synonyms",
  covers: "covers",
};

/**
 * Edits one entry in one transaction, checked by the same rules as an import (the planner reads
 * the edit as one line naming the entry by id), and logs the fields it changed, before and after.
 */
export async function updateEntry(actor: Pick<Actor, "id">, id: string, input: EntryInput): Promise<{ changed: boolean }> {
  return db().transaction(async (tx) => {
    await lockChecklist(tx);
    const snapshot = await loadSnapshot(tx);
    if (!snapshot.entries.some((e) => e.id === id)) throw notFound("That checklist entry");
    const tagById = new Map(snapshot.tags.map((t) => [t.id, t.label]));
    const nameById = new Map(snapshot.entries.map((e) => [e.id, e.scientificName]));
    const unknownTag = input.tagIds.some((t) => !tagById.has(t));
    const unknownCover = input.covers.some((c) => !nameById.has(c));
    if (unknownTag || unknownCover) {
      throw invalid({ ...(unknownTag ? { tagIds: ["A chosen tag is no longer on the checklist."] } : {}), ...(unknownCover ? { covers: ["A chosen species is no longer on the checklist."] } : {}) });
    }
    const cells: Record<ChecklistColumn, string> = {
      scientific_name: input.scientificName,
      vernacular_name: input.vernacularName,
      taxon_rank: input.taxonRank,
      tags: input.tagIds.map((t) => tagById.get(t)!).join(";"),
      sensitive: input.sensitive ? "yes" : "no",
      active_months: input.activeMonths.join(";"),
      synonyms: input.synonyms.join(";"),
      covers: input.covers.map((c) => nameById.get(c)!).join(";"),
    };
    const planned = planChecklistImport({ columns: CHECKLIST_COLUMNS, rows: [{ line: 1, id, cells }] }, snapshot);
    if (!planned.ok) {
      const fields: Record<string, string[]> = {};
      for (const p of planned.problems) (fields[p.column ? fieldOf[p.column as ChecklistColumn] : "_"] ??= []).push(p.reason);
      throw invalid(fields);
    }
    if (planned.plan.entries[0]!.status === "unchanged") return { changed: false };
    await applyPlan(tx, actor, planned.plan, snapshot, { kind: "edit" });
    return { changed: true };
  });
}
