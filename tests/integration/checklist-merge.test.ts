import { eq, inArray, sql } from "drizzle-orm";
import { beforeEach, describe, expect, it, vi } from "vitest";
import { db } from "@/db/client";
import { networkChanges, sightings, species, speciesAggregateMembers, speciesMerges, speciesSynonyms, speciesTagLinks, users } from "@/db/schema";
import { listChanges } from "@/lib/queries/change-log";
import { mergedSpeciesTargets } from "@/lib/queries/checklist";
import { resetToDemo } from "./support/db";

// Merging checklist entries as checklists handle a taxonomic lump or a misidentified name (common
// practice): one name survives, the other becomes its synonym, and every record follows.
const session = vi.hoisted(() => ({ userId: null as string | null }));
vi.mock("@/lib/auth/session", () => ({ sessionUserId: async () => session.userId }));
const { POST: mergeRoute } = await import("@/app/(network)/api/network/checklist/merge/route");

const noParams = { params: Promise.resolve({}) };
const merge = async (body: unknown) => {
  const res = await mergeRoute(new Request("http://localhost/api/network/checklist/merge", { method: "POST", headers: { "content-type": "application/json" }, body: JSON.stringify(body) }), noParams);
  return { status: res.status, json: (await res.json()) as { sightingsMoved?: number; error?: { code: string; fields?: Record<string, string[]> } } };
};

async function idOf(name: string) {
  const [row] = await db().select({ id: species.id }).from(species).where(eq(species.scientificName, name));
  return row!.id;
}
async function sightingsBySpecies(): Promise<Map<string, number>> {
  const rows = await db().select({ id: sightings.speciesId, n: sql<number>`count(*)::int` }).from(sightings).groupBy(sightings.speciesId);
  return new Map(rows.map((r) => [r.id, r.n]));
}
const total = (m: Map<string, number>) => [...m.values()].reduce((a, b) => a + b, 0);

describe("merging two checklist entries", () => {
  let keepId: string;
  let foldId: string;
  let aggregateId: string;

  beforeEach(async () => {
    await resetToDemo();
    const [u] = await db().select({ id: users.id }).from(users).where(eq(users.email, "organiser@harrowmere.example"));
    session.userId = u!.id;
    keepId = await idOf("Thymelicus sylvestris");
    foldId = await idOf("Thymelicus lineola");
    aggregateId = await idOf("Thymelicus sylvestris/lineola");
    // The demo's aggregate is given the two skippers it stands for, and the folded one a synonym of its own.
    await db().delete(speciesAggregateMembers).where(eq(speciesAggregateMembers.aggregateId, aggregateId));
    await db().insert(speciesAggregateMembers).values([{ aggregateId, memberId: keepId }, { aggregateId, memberId: foldId }]);
    await db().insert(speciesSynonyms).values({ speciesId: foldId, name: "Thymelicus lineolus" });
  });

  it("re-points every sighting, makes the old name a synonym, moves synonyms and tags, and keeps the aggregate whole", async () => {
    const before = await sightingsBySpecies();
    expect(before.get(foldId)).toBeGreaterThan(0);
    const foldSightings = await db().select({ id: sightings.id }).from(sightings).where(eq(sightings.speciesId, foldId));
    const res = await merge({ keepId, foldId });
    expect(res.status).toBe(200);
    expect(res.json.sightingsMoved).toBe(before.get(foldId));

    const after = await sightingsBySpecies();
    expect(after.get(foldId)).toBeUndefined();
    expect(after.get(keepId)).toBe(before.get(keepId)! + before.get(foldId)!);
    expect(total(after)).toBe(total(before));
    for (const [id, n] of before) if (id !== keepId && id !== foldId) expect(after.get(id)).toBe(n);
    const moved = await db().select({ speciesId: sightings.speciesId }).from(sightings).where(inArray(sightings.id, foldSightings.map((s) => s.id)));
    expect(new Set(moved.map((m) => m.speciesId))).toEqual(new Set([keepId]));

    expect(await db().select().from(species).where(eq(species.id, foldId))).toEqual([]);
    const synonyms = await db().select({ name: speciesSynonyms.name, speciesId: speciesSynonyms.speciesId }).from(speciesSynonyms).where(eq(speciesSynonyms.speciesId, keepId));
    expect(synonyms.map((s) => s.name).sort()).toEqual(["Thymelicus lineola", "Thymelicus lineolus"]);
    const members = await db().select({ memberId: speciesAggregateMembers.memberId }).from(speciesAggregateMembers).where(eq(speciesAggregateMembers.aggregateId, aggregateId));
    expect(members.map((m) => m.memberId)).toEqual([keepId]);
    expect((await db().select().from(speciesTagLinks).where(eq(speciesTagLinks.speciesId, keepId))).length).toBeGreaterThan(0);
    // A phone still holding the old id can be told where it went.
    expect(await mergedSpeciesTargets([foldId])).toEqual(new Map([[foldId, keepId]]));
  });

  it("is logged once on each name's history, with before and after", async () => {
    await merge({ keepId, foldId });
    const summaries = {
      [keepId]: /^Thymelicus sylvestris \(Small Skipper\) took in Thymelicus lineola \(Essex Skipper\) by a merge: \d+ sightings re-pointed; Thymelicus lineola is now its synonym$/,
      [foldId]: /^Thymelicus lineola \(Essex Skipper\) was merged into Thymelicus sylvestris \(Small Skipper\): \d+ sightings re-pointed; the name is now a synonym of Thymelicus sylvestris$/,
    };
    for (const id of [keepId, foldId]) {
      const { rows } = await listChanges({ entity: "species", entityId: id });
      expect(rows).toHaveLength(1);
      expect(rows[0]).toMatchObject({ action: "merge", summary: expect.stringMatching(summaries[id]!) });
      expect(rows[0]!.before).toMatchObject({ foldedIn: { scientificName: "Thymelicus lineola", synonyms: ["Thymelicus lineolus"] } });
      expect(rows[0]!.after).toMatchObject({ kept: { synonyms: ["Thymelicus lineola", "Thymelicus lineolus"] }, foldedIn: null });
    }
  });

  it("a later merge of the kept entry carries the first merge's id along", async () => {
    await merge({ keepId, foldId });
    const third = await idOf("Ochlodes sylvanus");
    await merge({ keepId: third, foldId: keepId });
    expect(await mergedSpeciesTargets([foldId, keepId])).toEqual(new Map([[foldId, third], [keepId, third]]));
  });

  it("refuses an entry into itself, an aggregate into one of its species, and an aggregate into a species; writes nothing", async () => {
    const counts = async () => ({
      species: (await db().select({ n: sql<number>`count(*)::int` }).from(species))[0]!.n,
      bySpecies: await sightingsBySpecies(),
      changes: (await db().select({ n: sql<number>`count(*)::int` }).from(networkChanges))[0]!.n,
      merges: (await db().select({ n: sql<number>`count(*)::int` }).from(speciesMerges))[0]!.n,
    });
    const before = await counts();
    expect(await merge({ keepId, foldId: keepId })).toEqual({ status: 400, json: { error: { code: "invalid", message: "Some fields need attention.", fields: { foldId: ["Choose two different entries: an entry cannot be merged into itself."] } } } });
    expect((await merge({ keepId, foldId: aggregateId })).json.error!.fields).toEqual({
      foldId: ["Thymelicus sylvestris/lineola is an aggregate that covers Thymelicus sylvestris: an aggregate cannot be merged into one of its species."],
    });
    expect((await merge({ keepId: await idOf("Aglais io"), foldId: aggregateId })).json.error!.fields).toEqual({
      foldId: ["Thymelicus sylvestris/lineola is an aggregate: it can only be merged into another aggregate."],
    });
    expect((await merge({ keepId, foldId: "00000000-0000-4000-8000-000000000000" })).status).toBe(404);
    expect((await merge({ keepId: "Thymelicus", foldId })).json.error!.fields).toEqual({ keepId: ["Choose the entry to keep."] });
    expect(await counts()).toEqual(before);
  });
});
