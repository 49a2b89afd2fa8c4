import { randomUUID } from "node:crypto";
import { and, asc, count, eq, inArray, ne } from "drizzle-orm";
import { beforeEach, describe, expect, it } from "vitest";
import { db } from "@/db/client";
import { seasons, sightings, species, transectAssignments, transects, users, visits } from "@/db/schema";
import type { Actor } from "@/lib/auth/guard";
import { applySyncBatch } from "@/lib/sync/apply-batch";
import { inBatchTransaction, type BatchTx } from "@/lib/sync/batch-transaction";
import { BatchRaced, deletePendingSightings, upsertSightings, upsertVisits } from "@/lib/sync/write";
import { resetToDemo } from "./support/db";

async function actorFor(email: string): Promise<Actor> {
  const [u] = await db().select().from(users).where(eq(users.email, email));
  return { id: u!.id, roles: u!.roles, name: u!.name, email: u!.email };
}

// A walk's date must lie in an open or in-grace season: the demo's open season contains the day
// it was seeded, so its first day is never in the future.
let walkDay = "";

function visitOf(transectId: string, over: Record<string, unknown> = {}) {
  return {
    id: randomUUID(),
    transectId,
    visitDate: walkDay,
    startTime: "10:30",
    endTime: "11:45",
    temperatureC: 17.5,
    windBeaufort: 2,
    cloudCoverPercent: 40,
    sky: "broken_cloud",
    completeList: true,
    notes: "Sheltered on the lower slope.",
    clientUpdatedAt: "2026-05-14T11:50:00.000Z",
    ...over,
  };
}

function sightingOf(visitId: string, speciesId: string, over: Record<string, unknown> = {}) {
  return {
    id: randomUUID(),
    visitId,
    speciesId,
    count: 3,
    section: 1,
    latitude: 51.2,
    longitude: -1.3,
    accuracyMetres: 8,
    note: null,
    clientUpdatedAt: "2026-05-14T11:00:00.000Z",
    ...over,
  };
}

/** The writes run as the sync route runs them: in a batch transaction, after its BEGIN, with the COMMIT queued behind them. */
function inBatch(work: (tx: BatchTx) => Promise<unknown>): Promise<void> {
  return inBatchTransaction(async (tx, begun) => {
    await begun;
    return { value: undefined, written: work(tx) };
  });
}

async function rowCounts() {
  const [v] = await db().select({ n: count() }).from(visits);
  const [s] = await db().select({ n: count() }).from(sightings);
  return { visits: v!.n, sightings: s!.n };
}

async function storedSighting(id: string) {
  const [row] = await db().select().from(sightings).where(eq(sightings.id, id));
  return row;
}

describe("applying a sync batch from a volunteer's phone", () => {
  let actor: Actor;
  let transect: { id: string; sectionCount: number };
  let theirTransectId: string;
  let theirVisitId: string;
  let speciesIds: string[];

  beforeEach(async () => {
    await resetToDemo();
    const [open] = await db().select({ startsOn: seasons.startsOn }).from(seasons).where(eq(seasons.status, "open"));
    walkDay = open!.startsOn;
    actor = await actorFor("volunteer01@harrowmere.example");
    const mine = await db()
      .select({ id: transects.id, sectionCount: transects.sectionCount })
      .from(transectAssignments)
      .innerJoin(transects, eq(transects.id, transectAssignments.transectId))
      .where(eq(transectAssignments.userId, actor.id))
      .orderBy(asc(transects.code));
    transect = mine[0]!;
    const [other] = await db().select().from(transectAssignments).where(ne(transectAssignments.userId, actor.id)).limit(1);
    theirTransectId = other!.transectId;
    const [theirVisit] = await db().select({ id: visits.id }).from(visits).where(eq(visits.volunteerId, other!.userId)).limit(1);
    theirVisitId = theirVisit!.id;
    speciesIds = (await db().select({ id: species.id }).from(species).orderBy(asc(species.sortOrder)).limit(3)).map((s) => s.id);
  });

  it("stores a new visit with its sightings and derives the season from the visit date; a date in no season is refused", async () => {
    const inSeason = visitOf(transect.id);
    const outOfSeason = visitOf(transect.id, { visitDate: "1990-12-01" });
    const batch = {
      visits: [inSeason, outOfSeason],
      sightings: [sightingOf(inSeason.id, speciesIds[0]!), sightingOf(inSeason.id, speciesIds[1]!, { section: transect.sectionCount, count: 0 })],
    };
    const { status, response } = await applySyncBatch(actor, batch);
    // Before seasons had phases, a walk outside every season was stored without one; now it is refused.
    expect(status).toBe(400);
    expect(response.results.map((r) => [r.kind, r.index, r.status])).toEqual([
      ["visit", 0, "created"],
      ["visit", 1, "invalid"],
      ["sighting", 0, "created"],
      ["sighting", 1, "created"],
    ]);
    expect(response.results[1]!.errors?.visitDate?.[0]).toMatch(/No season covers this date/);
    expect(Date.parse(response.serverTime)).not.toBeNaN();

    const [openSeason] = await db().select().from(seasons).where(eq(seasons.status, "open"));
    const stored = await db().select().from(visits).where(inArray(visits.id, [inSeason.id, outOfSeason.id]));
    const byId = new Map(stored.map((v) => [v.id, v]));
    expect(byId.get(inSeason.id)).toMatchObject({ seasonId: openSeason!.id, volunteerId: actor.id, startTime: "10:30:00", notes: "Sheltered on the lower slope." });
    expect(byId.has(outOfSeason.id)).toBe(false);
    expect(await storedSighting(batch.sightings[1]!.id)).toMatchObject({ count: 0, section: transect.sectionCount, status: "pending" });
  });

  it("a resent batch creates no duplicates and reports every item unchanged", async () => {
    const visit = visitOf(transect.id);
    const batch = { visits: [visit], sightings: speciesIds.map((sp) => sightingOf(visit.id, sp)) };
    await applySyncBatch(actor, batch);
    const before = await rowCounts();
    const again = await applySyncBatch(actor, structuredClone(batch));
    expect(again.status).toBe(200);
    expect(again.response.results.map((r) => r.status)).toEqual(["unchanged", "unchanged", "unchanged", "unchanged"]);
    expect(await rowCounts()).toEqual(before);
  });

  it("two copies of a batch arriving at once still land exactly once", async () => {
    const visit = visitOf(transect.id);
    const batch = { visits: [visit], sightings: speciesIds.map((sp) => sightingOf(visit.id, sp)) };
    const before = await rowCounts();
    const outcomes = await Promise.all([applySyncBatch(actor, batch), applySyncBatch(actor, structuredClone(batch))]);
    for (const o of outcomes) expect(o.status).toBe(200);
    expect(await rowCounts()).toEqual({ visits: before.visits + 1, sightings: before.sightings + 3 });
  });

  it("refuses a visit on a transect the volunteer is not assigned to with 403 and writes nothing for it", async () => {
    const before = await rowCounts();
    const visit = visitOf(theirTransectId);
    const { status, response } = await applySyncBatch(actor, { visits: [visit], sightings: [sightingOf(visit.id, speciesIds[0]!)] });
    expect(status).toBe(403);
    expect(response.results).toEqual([
      { kind: "visit", id: visit.id, index: 0, status: "forbidden", reason: "You are not assigned to that transect." },
      { kind: "sighting", id: expect.any(String), index: 0, status: "forbidden", reason: "You are not assigned to that transect." },
    ]);
    expect(await rowCounts()).toEqual(before);
  });

  it("answers malformed items with per-field messages (400) while storing the good ones", async () => {
    const good = visitOf(transect.id);
    const bad = visitOf(transect.id, { windBeaufort: 15, sky: "purple" });
    const goodSighting = sightingOf(good.id, speciesIds[0]!);
    const batch = {
      visits: [bad, good],
      sightings: [sightingOf(good.id, speciesIds[1]!, { count: -2 }), goodSighting, { nonsense: true }, sightingOf(bad.id, speciesIds[2]!)],
    };
    const { status, response } = await applySyncBatch(actor, batch);
    expect(status).toBe(400);
    const [badVisit, goodVisit, negative, storedOne, junk, orphan] = response.results;
    expect(badVisit).toMatchObject({ kind: "visit", index: 0, id: bad.id, status: "invalid" });
    expect(badVisit!.errors).toEqual({ windBeaufort: ["Beaufort force runs from 0 to 12."], sky: [expect.any(String)] });
    expect(goodVisit).toMatchObject({ index: 1, status: "created" });
    expect(negative).toMatchObject({ index: 0, status: "invalid", errors: { count: ["Count cannot be negative."] } });
    expect(storedOne).toMatchObject({ index: 1, id: goodSighting.id, status: "created" });
    expect(junk).toMatchObject({ index: 2, id: null, status: "invalid" });
    expect(Object.keys(junk!.errors!)).toEqual(expect.arrayContaining(["id", "visitId", "speciesId", "count", "clientUpdatedAt"]));
    expect(orphan).toMatchObject({ index: 3, status: "invalid", reason: "Turnstone does not have this sighting's walk.", errors: { visitId: [expect.any(String)] } });

    const [stored] = await db().select().from(visits).where(eq(visits.id, good.id));
    expect(stored).toBeDefined();
    expect(await storedSighting(goodSighting.id)).toBeDefined();
    expect(await db().select().from(visits).where(eq(visits.id, bad.id))).toHaveLength(0);
  });

  it("PostgreSQL itself refuses NUL, unpaired surrogates and year 0000 in the batch write, which is why the contract refuses them first", async () => {
    const visit = visitOf(transect.id);
    const row = { id: visit.id, transectId: transect.id, volunteerId: actor.id, seasonId: null, visitDate: "2026-05-14", startTime: "10:30:00", completeList: false, notes: null, clientUpdatedAt: new Date("2026-05-14T11:50:00Z") };
    const writeOne = (over: Record<string, unknown>) => inBatch((tx) => upsertVisits(tx, [{ ...row, ...over }]));
    // PostgreSQL manual, 8.3 Character Types: "the character with code zero (sometimes called NUL) cannot be stored";
    // 8.14 JSON Types: \u0000 and unpaired surrogate escapes cannot be turned into text.
    await expect(writeOne({ notes: "locked\u0000" })).rejects.toThrow();
    await expect(writeOne({ coRecorders: "half \uD83E" })).rejects.toThrow();
    // PostgreSQL manual, 8.5 Date/Time Types: there is no year 0 (1 BC precedes AD 1).
    await expect(writeOne({ visitDate: "0000-01-01" })).rejects.toThrow();
    await expect(writeOne({ clientUpdatedAt: new Date("0000-06-01T00:00:00Z") })).rejects.toThrow();
    expect(await db().select().from(visits).where(eq(visits.id, visit.id))).toHaveLength(0);
    // The same row without them lands, so the refusals above were the values'.
    await writeOne({});
    expect(await db().select().from(visits).where(eq(visits.id, visit.id))).toHaveLength(1);
  });

  it("stores the extreme values the contract accepts exactly as sent", async () => {
    const coRecorders = "Zoë Ærø, \u{1F98B} club";
    const notes = "Line one\n\tline two\r\nCafé 30\u00a0°C";
    // The earliest date the contract takes (1900-01-01) lies in no season, so the season rule
    // refuses it; the contract's own edge is tested in tests/unit/sync-contract.test.ts.
    const visit = visitOf(transect.id, {
      startTime: "00:00",
      endTime: "23:59:59",
      temperatureC: -40,
      windBeaufort: 12,
      cloudCoverPercent: 100,
      coRecorders,
      notes,
      submittedAt: "2100-12-31T23:59:59.999Z",
      clientUpdatedAt: "2100-12-31T23:59:59.999Z",
    });
    const s = sightingOf(visit.id, speciesIds[0]!, {
      count: 100_000, section: transect.sectionCount, latitude: -90, longitude: 180, accuracyMetres: 100_000,
      note: "\u{1F98B}\u{1F98B} on the bramble", clientUpdatedAt: "1900-01-01T00:00:00Z",
    });
    const { status, response } = await applySyncBatch(actor, { visits: [visit], sightings: [s] });
    expect(status).toBe(200);
    expect(response.results.map((r) => r.status)).toEqual(["created", "created"]);
    const [stored] = await db().select().from(visits).where(eq(visits.id, visit.id));
    expect(stored).toMatchObject({ visitDate: walkDay, startTime: "00:00:00", endTime: "23:59:59", coRecorders, notes });
    expect(stored!.clientUpdatedAt!.toISOString()).toBe("2100-12-31T23:59:59.999Z");
    expect(await storedSighting(s.id)).toMatchObject({ count: 100_000, latitude: -90, longitude: 180, accuracyMetres: 100_000, note: s.note });
    expect((await storedSighting(s.id))!.clientUpdatedAt!.toISOString()).toBe("1900-01-01T00:00:00.000Z");
  });

  it("refuses a malformed envelope as a whole with field messages", async () => {
    await expect(applySyncBatch(actor, { visits: "lots", sightings: Array(501).fill({}) })).rejects.toMatchObject({
      status: 400,
      fieldErrors: { visits: [expect.any(String)], sightings: [expect.any(String)] },
    });
    await expect(applySyncBatch(actor, null)).rejects.toMatchObject({ status: 400 });
  });

  it("refuses a second copy of one id inside a batch", async () => {
    const visit = visitOf(transect.id);
    const s = sightingOf(visit.id, speciesIds[0]!);
    const { response } = await applySyncBatch(actor, { visits: [visit], sightings: [s, { ...s, count: 9 }] });
    expect(response.results.map((r) => r.status)).toEqual(["created", "created", "invalid"]);
    expect((await storedSighting(s.id))!.count).toBe(3);
  });

  it("never overwrites or deletes a sighting a coordinator has reviewed", async () => {
    const visit = visitOf(transect.id);
    const s = sightingOf(visit.id, speciesIds[0]!, { count: 4 });
    await applySyncBatch(actor, { visits: [visit], sightings: [s] });
    await db().update(sightings).set({ status: "accepted", reviewedAt: new Date() }).where(eq(sightings.id, s.id));

    const later = { ...s, count: 40, clientUpdatedAt: "2026-05-15T09:00:00.000Z" };
    const changed = await applySyncBatch(actor, { sightings: [later] });
    expect(changed.status).toBe(200);
    expect(changed.response.results[0]).toMatchObject({ status: "kept-server", reason: expect.stringContaining("reviewed") });
    expect((await storedSighting(s.id))!.count).toBe(4);

    const removal = await applySyncBatch(actor, { sightings: [{ ...later, deleted: true }] });
    expect(removal.response.results[0]!.status).toBe("kept-server");
    expect(await storedSighting(s.id)).toBeDefined();
  });

  it("keeps a visit's server fields once one of its sightings is reviewed, but still accepts new sightings for it", async () => {
    const visit = visitOf(transect.id);
    const s = sightingOf(visit.id, speciesIds[0]!);
    await applySyncBatch(actor, { visits: [visit], sightings: [s] });
    await db().update(sightings).set({ status: "queried", reviewedAt: new Date() }).where(eq(sightings.id, s.id));

    const edited = { ...visit, notes: "Rewritten later", clientUpdatedAt: "2026-05-16T08:00:00.000Z" };
    const extra = sightingOf(visit.id, speciesIds[1]!);
    const { status, response } = await applySyncBatch(actor, { visits: [edited], sightings: [extra] });
    expect(status).toBe(200);
    expect(response.results.map((r) => r.status)).toEqual(["kept-server", "created"]);
    const [stored] = await db().select().from(visits).where(eq(visits.id, visit.id));
    expect(stored!.notes).toBe("Sheltered on the lower slope.");
    expect(await storedSighting(extra.id)).toBeDefined();
  });

  it("last writer wins by clientUpdatedAt: an older edit is kept out, a newer one lands", async () => {
    const visit = visitOf(transect.id, { clientUpdatedAt: "2026-05-14T12:00:00.000Z" });
    const s = sightingOf(visit.id, speciesIds[0]!, { count: 5, clientUpdatedAt: "2026-05-14T12:00:00.000Z" });
    await applySyncBatch(actor, { visits: [visit], sightings: [s] });

    const older = await applySyncBatch(actor, {
      visits: [{ ...visit, notes: "stale", clientUpdatedAt: "2026-05-14T11:00:00.000Z" }],
      sightings: [{ ...s, count: 1, clientUpdatedAt: "2026-05-14T11:00:00.000Z" }],
    });
    expect(older.response.results.map((r) => [r.status, r.reason])).toEqual([
      ["kept-server", "Turnstone already has a newer change to this walk."],
      ["kept-server", "Turnstone already has a newer change to this sighting."],
    ]);
    expect((await storedSighting(s.id))!.count).toBe(5);

    const newer = await applySyncBatch(actor, { sightings: [{ ...s, count: 8, section: null, clientUpdatedAt: "2026-05-14T13:00:00.000Z" }] });
    expect(newer.response.results[0]!.status).toBe("updated");
    expect(await storedSighting(s.id)).toMatchObject({ count: 8, section: null });
  });

  it("deletes a pending sighting on request; deleting one already gone is unchanged", async () => {
    const visit = visitOf(transect.id);
    const s = sightingOf(visit.id, speciesIds[0]!);
    await applySyncBatch(actor, { visits: [visit], sightings: [s] });
    const gone = { ...s, deleted: true, clientUpdatedAt: "2026-05-14T11:30:00.000Z" };
    const first = await applySyncBatch(actor, { sightings: [gone] });
    expect(first.response.results[0]!.status).toBe("deleted");
    expect(await storedSighting(s.id)).toBeUndefined();
    const again = await applySyncBatch(actor, { sightings: [gone] });
    expect(again.status).toBe(200);
    expect(again.response.results[0]!.status).toBe("unchanged");
  });

  it("refuses sightings for another volunteer's visit, and edits to another volunteer's sighting", async () => {
    const before = await rowCounts();
    const intruder = sightingOf(theirVisitId, speciesIds[0]!);
    const [theirs] = await db().select().from(sightings).where(eq(sightings.visitId, theirVisitId)).limit(1);
    const ownVisit = visitOf(transect.id);
    const hijack = sightingOf(ownVisit.id, speciesIds[0]!, { id: theirs!.id, count: 999, clientUpdatedAt: "2030-01-01T00:00:00.000Z" });
    const { status, response } = await applySyncBatch(actor, { visits: [ownVisit], sightings: [intruder, hijack] });
    expect(status).toBe(403);
    expect(response.results.map((r) => [r.kind, r.status])).toEqual([
      ["visit", "created"],
      ["sighting", "forbidden"],
      ["sighting", "forbidden"],
    ]);
    expect(await rowCounts()).toEqual({ visits: before.visits + 1, sightings: before.sightings });
    expect((await storedSighting(theirs!.id))!.count).toBe(theirs!.count);
  });

  it("refuses someone else's visit id even on the volunteer's own transect", async () => {
    const [theirs] = await db().select().from(visits).where(eq(visits.id, theirVisitId));
    const { status, response } = await applySyncBatch(actor, { visits: [visitOf(transect.id, { id: theirs!.id })] });
    expect(status).toBe(403);
    expect(response.results[0]).toMatchObject({ status: "forbidden", reason: "This walk belongs to another volunteer." });
    const [after] = await db().select().from(visits).where(eq(visits.id, theirVisitId));
    expect(after).toEqual(theirs);
  });

  it("answers an unknown species or a section beyond the transect as invalid fields, not a server error", async () => {
    const visit = visitOf(transect.id);
    const unknownSpecies = sightingOf(visit.id, randomUUID());
    const farSection = sightingOf(visit.id, speciesIds[0]!, { section: transect.sectionCount + 1 });
    const { status, response } = await applySyncBatch(actor, { visits: [visit], sightings: [unknownSpecies, farSection] });
    expect(status).toBe(400);
    expect(response.results[1]).toMatchObject({ status: "invalid", errors: { speciesId: ["That species is not on the checklist."] } });
    expect(response.results[2]).toMatchObject({ status: "invalid", errors: { section: [`This transect has ${transect.sectionCount} sections.`] } });
    expect(await db().select().from(sightings).where(eq(sightings.visitId, visit.id))).toHaveLength(0);
  });

  it("accepts sightings for a visit already stored, sent in a later batch", async () => {
    const visit = visitOf(transect.id);
    await applySyncBatch(actor, { visits: [visit] });
    const s = sightingOf(visit.id, speciesIds[2]!);
    const { status, response } = await applySyncBatch(actor, { sightings: [s] });
    expect(status).toBe(200);
    expect(response.results[0]!.status).toBe("created");
  });

  it("refuses new sightings for a stored visit once the volunteer's assignment to its transect has ended", async () => {
    const visit = visitOf(transect.id);
    const first = sightingOf(visit.id, speciesIds[0]!);
    await applySyncBatch(actor, { visits: [visit], sightings: [first] });
    await db().delete(transectAssignments).where(and(eq(transectAssignments.userId, actor.id), eq(transectAssignments.transectId, transect.id)));

    const late = sightingOf(visit.id, speciesIds[1]!);
    const edit = { ...first, count: 30, clientUpdatedAt: "2026-05-15T09:00:00.000Z" };
    const { status, response } = await applySyncBatch(actor, { sightings: [late, edit] });
    expect(status).toBe(403);
    expect(response.results).toEqual([
      { kind: "sighting", id: late.id, index: 0, status: "forbidden", reason: "You are not assigned to that transect." },
      { kind: "sighting", id: first.id, index: 1, status: "forbidden", reason: "You are not assigned to that transect." },
    ]);
    expect(await storedSighting(late.id)).toBeUndefined();
    expect((await storedSighting(first.id))!.count).toBe(3);
  });

  it("a write refused by its guard takes the batch's earlier writes with it (the queued COMMIT rolls back)", async () => {
    const visit = visitOf(transect.id);
    const pending = sightingOf(visit.id, speciesIds[0]!);
    const reviewed = sightingOf(visit.id, speciesIds[1]!);
    await applySyncBatch(actor, { visits: [visit], sightings: [pending, reviewed] });
    await db().update(sightings).set({ status: "accepted", reviewedAt: new Date() }).where(eq(sightings.id, reviewed.id));
    const edit = { ...pending, count: 40, latitude: 51.2, longitude: -1.3, accuracyMetres: 8, note: null, clientUpdatedAt: new Date("2027-01-01T00:00:00Z") };

    // The edit alone would land; sent before a delete its guard refuses, it must not.
    await expect(inBatch((tx) => Promise.all([upsertSightings(tx, actor.id, [edit]), deletePendingSightings(tx, [reviewed.id])]))).rejects.toBeInstanceOf(BatchRaced);
    expect((await storedSighting(pending.id))!.count).toBe(3);
    expect(await storedSighting(reviewed.id)).toBeDefined();
    await inBatch((tx) => upsertSightings(tx, actor.id, [edit]));
    expect((await storedSighting(pending.id))!.count).toBe(40);
  });

  it("the write guards leave alone rows reviewed or taken over after the batch read them", async () => {
    const visit = visitOf(transect.id);
    const s = sightingOf(visit.id, speciesIds[0]!);
    await applySyncBatch(actor, { visits: [visit], sightings: [s] });
    await db().update(sightings).set({ status: "accepted", reviewedAt: new Date() }).where(eq(sightings.id, s.id));
    const later = new Date("2027-01-01T00:00:00Z");
    const sightingRow = { id: s.id, visitId: visit.id, speciesId: speciesIds[0]!, count: 50, section: 1, latitude: null, longitude: null, accuracyMetres: null, note: null, clientUpdatedAt: later };
    const visitRow = { id: visit.id, transectId: transect.id, volunteerId: actor.id, seasonId: null, visitDate: "2026-05-14", startTime: "10:30:00", completeList: false, notes: "late edit", clientUpdatedAt: later };

    await expect(inBatch((tx) => upsertSightings(tx, actor.id, [sightingRow]))).rejects.toBeInstanceOf(BatchRaced);
    await expect(inBatch((tx) => deletePendingSightings(tx, [s.id]))).rejects.toBeInstanceOf(BatchRaced);
    await expect(inBatch((tx) => upsertVisits(tx, [visitRow]))).rejects.toBeInstanceOf(BatchRaced);
    await db().update(sightings).set({ status: "pending", reviewedAt: null }).where(eq(sightings.id, s.id));
    const intruder = await actorFor("volunteer02@harrowmere.example");
    await expect(inBatch((tx) => upsertSightings(tx, intruder.id, [sightingRow]))).rejects.toBeInstanceOf(BatchRaced);
    await expect(inBatch((tx) => upsertVisits(tx, [{ ...visitRow, volunteerId: intruder.id }]))).rejects.toBeInstanceOf(BatchRaced);

    expect((await storedSighting(s.id))!.count).toBe(3);
    const [stored] = await db().select().from(visits).where(eq(visits.id, visit.id));
    expect(stored).toMatchObject({ notes: "Sheltered on the lower slope.", volunteerId: actor.id });
    // With nothing in the way the same rows do land, so the refusals above were the guards at work.
    await inBatch((tx) => upsertSightings(tx, actor.id, [sightingRow]));
    expect((await storedSighting(s.id))!.count).toBe(50);
  });
});
