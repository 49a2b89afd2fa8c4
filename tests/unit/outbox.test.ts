import "fake-indexeddb/auto";
import { beforeEach, describe, expect, it } from "vitest";
import { PhoneStore, phoneStore, setPhoneStore, setFieldUser } from "@/lib/offline/phone-store";
import { runOutbox } from "@/lib/offline/outbox";
import { addPhoto, addSighting, createVisit, submitVisit } from "@/lib/offline/records";
import { fakeServer } from "./fake-sync-server";

const userId = "3d5e7f90-1a2b-4c3d-8e4f-5a6b7c8d9e0f";
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

const submit = (visitId: string) => submitVisit(visitId, { endTime: "11:30", completeList: true, notes: null });

describe("the outbox", () => {
  beforeEach(async () => {
    const db = new PhoneStore(`test-${crypto.randomUUID()}`);
    setPhoneStore(db);
    setFieldUser(userId);
    await db.open();
  });

  it("drafts never leave the phone; a submitted visit does", async () => {
    const server = fakeServer();
    const { visitId } = await recordVisit(2);
    await runOutbox(userId, server.fetcher);
    expect(server.visits.size).toBe(0);
    await submit(visitId);
    const run = await runOutbox(userId, server.fetcher);
    expect(run.sent).toBe(3);
    expect(server.visits.size).toBe(1);
    expect(server.sightings.size).toBe(2);
    expect((await phoneStore().visits.get(visitId))?.outbox).toBe("sent");
  });

  it("with no network, keeps everything on the phone, reports offline and asks for a retry", async () => {
    const { visitId, sightingIds } = await recordVisit(5);
    await submit(visitId);
    const run = await runOutbox(userId, fakeServer({ down: true }).fetcher);
    expect(run).toMatchObject({ offline: true, retryLater: true });
    expect((await phoneStore().visits.get(visitId))?.outbox).toBe("on-phone");
    const kept = await phoneStore().sightings.bulkGet(sightingIds);
    expect(kept.every((s) => s?.outbox === "on-phone")).toBe(true);
  });

  it("creates each record exactly once when an answer is lost and the batch is sent again", async () => {
    const server = fakeServer({ loseSyncAnswers: 1 });
    const { visitId, sightingIds } = await recordVisit(3);
    await submit(visitId);

    const first = await runOutbox(userId, server.fetcher);
    // The server stored the batch, but the phone never heard: it keeps everything and retries.
    expect(first.retryLater).toBe(true);
    expect(server.writes).toHaveLength(4);
    expect((await phoneStore().visits.get(visitId))?.outbox).toBe("on-phone");

    const second = await runOutbox(userId, server.fetcher);
    expect(second.sent).toBe(4);
    expect(server.answers).toHaveLength(2);
    expect(server.answers[1]!.map((r) => r.status)).toEqual(["unchanged", "unchanged", "unchanged", "unchanged"]);
    const createdIds = server.writes.filter((w) => w.op === "create").map((w) => w.id);
    expect(createdIds.sort()).toEqual([visitId, ...sightingIds].sort());
    expect(server.writes.filter((w) => w.op === "update")).toEqual([]);
    expect((await phoneStore().visits.get(visitId))?.outbox).toBe("sent");
  });

  it("resends items a closed tab left 'sending' without storing anything twice", async () => {
    const server = fakeServer();
    const { visitId } = await recordVisit(3);
    await submit(visitId);
    await runOutbox(userId, server.fetcher);
    // A tab closed before the answer arrived: the phone still thinks it is sending.
    await phoneStore().visits.update(visitId, { outbox: "sending" });
    await phoneStore().sightings.where("visitId").equals(visitId).modify({ outbox: "sending" });
    await runOutbox(userId, server.fetcher);
    expect(server.answers[1]!.every((r) => r.status === "unchanged")).toBe(true);
    expect(server.writes.filter((w) => w.op === "create")).toHaveLength(4);
    expect(new Set(server.writes.map((w) => w.id)).size).toBe(server.writes.length);
    expect((await phoneStore().visits.get(visitId))?.outbox).toBe("sent");
  });

  it("marks a refused visit as needing attention with the server's reason, and sends the rest", async () => {
    const server = fakeServer({ forbidTransect: "11111111-1111-4111-8111-111111111111" });
    const bad = await recordVisit(1, "11111111-1111-4111-8111-111111111111");
    const good = await recordVisit(1);
    await submit(bad.visitId);
    await submit(good.visitId);
    await runOutbox(userId, server.fetcher);
    const badVisit = await phoneStore().visits.get(bad.visitId);
    expect(badVisit?.outbox).toBe("needs-attention");
    expect(badVisit?.attention).toMatch(/Not your transect/);
    expect((await phoneStore().visits.get(good.visitId))?.outbox).toBe("sent");
  });

  it("when signed out, keeps the records, says to sign in again and does not ask for a timed retry", async () => {
    const { visitId } = await recordVisit(1);
    await submit(visitId);
    const run = await runOutbox(userId, fakeServer({ status401: true }).fetcher);
    expect(run).toMatchObject({ signedOut: true, retryLater: false });
    const visit = await phoneStore().visits.get(visitId);
    expect(visit?.outbox).toBe("on-phone");
    expect(visit?.attention).toMatch(/Sign in again/);
  });

  it("keeps items on the phone after a server error and asks for a retry", async () => {
    const server = fakeServer({ syncOverride: () => new Response("<html>Bad gateway</html>", { status: 502 }) });
    const { visitId, sightingIds } = await recordVisit(2);
    await submit(visitId);
    const run = await runOutbox(userId, server.fetcher);
    expect(run).toMatchObject({ retryLater: true, needsAttention: 0 });
    expect((await phoneStore().visits.get(visitId))?.outbox).toBe("on-phone");
    expect((await phoneStore().sightings.bulkGet(sightingIds)).map((s) => s?.outbox)).toEqual(["on-phone", "on-phone"]);
  });

  it("a 4xx without per-item results puts the batch in 'needs attention' with the server's message instead of retrying", async () => {
    const message = "The sync batch is not in the expected shape.";
    const server = fakeServer({ syncOverride: () => new Response(JSON.stringify({ error: { code: "invalid", message } }), { status: 400 }) });
    const { visitId, sightingIds } = await recordVisit(2);
    await submit(visitId);
    const run = await runOutbox(userId, server.fetcher);
    expect(run).toMatchObject({ retryLater: false, needsAttention: 3, sent: 0 });
    const visit = await phoneStore().visits.get(visitId);
    expect(visit).toMatchObject({ outbox: "needs-attention", attention: message });
    expect((await phoneStore().sightings.bulkGet(sightingIds)).every((s) => s?.outbox === "needs-attention" && s.attention === message)).toBe(true);
    // Not sent again on the next pass: it waits for the volunteer.
    await runOutbox(userId, server.fetcher);
    expect(server.bodies).toHaveLength(1);
  });

  it("a 413 without a readable body still says why, with its status", async () => {
    const server = fakeServer({ syncOverride: () => new Response("Payload Too Large", { status: 413 }) });
    const { visitId } = await recordVisit(1);
    await submit(visitId);
    await runOutbox(userId, server.fetcher);
    expect(await phoneStore().visits.get(visitId)).toMatchObject({ outbox: "needs-attention", attention: expect.stringContaining("413") });
  });

  it("tells the volunteer when the server kept its reviewed copy, and does not count it as sent", async () => {
    const server = fakeServer();
    const { visitId, sightingIds } = await recordVisit(2);
    await submit(visitId);
    await runOutbox(userId, server.fetcher);
    // A checker reviews one sighting; the volunteer then corrects the visit and sends it again.
    const reviewed = sightingIds[0]!;
    const afterReview = fakeServer({ reviewed: new Set([reviewed]) });
    afterReview.sightings.set(reviewed, "reviewed copy");
    afterReview.visits.set(visitId, "server copy");
    await phoneStore().visits.update(visitId, { outbox: "on-phone" });
    await phoneStore().sightings.update(reviewed, { count: 40, outbox: "on-phone" });
    const run = await runOutbox(userId, afterReview.fetcher);
    expect(run.keptOnServer).toBe(1);
    expect(run.sent).toBe(1); // the visit itself was updated
    const visit = await phoneStore().visits.get(visitId);
    expect(visit?.outbox).toBe("sent");
    expect(visit?.keptOnServer).toEqual({ visit: false, sightings: 1 });
    expect((await phoneStore().sightings.get(reviewed))?.outbox).toBe("sent");
  });

  it("refuses edits to a submitted visit", async () => {
    const { visitId } = await recordVisit(1);
    await submit(visitId);
    await expect(addSighting(visitId, { speciesId, count: 1, section: null, latitude: null, longitude: null, accuracyMetres: null, note: null })).rejects.toThrow(/submitted/);
  });
});

describe("photos in the outbox", () => {
  beforeEach(async () => {
    const db = new PhoneStore(`test-${crypto.randomUUID()}`);
    setPhoneStore(db);
    setFieldUser(userId);
    await db.open();
  });

  async function visitWithPhoto() {
    const { visitId, sightingIds } = await recordVisit(1);
    const photoId = await addPhoto(visitId, sightingIds[0]!, new Blob([new Uint8Array(2048)], { type: "image/jpeg" }));
    await submit(visitId);
    return photoId;
  }

  it("sends photos only after their visit, then frees the phone's copy", async () => {
    const server = fakeServer();
    const photoId = await visitWithPhoto();
    await runOutbox(userId, server.fetcher);
    const syncAt = server.requests.indexOf("POST /api/field/sync");
    const ticketAt = server.requests.indexOf("POST /api/field/photos");
    expect(syncAt).toBeGreaterThanOrEqual(0);
    expect(ticketAt).toBeGreaterThan(syncAt);
    expect(server.photos.has(photoId)).toBe(true);
    const photo = await phoneStore().photos.get(photoId);
    expect(photo?.outbox).toBe("sent");
    expect(photo?.blob.size).toBe(0);
  });

  it.each([
    ["a server error on the ticket", "ticket", 503],
    ["a failed PUT to the store", "put", 500],
    ["a store refusing an expired link", "put", 403],
    ["a server error on completion", "complete", 500],
  ] as const)("keeps the photo and asks for a retry after %s", async (_what, step, status) => {
    let failing = true;
    const server = fakeServer({ photoOverride: (s) => (failing && s === step ? new Response("fault", { status }) : undefined) });
    const photoId = await visitWithPhoto();
    const run = await runOutbox(userId, server.fetcher);
    expect(run.retryLater).toBe(true);
    expect(await phoneStore().photos.get(photoId)).toMatchObject({ outbox: "on-phone", attempts: 1 });
    failing = false;
    const retry = await runOutbox(userId, server.fetcher);
    expect(retry.retryLater).toBe(false);
    expect((await phoneStore().photos.get(photoId))?.outbox).toBe("sent");
  });

  it("keeps the photo and asks for a retry when the network fails mid-upload", async () => {
    const photoId = await visitWithPhoto();
    const server = fakeServer();
    const dropped = await runOutbox(userId, fakeServer({ photoOverride: () => { throw new TypeError("Failed to fetch"); } }).fetcher);
    expect(dropped).toMatchObject({ offline: true, retryLater: true });
    expect((await phoneStore().photos.get(photoId))?.outbox).toBe("on-phone");
    const run = await runOutbox(userId, server.fetcher);
    expect(run.sent).toBe(1);
    expect(server.photos.has(photoId)).toBe(true);
  });

  it("uploads again when completion says the file never arrived", async () => {
    let lost = true;
    const server = fakeServer({
      photoOverride: (step) => (lost && step === "complete" ? new Response(JSON.stringify({ error: { code: "photo_not_uploaded", message: "Upload the file first." } }), { status: 400 }) : undefined),
    });
    const photoId = await visitWithPhoto();
    expect((await runOutbox(userId, server.fetcher)).retryLater).toBe(true);
    lost = false;
    await runOutbox(userId, server.fetcher);
    expect(server.requests.filter((r) => r.startsWith("PUT http://store.test/"))).toHaveLength(2);
    expect((await phoneStore().photos.get(photoId))?.outbox).toBe("sent");
  });

  it.each([
    ["the ticket", "ticket", { code: "invalid", message: "Some fields need attention.", fields: { bytes: ["Photos can be at most 15 MB."] } }, /at most 15 MB/],
    ["the completion", "complete", { code: "photo_refused", message: "This is not a photo we can use (HEIC from this phone)." }, /not a photo we can use/],
  ] as const)("shows a photo refused on %s with the server's reason and stops sending it", async (_what, step, error, reason) => {
    const server = fakeServer({ photoOverride: (s) => (s === step ? new Response(JSON.stringify({ error }), { status: 400 }) : undefined) });
    const photoId = await visitWithPhoto();
    const run = await runOutbox(userId, server.fetcher);
    expect(run).toMatchObject({ needsAttention: 1, retryLater: false });
    const photo = await phoneStore().photos.get(photoId);
    expect(photo?.outbox).toBe("needs-attention");
    expect(photo?.attention).toMatch(reason);
    const before = server.requests.length;
    await runOutbox(userId, server.fetcher);
    expect(server.requests.length).toBe(before);
  });

  it("lets the volunteer remove a refused photo from the phone, and only a refused one", async () => {
    const { removeRefusedPhoto } = await import("@/lib/offline/photo-upload");
    const server = fakeServer({ photoOverride: (s) => (s === "complete" ? new Response(JSON.stringify({ error: { code: "photo_refused", message: "Too many pixels." } }), { status: 400 }) : undefined) });
    const refused = await visitWithPhoto();
    await runOutbox(userId, server.fetcher);
    const waiting = await visitWithPhoto();
    await expect(removeRefusedPhoto(waiting)).rejects.toThrow(/refused/);
    await removeRefusedPhoto(refused);
    expect(await phoneStore().photos.get(refused)).toBeUndefined();
    expect(await phoneStore().photos.get(waiting)).toBeDefined();
  });
});

describe("the outbox and the walk's sunshine and rain", () => {
  beforeEach(async () => {
    const db = new PhoneStore(`test-${crypto.randomUUID()}`);
    setPhoneStore(db);
    setFieldUser(userId);
    await db.open();
  });

  const sentVisits = (bodies: string[]) => bodies.flatMap((b) => (JSON.parse(b) as { visits: Record<string, unknown>[] }).visits);

  it("sends both with the walk, and null for a walk stored before they were asked", async () => {
    const server = fakeServer();
    const withThem = await createVisit({ transectId, visitDate: "2026-06-14", startTime: "11:00", temperatureC: 15, windBeaufort: 2, cloudCoverPercent: null, sky: null, sunshinePercent: 70, rain: "light", coRecorders: null });
    const older = await createVisit({ transectId, visitDate: "2026-06-15", startTime: "11:00", temperatureC: 15, windBeaufort: 2, cloudCoverPercent: null, sky: null, coRecorders: null });
    await submit(withThem);
    await submit(older);
    const run = await runOutbox(userId, server.fetcher);
    expect(run.sent).toBe(2);
    const sent = new Map(sentVisits(server.bodies).map((v) => [v.id, v]));
    expect(sent.get(withThem)).toMatchObject({ sunshinePercent: 70, rain: "light" });
    expect(sent.get(older)).toMatchObject({ sunshinePercent: null, rain: null });
  });
});
