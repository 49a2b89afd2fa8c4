import { belongsTo, fieldUser, phoneStore, type LocalPhoto, type LocalSighting, type LocalVisit } from "./phone-store";

// Local edits. Everything here works with no signal; the outbox sends submitted visits later.
// On a phone shared by several volunteers each walk is its owner's alone: every write checks
// the owner here, whatever screen it comes from (the server checks again on sync).

const now = () => new Date().toISOString();

export const SOMEONE_ELSES_WALK = "This walk belongs to someone else on this phone.";

function signedIn(): string {
  const userId = fieldUser();
  if (!userId) throw new Error("Sign in to record a walk on this phone.");
  return userId;
}

/** The walk, if the signed-in volunteer owns it (a walk whose owner is not known is nobody's yet). */
export async function ownWalk(visitId: string): Promise<LocalVisit> {
  const visit = await phoneStore().visits.get(visitId);
  if (!visit) throw new Error("That walk is not on this phone.");
  if (!belongsTo(visit, fieldUser())) throw new Error(SOMEONE_ELSES_WALK);
  return visit;
}

export type NewVisit = Pick<
  LocalVisit,
  "transectId" | "visitDate" | "startTime" | "temperatureC" | "windBeaufort" | "cloudCoverPercent" | "sky" | "sunshinePercent" | "rain" | "coRecorders"
>;

export async function createVisit(input: NewVisit): Promise<string> {
  const ownerId = signedIn();
  const id = crypto.randomUUID();
  await phoneStore().visits.add({
    ...input,
    id,
    ownerId,
    endTime: null,
    completeList: null, // asked at the end of the walk
    notes: null,
    phase: "draft",
    submittedAt: null,
    updatedAt: now(),
    outbox: "on-phone",
    attention: null,
    attempts: 0,
  });
  return id;
}

async function editableVisit(visitId: string): Promise<LocalVisit> {
  const visit = await ownWalk(visitId);
  if (visit.phase !== "draft") throw new Error("This walk has been submitted and can no longer be changed here.");
  return visit;
}

export async function updateVisit(visitId: string, changes: Partial<Omit<LocalVisit, "id" | "phase" | "outbox">>): Promise<void> {
  await editableVisit(visitId);
  await phoneStore().visits.update(visitId, { ...changes, updatedAt: now() });
}

export type NewSighting = Pick<LocalSighting, "speciesId" | "count" | "section" | "latitude" | "longitude" | "accuracyMetres" | "note">;

export async function addSighting(visitId: string, input: NewSighting): Promise<string> {
  await editableVisit(visitId);
  const id = crypto.randomUUID();
  await phoneStore().sightings.add({ ...input, id, visitId, updatedAt: now(), outbox: "on-phone", attention: null });
  return id;
}

export async function updateSighting(id: string, changes: Partial<NewSighting>): Promise<void> {
  const sighting = await phoneStore().sightings.get(id);
  if (!sighting) throw new Error("That sighting is not on this phone.");
  await editableVisit(sighting.visitId);
  await phoneStore().sightings.update(id, { ...changes, updatedAt: now() });
}

/** Drafts were never sent, so deleting one removes it outright, with its photos. */
export async function deleteSighting(id: string): Promise<void> {
  const db = phoneStore();
  const sighting = await db.sightings.get(id);
  if (!sighting) return;
  await editableVisit(sighting.visitId);
  await db.transaction("rw", db.sightings, db.photos, async () => {
    await db.photos.where("sightingId").equals(id).delete();
    await db.sightings.delete(id);
  });
}

export async function addPhoto(visitId: string, sightingId: string | null, file: Blob): Promise<string> {
  await editableVisit(visitId);
  const id = crypto.randomUUID();
  const photo: LocalPhoto = {
    id,
    visitId,
    sightingId,
    blob: file,
    contentType: file.type || "application/octet-stream",
    bytes: file.size,
    createdAt: now(),
    outbox: "on-phone",
    attention: null,
    attempts: 0,
  };
  await phoneStore().photos.add(photo);
  return id;
}

export async function removePhoto(id: string): Promise<void> {
  const photo = await phoneStore().photos.get(id);
  if (!photo) return;
  await editableVisit(photo.visitId);
  await phoneStore().photos.delete(id);
}

/**
 * Saves a sighting with the photos added and removed in its form, all or nothing: a failure
 * half-way cannot leave a record without its photos for a second tap to store again.
 */
export async function saveSightingWithPhotos(
  visitId: string,
  sightingId: string | null,
  fields: NewSighting,
  photos: { add: Blob[]; remove: string[] },
): Promise<string> {
  const db = phoneStore();
  return db.transaction("rw", db.visits, db.sightings, db.photos, async () => {
    const id = sightingId ? (await updateSighting(sightingId, fields), sightingId) : await addSighting(visitId, fields);
    for (const photoId of photos.remove) {
      if ((await db.photos.get(photoId))?.sightingId === id) await removePhoto(photoId);
    }
    for (const blob of photos.add) await addPhoto(visitId, id, blob);
    return id;
  });
}

export async function deleteDraftVisit(visitId: string): Promise<void> {
  const db = phoneStore();
  await editableVisit(visitId);
  await db.transaction("rw", db.visits, db.sightings, db.photos, async () => {
    await db.photos.where("visitId").equals(visitId).delete();
    await db.sightings.where("visitId").equals(visitId).delete();
    await db.visits.delete(visitId);
  });
}

/** Finishing puts the visit in the outbox; it goes when there is signal. */
export async function submitVisit(visitId: string, finish: { endTime: string; completeList: boolean; notes: string | null }): Promise<void> {
  const db = phoneStore();
  const visit = await editableVisit(visitId);
  // Comparisons use complete lists only, so a walk never leaves without the volunteer's answer.
  if (typeof finish.completeList !== "boolean") throw new Error("Say whether you recorded every species you saw.");
  if (finish.endTime < visit.startTime) throw new Error("The end time is before the start time.");
  const at = now();
  await db.transaction("rw", db.visits, db.sightings, db.photos, async () => {
    await db.visits.update(visitId, { ...finish, phase: "submitted", submittedAt: at, updatedAt: at, outbox: "on-phone", attention: null });
    await db.sightings.where("visitId").equals(visitId).modify({ outbox: "on-phone", attention: null });
    await db.photos.where("visitId").equals(visitId).modify({ outbox: "on-phone", attention: null });
  });
}

/** Lets the volunteer correct a visit the server could not accept, then submit it again. */
export async function returnToDraft(visitId: string): Promise<void> {
  const visit = await ownWalk(visitId);
  if (visit.outbox !== "needs-attention") throw new Error("Only a walk that needs attention can be reopened.");
  await phoneStore().visits.update(visitId, { phase: "draft", outbox: "on-phone" });
}

export type VisitOnPhone = { visit: LocalVisit; sightings: number; photos: number; photosWaiting: number };

/**
 * Visits with anything the server has not yet taken (drafts, waiting, sending, sent back, or
 * photos still to upload), newest first.
 */
export async function visitsStillOnPhone(): Promise<VisitOnPhone[]> {
  const db = phoneStore();
  const [visits, sightings, photos] = await Promise.all([db.visits.toArray(), db.sightings.toArray(), db.photos.toArray()]);
  const unsent = (item: { outbox: string }) => item.outbox !== "sent";
  return visits
    .filter((v) => unsent(v) || sightings.some((s) => s.visitId === v.id && unsent(s)) || photos.some((p) => p.visitId === v.id && unsent(p)))
    .sort((a, b) => b.visitDate.localeCompare(a.visitDate) || b.startTime.localeCompare(a.startTime))
    .map((visit) => {
      const own = photos.filter((p) => p.visitId === visit.id);
      return { visit, sightings: sightings.filter((s) => s.visitId === visit.id).length, photos: own.length, photosWaiting: own.filter(unsent).length };
    });
}
