import { belongsTo, phoneStore, isWaiting } from "./phone-store";

/**
 * Whether an outbox pass for this volunteer would find anything to send (weather reports, walks,
 * records, photos), from cheap reads, so
 * the sending code (./outbox.ts, loaded on demand) does not weigh on every field page. Only this
 * volunteer's own visits count: not someone else's, nor a visit whose owner the phone does not
 * know (nobody's until a volunteer says it is theirs). It errs towards yes for their photos.
 */
export async function hasWorkToSend(userId: string): Promise<boolean> {
  const db = phoneStore();
  if ((await db.weatherMisses.where("ownerId").equals(userId).filter((w) => isWaiting(w.outbox)).count()) > 0) return true;
  const visits = await db.visits.filter((v) => belongsTo(v, userId)).toArray();
  const submitted = visits.filter((v) => v.phase === "submitted" && v.outbox !== "needs-attention");
  if (submitted.some((v) => isWaiting(v.outbox))) return true;
  if (submitted.length) {
    const sightings = await db.sightings.where("visitId").anyOf(submitted.map((v) => v.id)).filter((s) => isWaiting(s.outbox)).count();
    if (sightings > 0) return true;
  }
  const photos = await db.photos.where("visitId").anyOf(visits.map((v) => v.id)).filter((p) => isWaiting(p.outbox)).count();
  return photos > 0;
}
