import { belongsTo, phoneStore, isWaiting } from "./phone-store";

/**
 * Whether an outbox pass for this volunteer would find anything to send, from cheap reads, so
 * the sending code (./outbox.ts, loaded on demand) does not weigh on every field page. It errs
 * towards yes: visits with no owner yet count (a pass claims them), and so does any waiting photo.
 */
export async function hasWorkToSend(userId: string): Promise<boolean> {
  const db = phoneStore();
  const visits = await db.visits.filter((v) => belongsTo(v, userId)).toArray();
  if (visits.some((v) => v.ownerId == null)) return true;
  const submitted = visits.filter((v) => v.phase === "submitted" && v.outbox !== "needs-attention");
  if (submitted.some((v) => isWaiting(v.outbox))) return true;
  if (submitted.length) {
    const sightings = await db.sightings.where("visitId").anyOf(submitted.map((v) => v.id)).filter((s) => isWaiting(s.outbox)).count();
    if (sightings > 0) return true;
  }
  return (await db.photos.filter((p) => isWaiting(p.outbox)).count()) > 0;
}
