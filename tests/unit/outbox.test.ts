import "fake-indexeddb/auto";
import { beforeEach, describe, expect, it } from "vitest";
import { FieldDatabase, fieldDb, setFieldDb } from "@/lib/offline/db";
import { runOutbox } from "@/lib/offline/outbox";
import { addPhoto, addSighting, createVisit, submitVisit } from "@/lib/offline/records";
import { batchStatus, sightingPayload, visitPayload, type ItemResult } from "@/lib/sync/contract";

/**
 * A small stand-in for the server that keeps what it is sent by id and answers with the
 * shared contract (validation by the same zod schemas). It records every request.
 */
function fakeServer(options: { down?: boolean; status401?: boolean; forbidTransect?: string } = {}) {
  const visits = new Map<string, unknown>();
  const sightings = new Map<string, unknown>();
  const photos = new Set<string>();
  const requests: string[] = [];
  const fetcher = (async (input: RequestInfo | URL, init?: RequestInit) => {
    const url = String(input);
    requests.push(`${init?.method ?? "GET"} ${url}`);
    if (options.down) throw new TypeError("Failed to fetch");
    if (options.status401) return new Response(JSON.stringify({ error: { code: "unauthorized" } }), { status: 401 });
    if (url === "/api/field/sync") {
      const body = JSON.parse(String(init?.body)) as { visits: unknown[]; sightings: unknown[] };
      const results: ItemResult[] = [];
      body.visits.forEach((raw, index) => {
        const parsed = visitPayload.safeParse(raw);
        if (!parsed.success) return results.push({ kind: "visit", id: null, index, status: "invalid", errors: { _: [parsed.error.issues[0]!.message] } });
        if (parsed.data.transectId === options.forbidTransect) return results.push({ kind: "visit", id: parsed.data.id, index, status: "forbidden", reason: "Not your transect." });
        const existed = visits.has(parsed.data.id);
        visits.set(parsed.data.id, parsed.data);
        results.push({ kind: "visit", id: parsed.data.id, index, status: existed ? "unchanged" : "created" });
      });
      body.sightings.forEach((raw, index) => {
        const parsed = sightingPayload.safeParse(raw);
        if (!parsed.success) return results.push({ kind: "sighting", id: null, index, status: "invalid", errors: { count: [parsed.error.issues[0]!.message] } });
        const existed = sightings.has(parsed.data.id);
        sightings.set(parsed.data.id, parsed.data);
        results.push({ kind: "sighting", id: parsed.data.id, index, status: existed ? "unchanged" : "created" });
      });
      return new Response(JSON.stringify({ results, serverTime: new Date().toISOString() }), { status: batchStatus(results) });
    }
    if (url === "/api/field/photos") {
      const { id } = JSON.parse(String(init?.body)) as { id: string };
      return new Response(JSON.stringify({ id, uploadUrl: `http://store.test/${id}`, headers: {}, expiresAt: new Date().toISOString() }), { status: 201 });
    }
    if (url.startsWith("http://store.test/")) return new Response(null, { status: 200 });
    const complete = url.match(/^\/api\/field\/photos\/(.+)\/complete$/);
    if (complete) {
      photos.add(complete[1]!);
      return new Response(JSON.stringify({ photo: { id: complete[1], status: "ready", width: 1, height: 1 } }), { status: 200 });
    }
    return new Response("not found", { status: 404 });
  }) as typeof fetch;
  return { fetcher, visits, sightings, photos, requests };
}

const transectId = "6f1c1f7e-2b7a-4c1e-9a55-5d2f0c7b9a10";
const speciesId = "0b6f7a3c-8a35-4f3e-b6a4-1f2a3b4c5d6e";

async function recordVisit(sightingCount: number, tId = transectId) {
  const visitId = await createVisit({ transectId: tId, visitDate: "2026-06-14", startTime: "10:30", temperatureC: 19, windBeaufort: 2, cloudCoverPercent: 20, sky: "mostly_sunny", coRecorders: null });
  const ids: string[] = [];
  for (let i = 0; i < sightingCount; i++) {
    ids.push(await addSighting(visitId, { speciesId, count: i + 1, section: 1, latitude: null, longitude: null, accuracyMetres: null, note: null }));
  }
  return { visitId, sightingIds: ids };
}

describe("the outbox", () => {
  beforeEach(async () => {
    const db = new FieldDatabase(`test-${crypto.randomUUID()}`);
    setFieldDb(db);
    await db.open();
  });

  it("drafts never leave the phone; a submitted visit does", async () => {
    const server = fakeServer();
    const { visitId } = await recordVisit(2);
    await runOutbox(server.fetcher);
    expect(server.visits.size).toBe(0);
    await submitVisit(visitId, { endTime: "11:30", completeList: true, notes: null });
    const run = await runOutbox(server.fetcher);
    expect(run.sent).toBe(3);
    expect(server.visits.size).toBe(1);
    expect(server.sightings.size).toBe(2);
    expect((await fieldDb().visits.get(visitId))?.outbox).toBe("sent");
  });

  it("with no network, keeps everything on the phone and reports offline", async () => {
    const { visitId, sightingIds } = await recordVisit(5);
    await submitVisit(visitId, { endTime: "11:30", completeList: true, notes: null });
    const run = await runOutbox(fakeServer({ down: true }).fetcher);
    expect(run.offline).toBe(true);
    expect((await fieldDb().visits.get(visitId))?.outbox).toBe("on-phone");
    const kept = await fieldDb().sightings.bulkGet(sightingIds);
    expect(kept.every((s) => s?.outbox === "on-phone")).toBe(true);
  });

  it("resending after a pass that died mid-request stores nothing twice", async () => {
    const server = fakeServer();
    const { visitId } = await recordVisit(3);
    await submitVisit(visitId, { endTime: "11:30", completeList: false, notes: null });
    await runOutbox(server.fetcher);
    // Simulate a tab closed before the answer arrived: the phone still thinks it is sending.
    await fieldDb().visits.update(visitId, { outbox: "sending" });
    await fieldDb().sightings.where("visitId").equals(visitId).modify({ outbox: "sending" });
    await runOutbox(server.fetcher);
    expect(server.visits.size).toBe(1);
    expect(server.sightings.size).toBe(3);
    expect((await fieldDb().visits.get(visitId))?.outbox).toBe("sent");
  });

  it("marks a refused visit as needing attention with the server's reason, and sends the rest", async () => {
    const server = fakeServer({ forbidTransect: "11111111-1111-4111-8111-111111111111" });
    const bad = await recordVisit(1, "11111111-1111-4111-8111-111111111111");
    const good = await recordVisit(1);
    await submitVisit(bad.visitId, { endTime: "11:30", completeList: false, notes: null });
    await submitVisit(good.visitId, { endTime: "11:30", completeList: false, notes: null });
    await runOutbox(server.fetcher);
    const badVisit = await fieldDb().visits.get(bad.visitId);
    expect(badVisit?.outbox).toBe("needs-attention");
    expect(badVisit?.attention).toMatch(/Not your transect/);
    expect((await fieldDb().visits.get(good.visitId))?.outbox).toBe("sent");
  });

  it("when signed out, keeps the records and says to sign in again", async () => {
    const { visitId } = await recordVisit(1);
    await submitVisit(visitId, { endTime: "11:30", completeList: false, notes: null });
    const run = await runOutbox(fakeServer({ status401: true }).fetcher);
    expect(run.signedOut).toBe(true);
    const visit = await fieldDb().visits.get(visitId);
    expect(visit?.outbox).toBe("on-phone");
    expect(visit?.attention).toMatch(/Sign in again/);
  });

  it("sends photos only after their visit, then frees the phone's copy", async () => {
    const server = fakeServer();
    const { visitId, sightingIds } = await recordVisit(1);
    const photoId = await addPhoto(visitId, sightingIds[0]!, new Blob([new Uint8Array(2048)], { type: "image/jpeg" }));
    await submitVisit(visitId, { endTime: "11:30", completeList: false, notes: null });
    await runOutbox(server.fetcher);
    const syncAt = server.requests.indexOf("POST /api/field/sync");
    const ticketAt = server.requests.indexOf("POST /api/field/photos");
    expect(syncAt).toBeGreaterThanOrEqual(0);
    expect(ticketAt).toBeGreaterThan(syncAt);
    expect(server.photos.has(photoId)).toBe(true);
    const photo = await fieldDb().photos.get(photoId);
    expect(photo?.outbox).toBe("sent");
    expect(photo?.blob.size).toBe(0);
  });

  it("refuses edits to a submitted visit", async () => {
    const { visitId } = await recordVisit(1);
    await submitVisit(visitId, { endTime: "11:30", completeList: false, notes: null });
    await expect(addSighting(visitId, { speciesId, count: 1, section: null, latitude: null, longitude: null, accuracyMetres: null, note: null })).rejects.toThrow(/submitted/);
  });
});
