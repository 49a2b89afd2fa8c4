import "server-only";
import { randomUUID } from "node:crypto";
import { eq, inArray } from "drizzle-orm";
import type { Transaction } from "@/db/client";
import { networkSettings, species, speciesAggregateMembers, speciesSynonyms, speciesTagLinks, speciesTags } from "@/db/schema";
import type { Actor } from "@/lib/auth/guard";
import type { EntryField, EntryValues, ImportPlan, PlannedEntry } from "@/lib/checklist/plan";
import { findTag, slugify, type TagRef } from "@/lib/checklist/tags";
import { logChanges, type ChangeEntry } from "./change-log";
import type { LoadedSnapshot } from "./checklist-snapshot";

/** Where a plan came from, for the change log. */
export type PlanSource = { kind: "import"; fileName: string } | { kind: "edit" };

const CHUNK = 500;
const chunks = <T>(items: T[]) => Array.from({ length: Math.ceil(items.length / CHUNK) }, (_, i) => items.slice(i * CHUNK, (i + 1) * CHUNK));

const fieldLabel: Record<EntryField, string> = {
  scientificName: "scientific name",
  vernacularName: "vernacular name",
  taxonRank: "rank",
  sensitive: "sensitive",
  activeMonths: "months",
  tags: "tags",
  synonyms: "synonyms",
  covers: "covers",
};

const changed = (e: PlannedEntry, field: EntryField) => e.status === "new" || e.changes.some((c) => c.field === field);

/**
 * Writes a plan made by planChecklistImport inside the caller's transaction (which holds the
 * checklist lock and planned against the snapshot it passes): new tags, new entries, changed
 * fields, synonyms, tags and covered species, and a change-log row for each entry and tag.
 * Returns the ids of the entries by line.
 */
export async function applyPlan(tx: Transaction, actor: Pick<Actor, "id">, plan: ImportPlan, snapshot: LoadedSnapshot, source: PlanSource): Promise<Map<number, string>> {
  const from = source.kind === "import" ? ` (import of ${source.fileName})` : "";
  const log: ChangeEntry[] = [];

  const created: TagRef[] = plan.newTags.length
    ? await tx.insert(speciesTags).values(plan.newTags.map((label) => ({ label, slug: slugify(label) }))).returning({ id: speciesTags.id, slug: speciesTags.slug, label: speciesTags.label })
    : [];
  for (const tag of created) log.push({ entity: "species_tag", entityId: tag.id, action: "create", summary: `Created the species tag ${tag.label}${from}`, after: { label: tag.label, slug: tag.slug } });
  const allTags = [...snapshot.tags, ...created];
  const tagId = (label: string) => findTag(allTags, label)!.id;

  const idOfLine = new Map<number, string>();
  for (const e of plan.entries) idOfLine.set(e.line, e.id ?? randomUUID());
  // Covered species by their names after the import: the plan's own, then the rest of the checklist.
  const idOfName = new Map(snapshot.entries.map((e) => [e.scientificName.toLowerCase(), e.id]));
  const nameOfId = new Map(snapshot.entries.map((e) => [e.id, e.scientificName.toLowerCase()]));
  for (const e of plan.entries) if (e.id) idOfName.delete(nameOfId.get(e.id)!);
  for (const e of plan.entries) idOfName.set(e.values.scientificName.toLowerCase(), idOfLine.get(e.line)!);

  const added = plan.entries.filter((e) => e.status === "new");
  if (added.length) {
    const [settings] = await tx.select({ taxonGroup: networkSettings.taxonGroup }).from(networkSettings).limit(1);
    const nextOrder = snapshot.entries.reduce((max, e) => Math.max(max, e.sortOrder), -1) + 1;
    for (const part of chunks(added.map((e, i) => ({ e, order: nextOrder + i })))) {
      await tx.insert(species).values(
        part.map(({ e, order }) => ({
          id: idOfLine.get(e.line)!,
          scientificName: e.values.scientificName,
          vernacularName: e.values.vernacularName,
          taxonRank: e.values.taxonRank,
          taxonGroup: settings?.taxonGroup ?? "",
          sensitive: e.values.sensitive,
          activeMonths: e.values.activeMonths,
          sortOrder: order,
        })),
      );
    }
  }
  for (const e of plan.entries.filter((p) => p.status === "changed")) {
    const scalar = e.changes.filter((c) => ["scientificName", "vernacularName", "taxonRank", "sensitive", "activeMonths"].includes(c.field));
    if (scalar.length === 0) continue;
    await tx.update(species).set(Object.fromEntries(scalar.map((c) => [c.field, c.after])) as Partial<EntryValues>).where(eq(species.id, e.id!));
  }

  // Lists are replaced whole. Every delete goes first, so a synonym moving between two entries of
  // the same file never meets itself in the unique index.
  const replace = async <R>(field: EntryField, table: typeof speciesSynonyms | typeof speciesTagLinks | typeof speciesAggregateMembers, rowsOf: (e: PlannedEntry, id: string) => R[]) => {
    const touched = plan.entries.filter((e) => changed(e, field) && e.status !== "new").map((e) => e.id!);
    const column = table === speciesAggregateMembers ? speciesAggregateMembers.aggregateId : table === speciesSynonyms ? speciesSynonyms.speciesId : speciesTagLinks.speciesId;
    for (const part of chunks(touched)) await tx.delete(table).where(inArray(column, part));
    return plan.entries.filter((e) => changed(e, field)).flatMap((e) => rowsOf(e, idOfLine.get(e.line)!));
  };
  const synonymRows = await replace("synonyms", speciesSynonyms, (e, id) => e.values.synonyms.map((name) => ({ speciesId: id, name })));
  const tagRows = await replace("tags", speciesTagLinks, (e, id) => e.values.tags.map((label) => ({ speciesId: id, tagId: tagId(label) })));
  const memberRows = await replace("covers", speciesAggregateMembers, (e, id) => e.values.covers.map((name) => ({ aggregateId: id, memberId: idOfName.get(name.toLowerCase())! })));
  for (const part of chunks(synonymRows)) await tx.insert(speciesSynonyms).values(part);
  for (const part of chunks(tagRows)) await tx.insert(speciesTagLinks).values(part);
  for (const part of chunks(memberRows)) await tx.insert(speciesAggregateMembers).values(part);

  for (const e of plan.entries) {
    const id = idOfLine.get(e.line)!;
    if (e.status === "new") {
      log.push({ entity: "species", entityId: id, action: "create", summary: `Added ${e.values.scientificName} (${e.values.vernacularName}) to the checklist${from}`, after: e.values });
    } else if (e.status === "changed") {
      log.push({
        entity: "species",
        entityId: id,
        action: "update",
        summary: `Changed ${e.values.scientificName}: ${e.changes.map((c) => fieldLabel[c.field]).join(", ")}${from}`,
        before: Object.fromEntries(e.changes.map((c) => [c.field, c.before])),
        after: Object.fromEntries(e.changes.map((c) => [c.field, c.after])),
      });
    }
  }
  // A change-log row has seven parameters; PostgreSQL takes at most 65,535 in one statement.
  for (const part of chunks(log)) await logChanges(tx, actor, part);
  return idOfLine;
}
