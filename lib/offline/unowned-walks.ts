import { phoneStore, type LocalVisit } from "./phone-store";

// Walks stored before the phone kept owners (store version 1) have no owner. They are nobody's
// until a volunteer says they are theirs: until then nothing opens, edits or sends them. A
// volunteer who says they are not theirs no longer sees them; they stay on the phone for the
// volunteer who made them.

export type UnownedWalk = { visit: LocalVisit; sightings: number; photos: number };

const unsent = (item: { outbox: string }) => item.outbox !== "sent";

/** The walks with no owner that this volunteer has not set aside, with anything still to send, oldest first. */
export async function unownedWalks(userId: string): Promise<UnownedWalk[]> {
  const db = phoneStore();
  const visits = await db.visits.filter((v) => v.ownerId == null && !(v.leftBy ?? []).includes(userId)).toArray();
  const ids = visits.map((v) => v.id);
  const [sightings, photos] = await Promise.all([db.sightings.where("visitId").anyOf(ids).toArray(), db.photos.where("visitId").anyOf(ids).toArray()]);
  return visits
    .filter((v) => unsent(v) || sightings.some((s) => s.visitId === v.id && unsent(s)) || photos.some((p) => p.visitId === v.id && unsent(p)))
    .sort((a, b) => a.visitDate.localeCompare(b.visitDate) || a.startTime.localeCompare(b.startTime))
    .map((visit) => ({
      visit,
      sightings: sightings.filter((s) => s.visitId === visit.id).length,
      photos: photos.filter((p) => p.visitId === visit.id).length,
    }));
}

/** "These are mine": the walks become this volunteer's (only those still without an owner). Returns how many. */
export async function claimWalks(userId: string, visitIds: string[]): Promise<number> {
  return phoneStore()
    .visits.where("id")
    .anyOf(visitIds)
    .filter((v) => v.ownerId == null)
    .modify({ ownerId: userId });
}

/** "Not mine": the walks stay on the phone as they are, no longer shown to this volunteer. */
export async function leaveWalks(userId: string, visitIds: string[]): Promise<void> {
  await phoneStore()
    .visits.where("id")
    .anyOf(visitIds)
    .filter((v) => v.ownerId == null)
    .modify((v) => {
      v.leftBy = [...new Set([...(v.leftBy ?? []), userId])];
    });
}
