import "fake-indexeddb/auto";
import { beforeEach, describe, expect, it } from "vitest";
import { acknowledgeKeptOnServer } from "@/lib/offline/outbox";
import { PhoneStore, phoneStore, setPhoneStore, setFieldUser } from "@/lib/offline/phone-store";
import { removeRefusedPhoto } from "@/lib/offline/photo-upload";
import {
  addPhoto,
  addSighting,
  createVisit,
  deleteDraftVisit,
  deleteSighting,
  removePhoto,
  returnToDraft,
  saveSightingWithPhotos,
  submitVisit,
  updateSighting,
  updateVisit,
} from "@/lib/offline/records";

// On a phone shared by several volunteers, each one's walks are theirs alone: every local write
// refuses a walk of someone else (or of nobody known), not only the screen that offers it.
const alice = "3d5e7f90-1a2b-4c3d-8e4f-5a6b7c8d9e0f";
const bruno = "9a8b7c6d-5e4f-4a3b-8c2d-1e0f9a8b7c6d";
const transectId = "6f1c1f7e-2b7a-4c1e-9a55-5d2f0c7b9a10";
const speciesId = "0b6f7a3c-8a35-4f3e-b6a4-1f2a3b4c5d6e";
const fields = { speciesId, count: 1, section: 1, latitude: null, longitude: null, accuracyMetres: null, note: null };
const photo = () => new Blob([new Uint8Array(32)], { type: "image/jpeg" });

/** Alice's draft with one sighting and one photo, as the store holds it. */
async function alicesDraft() {
  setFieldUser(alice);
  const visitId = await createVisit({ transectId, visitDate: "2026-06-14", startTime: "10:30", temperatureC: null, windBeaufort: null, cloudCoverPercent: null, sky: null, coRecorders: null });
  const sightingId = await addSighting(visitId, fields);
  const photoId = await addPhoto(visitId, sightingId, photo());
  return { visitId, sightingId, photoId };
}

async function snapshot() {
  const db = phoneStore();
  return { visits: await db.visits.toArray(), sightings: await db.sightings.toArray(), photos: (await db.photos.toArray()).map(({ blob: _b, ...p }) => p) };
}

describe("local writes check the walk's owner", () => {
  beforeEach(() => {
    setPhoneStore(new PhoneStore(`test-${crypto.randomUUID()}`));
    setFieldUser(null);
  });

  it("lets the owner change their own draft", async () => {
    const { visitId, sightingId } = await alicesDraft();
    await updateSighting(sightingId, { count: 4 });
    await updateVisit(visitId, { notes: "Windy" });
    expect((await phoneStore().sightings.get(sightingId))?.count).toBe(4);
    expect((await phoneStore().visits.get(visitId))?.notes).toBe("Windy");
  });

  it("refuses every write to another volunteer's walk and changes nothing", async () => {
    const { visitId, sightingId, photoId } = await alicesDraft();
    const before = await snapshot();
    setFieldUser(bruno);
    const attempts: [string, () => Promise<unknown>][] = [
      ["updateVisit", () => updateVisit(visitId, { notes: "not mine" })],
      ["addSighting", () => addSighting(visitId, fields)],
      ["updateSighting", () => updateSighting(sightingId, { count: 9 })],
      ["deleteSighting", () => deleteSighting(sightingId)],
      ["addPhoto", () => addPhoto(visitId, sightingId, photo())],
      ["removePhoto", () => removePhoto(photoId)],
      ["saveSightingWithPhotos", () => saveSightingWithPhotos(visitId, null, fields, { add: [photo()], remove: [] })],
      ["saveSightingWithPhotos (edit)", () => saveSightingWithPhotos(visitId, sightingId, fields, { add: [], remove: [photoId] })],
      ["submitVisit", () => submitVisit(visitId, { endTime: "11:00", completeList: true, notes: null })],
      ["deleteDraftVisit", () => deleteDraftVisit(visitId)],
    ];
    for (const [name, attempt] of attempts) {
      await expect(attempt(), name).rejects.toThrow("This walk belongs to someone else on this phone.");
    }
    expect(await snapshot()).toEqual(before);
  });

  it("refuses to reopen another volunteer's walk that the server sent back", async () => {
    const { visitId } = await alicesDraft();
    await submitVisit(visitId, { endTime: "11:00", completeList: true, notes: null });
    await phoneStore().visits.update(visitId, { outbox: "needs-attention", attention: "Check the date." });
    setFieldUser(bruno);
    await expect(returnToDraft(visitId)).rejects.toThrow("This walk belongs to someone else on this phone.");
    expect((await phoneStore().visits.get(visitId))?.phase).toBe("submitted");
  });

  it("leaves another volunteer's notes and refused photos for them to deal with", async () => {
    const { visitId, photoId } = await alicesDraft();
    await submitVisit(visitId, { endTime: "11:00", completeList: true, notes: null });
    await phoneStore().visits.update(visitId, { outbox: "sent", keptOnServer: { visit: true, sightings: 0 } });
    await phoneStore().photos.update(photoId, { outbox: "needs-attention", attention: "Too large." });
    setFieldUser(bruno);
    await expect(acknowledgeKeptOnServer(visitId)).rejects.toThrow("This walk belongs to someone else on this phone.");
    await expect(removeRefusedPhoto(photoId)).rejects.toThrow("This walk belongs to someone else on this phone.");
    expect((await phoneStore().visits.get(visitId))?.keptOnServer).toEqual({ visit: true, sightings: 0 });
    expect(await phoneStore().photos.get(photoId)).toBeDefined();
    setFieldUser(alice);
    await acknowledgeKeptOnServer(visitId);
    await removeRefusedPhoto(photoId);
    expect((await phoneStore().visits.get(visitId))?.keptOnServer).toBeNull();
    expect(await phoneStore().photos.get(photoId)).toBeUndefined();
  });

  it("refuses a walk whose owner the phone does not know until someone claims it", async () => {
    const { visitId, sightingId } = await alicesDraft();
    await phoneStore().visits.update(visitId, { ownerId: null });
    await expect(updateSighting(sightingId, { count: 2 })).rejects.toThrow("This walk belongs to someone else on this phone.");
    await expect(deleteDraftVisit(visitId)).rejects.toThrow("This walk belongs to someone else on this phone.");
    expect(await phoneStore().visits.get(visitId)).toBeDefined();
  });

  it("starts no walk while nobody is signed in, so no new walk is left without an owner", async () => {
    await expect(createVisit({ transectId, visitDate: "2026-06-14", startTime: "10:30", temperatureC: null, windBeaufort: null, cloudCoverPercent: null, sky: null, coRecorders: null })).rejects.toThrow(/sign in/i);
    expect(await phoneStore().visits.count()).toBe(0);
  });
});
