import { SYNC_PROTOCOL_VERSION } from "@/lib/sync/protocol";
import "fake-indexeddb/auto";
import { beforeEach, describe, expect, it } from "vitest";
import { PhoneStore, phoneStore, setPhoneStore, setFieldUser, type LocalSighting } from "@/lib/offline/phone-store";
import { OUTBOX_LIMITS, runOutbox } from "@/lib/offline/outbox";
import { batchBody, encode, planBatches, type BatchLimits, type VisitGroup } from "@/lib/offline/outbox-batches";
import { addSighting, createVisit, submitVisit } from "@/lib/offline/records";
import { requestBodyLimits } from "@/lib/limits/request-bodies";
import { sightingPayload, syncEnvelope, visitPayload } from "@/lib/sync/contract";
import { fakeServer } from "./fake-sync-server";

const userId = "3d5e7f90-1a2b-4c3d-8e4f-5a6b7c8d9e0f";
const transectId = "6f1c1f7e-2b7a-4c1e-9a55-5d2f0c7b9a10";
const speciesId = "0b6f7a3c-8a35-4f3e-b6a4-1f2a3b4c5d6e";
const utf8 = new TextEncoder();

// What the sync route accepts, as the protocol documents it (DEVELOPERS.md, "Field recording"):
// a body of at most 2,000,000 UTF-8 bytes (413 above it) holding at most 500 sightings. The
// outbox's batches are checked against these numbers and the route's own schema, not against the
// outbox's settings.
const ROUTE_BODY_BYTES = 2_000_000;
const ROUTE_ITEMS = 500;
const bytesOf = (body: string) => Buffer.byteLength(body, "utf8");

/** Every item of a body as the route validates it: the envelope, then each item on its own. */
function routeRefusals(body: string): string[] {
  const envelope = syncEnvelope.safeParse(JSON.parse(body));
  if (!envelope.success) return envelope.error.issues.map((i) => `envelope ${i.path.join(".")}: ${i.message}`);
  return [
    ...envelope.data.visits.flatMap((v, i) => visitPayload.safeParse(v).error?.issues.map((e) => `visit ${i} ${e.path.join(".")}: ${e.message}`) ?? []),
    ...envelope.data.sightings.flatMap((v, i) => sightingPayload.safeParse(v).error?.issues.map((e) => `sighting ${i} ${e.path.join(".")}: ${e.message}`) ?? []),
  ];
}

type Item = { id: string; visitId: string; note: string };
const item = (id: string, visitId: string, note = "") => encode<Item>({ id, visitId, note }, { id, visitId, note });
function group(visitId: string, sightings: number, note = ""): VisitGroup<Item, Item> {
  return { visit: item(visitId, visitId), sightings: Array.from({ length: sightings }, (_, i) => item(`${visitId}-s${i}`, visitId, note)) };
}
const ids = (batch: { visits: { item: Item }[]; sightings: { item: Item }[] }) => [...batch.visits, ...batch.sightings].map((e) => e.item.id);

describe("planning batches", () => {
  const roomy: BatchLimits = { visits: 10, sightings: 5, bodyBytes: 1_000_000 };

  it("keeps a visit with its sightings by starting a new batch rather than splitting them", () => {
    const batches = planBatches([group("a", 3), group("b", 3)], roomy);
    expect(batches.map(ids)).toEqual([
      ["a", "a-s0", "a-s1", "a-s2"],
      ["b", "b-s0", "b-s1", "b-s2"],
    ]);
  });

  it("fills a batch with several small visits", () => {
    const batches = planBatches([group("a", 2), group("b", 2), group("c", 2)], roomy);
    expect(batches.map(ids)).toEqual([["a", "b", "a-s0", "a-s1", "b-s0", "b-s1"], ["c", "c-s0", "c-s1"]]);
  });

  it("splits a visit with more sightings than fit: the visit and first sightings, then the rest", () => {
    const batches = planBatches([group("a", 12)], roomy);
    expect(batches.map((b) => [b.visits.length, b.sightings.length])).toEqual([[1, 5], [0, 5], [0, 2]]);
    expect(batches.flatMap(ids)).toEqual(["a", ...Array.from({ length: 12 }, (_, i) => `a-s${i}`)]);
  });

  it("counts UTF-8 bytes, not characters, and each body is exactly the size it was counted at", () => {
    // "—" (U+2014) is one UTF-16 unit but three UTF-8 bytes (RFC 3629 §3: U+0800..U+FFFF take 3 bytes).
    const note = "—".repeat(100);
    const oneSighting = item("x-s0", "x", note).bytes;
    expect(oneSighting).toBeGreaterThan(300);
    const limits: BatchLimits = { visits: 10, sightings: 500, bodyBytes: 2_000 };
    const batches = planBatches([group("x", 20, note)], limits);
    expect(batches.length).toBeGreaterThan(3);
    for (const batch of batches) {
      const body = batchBody(batch);
      expect(utf8.encode(body).length).toBe(batch.bytes);
      expect(batch.bytes).toBeLessThanOrEqual(limits.bodyBytes);
      expect(JSON.parse(body)).toEqual({ protocol: SYNC_PROTOCOL_VERSION, visits: batch.visits.map((v) => v.item), sightings: batch.sightings.map((s) => s.item) });
    }
    // Full batches: a smaller count limit, not the byte limit, would have allowed more per batch.
    expect(batches[1]!.bytes + oneSighting + 1).toBeGreaterThan(limits.bodyBytes);
    expect(batches.flatMap(ids)).toHaveLength(21);
  });

  it("sends an item too large for any batch alone, so it cannot hold back the others", () => {
    const limits: BatchLimits = { visits: 10, sightings: 10, bodyBytes: 500 };
    const huge = item("a-huge", "a", "x".repeat(1_000));
    const batches = planBatches([{ visit: item("a", "a"), sightings: [item("a-s0", "a"), huge, item("a-s1", "a")] }, group("b", 1)], limits);
    expect(batches.map(ids)).toEqual([["a", "a-s0"], ["a-huge"], ["b", "a-s1", "b-s0"]]);
  });
});

async function submittedVisit(sightings: number, note: string | null = null, visitText: { coRecorders: string; notes: string } | null = null) {
  const visitId = await createVisit({ transectId, visitDate: "2026-06-14", startTime: "10:30", temperatureC: 19, windBeaufort: 2, cloudCoverPercent: 20, sky: "mostly_sunny", coRecorders: visitText?.coRecorders ?? null });
  // One sighting through the phone's own code; the rest written in one go, in order, for speed.
  const sightingIds = sightings ? [await addSighting(visitId, { speciesId, count: 1, section: 1, latitude: null, longitude: null, accuracyMetres: null, note })] : [];
  const start = Date.now();
  const more: LocalSighting[] = Array.from({ length: Math.max(0, sightings - 1) }, (_, i) => ({
    id: crypto.randomUUID(), visitId, speciesId, count: 2 + (i % 50), section: 1, latitude: null, longitude: null, accuracyMetres: null, note,
    updatedAt: new Date(start + 1_000 + i).toISOString(), outbox: "on-phone", attention: null,
  }));
  await phoneStore().sightings.bulkAdd(more);
  sightingIds.push(...more.map((m) => m.id));
  await submitVisit(visitId, { endTime: "11:30", completeList: true, notes: visitText?.notes ?? null });
  return { visitId, sightingIds };
}

const bodyOf = (body: string) => JSON.parse(body) as { visits: { id: string }[]; sightings: { id: string; visitId: string }[] };

async function freshPhone() {
  const db = new PhoneStore(`test-${crypto.randomUUID()}`);
  setPhoneStore(db);
  setFieldUser(userId);
  await db.open();
}

// Thousands of IndexedDB writes: generous time on a busy machine.
describe("the outbox's batches are what the sync route accepts", { timeout: 30_000 }, () => {
  beforeEach(freshPhone);

  it("the route's limits are the documented ones, and its envelope refuses one item more", () => {
    expect(requestBodyLimits.syncBatch).toBe(ROUTE_BODY_BYTES);
    const many = (n: number) => Array.from({ length: n }, () => ({}));
    expect(syncEnvelope.safeParse({ visits: [], sightings: many(ROUTE_ITEMS) }).success).toBe(true);
    expect(syncEnvelope.safeParse({ visits: [], sightings: many(ROUTE_ITEMS + 1) }).success).toBe(false);
    expect(syncEnvelope.safeParse({ visits: many(ROUTE_ITEMS + 1), sightings: [] }).success).toBe(false);
  });

  it("sends the longest valid records in full batches, each under the byte cap with every item valid", async () => {
    // Every text at its longest, in a character of three UTF-8 bytes (RFC 3629 §3: U+0800..U+FFFF),
    // the most bytes per character the contract lets through (four-byte characters count as two).
    const visitText = { coRecorders: "—".repeat(200), notes: "—".repeat(2_000) };
    for (let i = 0; i < 11; i++) await submittedVisit(i === 0 ? 1_100 : 2, "—".repeat(1_000), visitText);
    const server = fakeServer();
    await runOutbox(userId, server.fetcher);
    const bodies = server.bodies;
    expect(bodies.length).toBeGreaterThan(2);
    for (const body of bodies) {
      expect(bytesOf(body)).toBeLessThanOrEqual(ROUTE_BODY_BYTES);
      expect(routeRefusals(body)).toEqual([]);
    }
    const sizes = bodies.map(bodyOf).map((b) => b.sightings.length);
    expect(Math.max(...sizes)).toBe(ROUTE_ITEMS); // the batches really were filled to the route's item limit
    expect(sizes.reduce((a, b) => a + b, 0)).toBe(1_100 + 10 * 2);
  });

  it("the check refuses what the route would: a body past the cap or an item past a limit", () => {
    const visit = { id: crypto.randomUUID(), transectId, visitDate: "2026-06-14", startTime: "10:30", completeList: true, notes: "—".repeat(2_001), clientUpdatedAt: "2026-06-14T11:00:00.000Z" };
    expect(routeRefusals(JSON.stringify({ visits: [visit], sightings: [] }))).toEqual(["visit 0 notes: At most 2000 characters."]);
    expect(bytesOf("—")).toBe(3); // bytes, as the route counts them, not characters
  });
});

describe("the outbox in batches against a server with the real limits", { timeout: 30_000 }, () => {
  beforeEach(freshPhone);

  it("sends a visit with 1,234 sightings in three batches, the visit first, each record created once", async () => {
    const server = fakeServer();
    const { visitId, sightingIds } = await submittedVisit(1_234);
    const run = await runOutbox(userId, server.fetcher);
    expect(run).toMatchObject({ sent: 1_235, needsAttention: 0, retryLater: false });
    const bodies = server.bodies.map(bodyOf);
    expect(bodies.map((b) => [b.visits.length, b.sightings.length])).toEqual([[1, 500], [0, 500], [0, 234]]);
    expect(bodies[0]!.visits[0]!.id).toBe(visitId);
    expect(server.writes.filter((w) => w.op === "create").map((w) => w.id).sort()).toEqual([visitId, ...sightingIds].sort());
    expect(await phoneStore().sightings.where("outbox").notEqual("sent").count()).toBe(0);
  });

  it("keeps each visit with its sightings when several fill batches", async () => {
    const server = fakeServer();
    const visits = [await submittedVisit(300), await submittedVisit(300), await submittedVisit(300)];
    await runOutbox(userId, server.fetcher);
    const bodies = server.bodies.map(bodyOf);
    expect(bodies).toHaveLength(3);
    for (const body of bodies) {
      expect(body.visits).toHaveLength(1);
      expect(body.sightings.every((s) => s.visitId === body.visits[0]!.id)).toBe(true);
    }
    expect(bodies.map((b) => b.visits[0]!.id)).toEqual(visits.map((v) => v.visitId));
  });

  it("stays under the byte limit when long notes make bytes, not counts, the limit", async () => {
    // Notes of 3,000 three-byte characters: longer than a note may be, so the server refuses
    // them one by one, but each must get its own answer rather than a 413 for the lot.
    const server = fakeServer();
    const visits = [];
    for (let i = 0; i < 12; i++) visits.push(await submittedVisit(40, "—".repeat(3_000)));
    await runOutbox(userId, server.fetcher);
    const bodies = server.bodies.map(bodyOf);
    expect(bodies.length).toBeGreaterThan(1);
    expect(bodies.every((b) => b.visits.length < OUTBOX_LIMITS.visits)).toBe(true);
    for (const body of server.bodies) expect(bytesOf(body)).toBeLessThanOrEqual(ROUTE_BODY_BYTES);
    for (const body of bodies) expect(body.sightings).toHaveLength(body.visits.length * 40);
    expect(server.answers.flat().filter((r) => r.kind === "sighting")).toHaveLength(480);
    const left = await phoneStore().sightings.bulkGet(visits.flatMap((v) => v.sightingIds));
    expect(left.every((s) => s?.outbox === "needs-attention")).toBe(true);
  });

  it("finishes a split visit on the next pass when the signal drops between its batches", async () => {
    let requests = 0;
    const flaky = fakeServer({
      syncOverride: () => {
        if (++requests === 2) throw new TypeError("Failed to fetch");
        return undefined;
      },
    });
    const { visitId } = await submittedVisit(700);
    const first = await runOutbox(userId, flaky.fetcher);
    expect(first.retryLater).toBe(true);
    // The visit is on the server; 200 of its sightings are not.
    expect((await phoneStore().visits.get(visitId))?.outbox).toBe("sent");
    expect(await phoneStore().sightings.where("outbox").equals("on-phone").count()).toBe(200);
    const second = await runOutbox(userId, flaky.fetcher);
    expect(second).toMatchObject({ sent: 200, retryLater: false });
    expect(bodyOf(flaky.bodies.at(-1)!)).toMatchObject({ visits: [] });
    expect(await phoneStore().sightings.where("outbox").notEqual("sent").count()).toBe(0);
    expect(new Set(flaky.writes.map((w) => w.id)).size).toBe(701);
  });

  it("holds a split visit's later sightings when its first batch is refused whole", async () => {
    const server = fakeServer({ syncOverride: () => new Response(JSON.stringify({ error: { code: "invalid", message: "Refused." } }), { status: 400 }) });
    const { visitId } = await submittedVisit(700);
    await runOutbox(userId, server.fetcher);
    expect(server.bodies).toHaveLength(1);
    expect(await phoneStore().visits.get(visitId)).toMatchObject({ outbox: "needs-attention", attention: "Refused." });
    expect(await phoneStore().sightings.where("outbox").equals("needs-attention").count()).toBe(500);
    expect(await phoneStore().sightings.where("outbox").equals("on-phone").count()).toBe(200);
  });
});
