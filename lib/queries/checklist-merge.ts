import "server-only";
import { and, eq, inArray, ne, sql } from "drizzle-orm";
import { db } from "@/db/client";
import { sightings, species, speciesAggregateMembers, speciesMerges, speciesSynonyms, speciesTagLinks } from "@/db/schema";
import type { Actor } from "@/lib/auth/guard";
import { AGGREGATE_RANK } from "@/lib/checklist/ranks";
import { invalid, notFound } from "@/lib/errors";
import { logChanges } from "./change-log";
import { checklistEntry } from "./checklist";
import { lockChecklist } from "./checklist-lock";

export type MergeResult = { keptId: string; sightingsMoved: number };

const summaryOf = (e: Awaited<ReturnType<typeof checklistEntry>>) => ({
  scientificName: e.scientificName,
  vernacularName: e.vernacularName,
  taxonRank: e.taxonRank,
  synonyms: e.synonyms,
  tags: e.tags.map((t) => t.label),
  covers: e.covers.map((c) => c.scientificName),
  sightings: e.sightings,
});

/**
 * Folds one checklist entry into another (a taxonomic lump, or a name that was a misidentification),
 * in one transaction: every sighting is re-pointed, the folded name and its synonyms become synonyms
 * of the kept entry, its tags join the kept entry's, aggregates that covered it cover the kept entry,
 * and its id is remembered so a phone still holding it is re-pointed too. Logged on both entries'
 * history, so either name's history shows the merge.
 */
export async function mergeEntries(actor: Pick<Actor, "id">, input: { keepId: string; foldId: string }): Promise<MergeResult> {
  const { keepId, foldId } = input;
  if (keepId === foldId) throw invalid({ foldId: ["Choose two different entries: an entry cannot be merged into itself."] });
  return db().transaction(async (tx) => {
    await lockChecklist(tx);
    const rows = await tx.select({ id: species.id, rank: species.taxonRank, name: species.scientificName }).from(species).where(inArray(species.id, [keepId, foldId]));
    const keep = rows.find((r) => r.id === keepId);
    const fold = rows.find((r) => r.id === foldId);
    if (!keep) throw notFound("The entry to keep");
    if (!fold) throw notFound("The entry to fold in");
    const members = await tx.select({ aggregateId: speciesAggregateMembers.aggregateId, memberId: speciesAggregateMembers.memberId }).from(speciesAggregateMembers).where(inArray(speciesAggregateMembers.aggregateId, [keepId, foldId]));
    if (members.some((m) => m.aggregateId === foldId && m.memberId === keepId)) {
      throw invalid({ foldId: [`${fold.name} is an aggregate that covers ${keep.name}: an aggregate cannot be merged into one of its species.`] });
    }
    if (fold.rank === AGGREGATE_RANK && keep.rank !== AGGREGATE_RANK) {
      throw invalid({ foldId: [`${fold.name} is an aggregate: it can only be merged into another aggregate.`] });
    }
    // Read inside the lock, so the log's "before" is what the merge changed.
    const [keepBefore, foldBefore] = await Promise.all([checklistEntry(keepId, tx), checklistEntry(foldId, tx)]);

    const moved = await tx.update(sightings).set({ speciesId: keepId, updatedAt: new Date() }).where(eq(sightings.speciesId, foldId)).returning({ id: sightings.id });
    await tx.update(speciesSynonyms).set({ speciesId: keepId }).where(eq(speciesSynonyms.speciesId, foldId));
    await tx.insert(speciesSynonyms).values({ speciesId: keepId, name: fold.name });
    await tx.execute(sql`insert into ${speciesTagLinks} (species_id, tag_id) select ${keepId}, tag_id from ${speciesTagLinks} where species_id = ${foldId} on conflict do nothing`);
    // Aggregates that covered the folded entry cover the kept one (unless that is the aggregate itself).
    await tx.execute(sql`insert into ${speciesAggregateMembers} (aggregate_id, member_id)
      select aggregate_id, ${keepId} from ${speciesAggregateMembers} where member_id = ${foldId} and aggregate_id <> ${keepId} on conflict do nothing`);
    // Two aggregates merged: the kept one covers the species of both, never itself.
    await tx.execute(sql`insert into ${speciesAggregateMembers} (aggregate_id, member_id)
      select ${keepId}, member_id from ${speciesAggregateMembers} where aggregate_id = ${foldId} and member_id <> ${keepId} on conflict do nothing`);
    await tx.delete(speciesAggregateMembers).where(and(eq(speciesAggregateMembers.aggregateId, keepId), eq(speciesAggregateMembers.memberId, foldId)));
    await tx.update(speciesMerges).set({ intoSpeciesId: keepId }).where(eq(speciesMerges.intoSpeciesId, foldId));
    await tx.insert(speciesMerges).values({ fromSpeciesId: foldId, fromScientificName: fold.name, intoSpeciesId: keepId });
    await tx.delete(species).where(and(eq(species.id, foldId), ne(species.id, keepId)));

    const keepAfter = await checklistEntry(keepId, tx);
    // One row on each name's history, each worded from that entry's side.
    const sightingsMoved = `${moved.length} sighting${moved.length === 1 ? "" : "s"} re-pointed`;
    const keepName = `${keep.name} (${keepBefore.vernacularName})`;
    const foldName = `${fold.name} (${foldBefore.vernacularName})`;
    const before = { kept: summaryOf(keepBefore), foldedIn: summaryOf(foldBefore) };
    const after = { kept: summaryOf(keepAfter), foldedIn: null };
    await logChanges(tx, actor, [
      { entity: "species", entityId: keepId, action: "merge", summary: `${keepName} took in ${foldName} by a merge: ${sightingsMoved}; ${fold.name} is now its synonym`, before, after },
      { entity: "species", entityId: foldId, action: "merge", summary: `${foldName} was merged into ${keepName}: ${sightingsMoved}; the name is now a synonym of ${keep.name}`, before, after },
    ]);
    return { keptId: keepId, sightingsMoved: moved.length };
  });
}
