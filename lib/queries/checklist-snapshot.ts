import "server-only";
import { asc, sql } from "drizzle-orm";
import type { Database, Transaction } from "@/db/client";
import { species, speciesTags } from "@/db/schema";
import type { ChecklistSnapshot, SnapshotEntry } from "@/lib/checklist/plan";

/**
 * The outer entry's id inside a subquery. Drizzle writes a single table's columns without the
 * table's name ("id"), which inside a subquery on another table with an id column means that
 * table's id.
 */
export const entryId = sql`${species}."id"`;

export type LoadedSnapshot = { entries: (SnapshotEntry & { sortOrder: number })[]; tags: ChecklistSnapshot["tags"] };

/** The whole checklist as the import planner reads it (lib/checklist/plan.ts). */
export async function loadSnapshot(tx: Database | Transaction): Promise<LoadedSnapshot> {
  const [entries, tags] = await Promise.all([
    tx
      .select({
        id: species.id,
        scientificName: species.scientificName,
        vernacularName: species.vernacularName,
        taxonRank: species.taxonRank,
        sensitive: species.sensitive,
        activeMonths: species.activeMonths,
        sortOrder: species.sortOrder,
        tagIds: sql<string[]>`coalesce((select array_agg(l.tag_id::text order by l.tag_id) from species_tag_links l where l.species_id = ${entryId}), '{}')`,
        synonyms: sql<string[]>`coalesce((select array_agg(y.name order by y.name) from species_synonyms y where y.species_id = ${entryId}), '{}')`,
        memberIds: sql<string[]>`coalesce((select array_agg(m.member_id::text order by m.member_id) from species_aggregate_members m where m.aggregate_id = ${entryId}), '{}')`,
      })
      .from(species)
      .orderBy(asc(species.sortOrder), asc(species.scientificName)),
    tx.select({ id: speciesTags.id, slug: speciesTags.slug, label: speciesTags.label }).from(speciesTags).orderBy(asc(speciesTags.label)),
  ]);
  return { entries, tags };
}
