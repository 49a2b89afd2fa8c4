import "fake-indexeddb/auto";
import Dexie from "dexie";
import { beforeEach, describe, expect, it } from "vitest";
import { PhoneStore, phoneStore, setPhoneStore, setFieldUser } from "@/lib/offline/phone-store";
import { runOutbox, unsentOnPhone } from "@/lib/offline/outbox";
import { addPhoto, addSighting, createVisit, submitVisit } from "@/lib/offline/records";
import { claimWalks } from "@/lib/offline/unowned-walks";
import { fakeServer } from "./fake-sync-server";

const alice = "3d5e7f90-1a2b-4c3d-8e4f-5a6b7c8d9e0f";
const bruno = "9a8b7c6d-5e4f-4a3b-8c2d-1e0f9a8b7c6d";
const transectId = "6f1c1f7e-2b7a-4c1e-9a55-5d2f0c7b9a10";
const speciesId = "0b6f7a3c-8a35-4f3e-b6a4-1f2a3b4c5d6e";

async function visitBy(userId: string, options: { submit?: boolean; sightings?: number; photo?: boolean } = {}) {
  setFieldUser(userId);
  const visitId = await createVisit({ transectId, visitDate: "2026-06-14", startTime: "10:30", temperatureC: 19, windBeaufort: 2, cloudCoverPercent: 20, sky: "mostly_sunny", coRecorders: null });
  for (let i = 0; i < (options.sightings ?? 1); i++) {
    await addSighting(visitId, { speciesId, count: 1, section: 1, latitude: null, longitude: null, accuracyMetres: null, note: null });
  }
  if (options.photo) await addPhoto(visitId, null, new Blob([new Uint8Array(64)], { type: "image/jpeg" }));
  if (options.submit ?? true) await submitVisit(visitId, { endTime: "11:30", completeList: true, notes: null });
  return visitId;
}

describe("a phone shared by several volunteers", () => {
  beforeEach(async () => {
    setPhoneStore(new PhoneStore(`test-${crypto.randomUUID()}`));
    setFieldUser(null);
  });

  it("stamps new visits with the signed-in volunteer", async () => {
    const visitId = await visitBy(alice, { submit: false });
    expect((await phoneStore().visits.get(visitId))?.ownerId).toBe(alice);
  });

  it("sends only the signed-in volunteer's visits, sightings and photos", async () => {
    const mine = await visitBy(alice, { sightings: 2, photo: true });
    const theirs = await visitBy(bruno, { sightings: 3, photo: true });
    const server = fakeServer();
    const run = await runOutbox(alice, server.fetcher);
    expect(run.sent).toBe(4); // visit, two sightings, one photo
    expect([...server.visits.keys()]).toEqual([mine]);
    expect(server.sightings.size).toBe(2);
    expect(server.photos.size).toBe(1);
    expect(await phoneStore().visits.get(theirs)).toMatchObject({ outbox: "on-phone", ownerId: bruno });
    expect(await phoneStore().photos.where("visitId").equals(theirs).first()).toMatchObject({ outbox: "on-phone" });
    // Their items go when they sign in on this phone.
    await runOutbox(bruno, server.fetcher);
    expect(server.visits.has(theirs)).toBe(true);
    expect(server.sightings.size).toBe(5);
  });

  it("upgrades an older store: a visit without an owner is sent for nobody until a volunteer says it is theirs", async () => {
    const name = `test-${crypto.randomUUID()}`;
    // The store as version 1 of the phone code left it.
    const old = new Dexie(name);
    old.version(1).stores({ visits: "id, transectId, phase, outbox, visitDate", sightings: "id, visitId, outbox", photos: "id, visitId, sightingId, outbox", reference: "key", meta: "key" });
    const legacyId = "5b4c3d2e-1f0a-4b9c-8d7e-6f5a4b3c2d1e";
    await old.table("visits").add({
      id: legacyId, transectId, visitDate: "2026-05-02", startTime: "09:00", endTime: "10:00", temperatureC: 17, windBeaufort: 1, cloudCoverPercent: 10,
      sky: "clear", coRecorders: null, completeList: true, notes: null, phase: "submitted", submittedAt: "2026-05-02T10:00:00.000Z",
      updatedAt: "2026-05-02T10:00:00.000Z", outbox: "on-phone", attention: null, attempts: 0,
    });
    await old.table("sightings").add({
      id: "6c5d4e3f-2a1b-4c0d-9e8f-7a6b5c4d3e2f", visitId: legacyId, speciesId, count: 2, section: 1, latitude: null, longitude: null,
      accuracyMetres: null, note: null, updatedAt: "2026-05-02T09:30:00.000Z", outbox: "on-phone", attention: null,
    });
    old.close();

    const db = new PhoneStore(name);
    setPhoneStore(db);
    await db.open();
    expect(db.verno).toBe(3);
    expect((await db.visits.get(legacyId))?.ownerId).toBeNull();
    // The walk keeps its complete-list answer from before the question had no default.
    expect((await db.visits.get(legacyId))?.completeList).toBe(true);
    // Nobody's: not counted as anyone's unsent work, and not sent by whoever syncs first.
    expect(await unsentOnPhone(alice)).toEqual({ visits: 0, sightings: 0, photos: 0, weatherReports: 0 });
    const server = fakeServer();
    await runOutbox(alice, server.fetcher);
    await runOutbox(bruno, server.fetcher);
    expect(server.bodies).toEqual([]);
    expect(await db.visits.get(legacyId)).toMatchObject({ ownerId: null, outbox: "on-phone" });

    // Once Alice says it is hers, it is sent with her records, and it is no one else's.
    expect(await claimWalks(alice, [legacyId])).toBe(1);
    expect((await unsentOnPhone(alice)).visits).toBe(1);
    await runOutbox(alice, server.fetcher);
    expect(server.visits.has(legacyId)).toBe(true);
    expect(server.sightings.size).toBe(1);
    expect((await db.visits.get(legacyId))?.ownerId).toBe(alice);
    expect(await claimWalks(bruno, [legacyId])).toBe(0);
    expect((await db.visits.get(legacyId))?.ownerId).toBe(alice);
  });

  it("counts what the signed-in volunteer has not sent, drafts included, and nobody else's", async () => {
    await visitBy(alice, { submit: false, sightings: 2 });
    await visitBy(alice, { sightings: 1, photo: true });
    await visitBy(bruno, { sightings: 4, photo: true });
    expect(await unsentOnPhone(alice)).toEqual({ visits: 2, sightings: 3, photos: 1, weatherReports: 0 });
    await runOutbox(alice, fakeServer().fetcher);
    expect(await unsentOnPhone(alice)).toEqual({ visits: 1, sightings: 2, photos: 0, weatherReports: 0 });
    expect(await unsentOnPhone(bruno)).toEqual({ visits: 1, sightings: 4, photos: 1, weatherReports: 0 });
  });
});
