import "fake-indexeddb/auto";
import { beforeEach, describe, expect, it } from "vitest";
import { PhoneStore, phoneStore, setPhoneStore, setFieldUser, type LocalSighting } from "@/lib/offline/phone-store";
import { OUTBOX_LIMITS, runOutbox } from "@/lib/offline/outbox";
import { batchBody, encode, planBatches, type BatchLimits, type VisitGroup } from "@/lib/offline/outbox-batches";
import { addSighting, createVisit, submitVisit } from "@/lib/offline/records";
import { MAX_BATCH_ITEMS, MAX_SYNC_BODY_BYTES, syncEnvelope } from "@/lib/sync/contract";
import { fakeServer } from "./fake-sync-server";

const userId = "3d5e7f90-1a2b-4c3d-8e4f-5a6b7c8d9e0f";
const transectId = "6f1c1f7e-2b7a-4c1e-9a55-5d2f0c7b9a10";
const speciesId = "0b6f7a3c-8a35-4f3e-b6a4-1f2a3b4c5d6e";
const utf8 = new TextEncoder();

describe("the outbox's limits match the server's", () => {
  it("never allows more items per batch than the contract accepts", () => {
    expect(OUTBOX_LIMITS.visits).toBeLessThanOrEqual(MAX_BATCH_ITEMS);
    expect(OUTBOX_LIMITS.sightings).toBeLessThanOrEqual(MAX_BATCH_ITEMS);
    // The contract's own envelope accepts a batch filled to the outbox's limits.
    const full = { visits: Array.from({ length: OUTBOX_LIMITS.visits }, () => ({})), sightings: Array.from({ length: OUTBOX_LIMITS.sightings }, () => ({})) };
    expect(syncEnvelope.safeParse(full).success).toBe(true);
  });

  it("never sends a body larger than the sync route reads", () => {
    // The route's own limit, the one it answers 413 above (tests/integration/sync-route.test.ts).
    expect(OUTBOX_LIMITS.bodyBytes).toBeLessThanOrEqual(MAX_SYNC_BODY_BYTES);
  });
});

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
      expect(JSON.parse(body)).toEqual({ visits: batch.visits.map((v) => v.item), sightings: batch.sightings.map((s) => s.item) });
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

async function submittedVisit(sightings: number, note: string | null = null) {
  const visitId = await createVisit({ transectId, visitDate: "2026-06-14", startTime: "10:30", temperatureC: 19, windBeaufort: 2, cloudCoverPercent: 20, sky: "mostly_sunny", coRecorders: null });
  // One sighting through the phone's own code; the rest written in one go, in order, for speed.
  const sightingIds = sightings ? [await addSighting(visitId, { speciesId, count: 1, section: 1, latitude: null, longitude: null, accuracyMetres: null, note })] : [];
  const start = Date.now();
  const more: LocalSighting[] = Array.from({ length: Math.max(0, sightings - 1) }, (_, i) => ({
    id: crypto.randomUUID(), visitId, speciesId, count: 2 + (i % 50), section: 1, latitude: null, longitude: null, accuracyMetres: null, note,
    updatedAt: new Date(start + 1_000 + i).toISOString(), outbox: "on-phone", attention: null,
  }));
  await phoneStore().sightings.bulkAdd(more);
  sightingIds.push(...more.map((m) => m.id));
  await submitVisit(visitId, { endTime: "11:30", completeList: true, notes: null });
  return { visitId, sightingIds };
}

const bodyOf = (body: string) => JSON.parse(body) as { visits: { id: string }[]; sightings: { id: string; visitId: string }[] };

// Thousands of IndexedDB writes: generous time on a busy machine.
describe("the outbox in batches against a server with the real limits", { timeout: 30_000 }, () => {
  beforeEach(async () => {
    const db = new PhoneStore(`test-${crypto.randomUUID()}`);
    setPhoneStore(db);
    setFieldUser(userId);
    await db.open();
  });

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
    for (const body of server.bodies) expect(utf8.encode(body).length).toBeLessThanOrEqual(MAX_SYNC_BODY_BYTES);
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
