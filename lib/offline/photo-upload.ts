import { photoErrorCodes, type PhotoUploadTicket } from "@/lib/photos/protocol";
import { phoneStore, isWaiting, type LocalPhoto } from "./phone-store";
import type { OutboxRun } from "./outbox";
import { ownWalk } from "./records";
import { isPassingFault, readServerError } from "./server-answers";

/**
 * How one photo's upload ended: sent; a passing fault (server or store error, upload lost) to
 * retry later; signed out; or refused by the server for good (wrong type, too large...).
 */
type Outcome = { kind: "sent" } | { kind: "retry"; note: string } | { kind: "signed-out" } | { kind: "refused"; reason: string };

const retryNote = (status: number) => `Not sent yet: Turnstone could not take it just now (${status}); trying again soon.`;

async function refusalOrRetry(res: Response): Promise<Outcome> {
  if (res.status === 401) return { kind: "signed-out" };
  if (isPassingFault(res.status)) return { kind: "retry", note: retryNote(res.status) };
  const error = await readServerError(res);
  // Completion before the file reached the store: upload it again.
  if (error.code === photoErrorCodes.notUploaded) return { kind: "retry", note: "The upload did not arrive; sending it again soon." };
  return { kind: "refused", reason: error.message ?? `Turnstone did not take this photo (${res.status}).` };
}

/**
 * Ticket, upload straight to the object store, then ask the server to check and process it.
 * A thrown error means the network failed; the caller keeps the photo for the next pass.
 */
async function sendOne(fetcher: typeof fetch, photo: LocalPhoto): Promise<Outcome> {
  const ticketRes = await fetcher("/api/field/photos", {
    method: "POST",
    credentials: "same-origin",
    headers: { "Content-Type": "application/json" },
    body: JSON.stringify({ id: photo.id, visitId: photo.visitId, sightingId: photo.sightingId, contentType: photo.contentType, bytes: photo.bytes }),
  });
  if (ticketRes.status === 409) return { kind: "sent" }; // the server already has it, processed
  if (!ticketRes.ok) return refusalOrRetry(ticketRes);
  const ticket = (await ticketRes.json()) as PhotoUploadTicket;
  const put = await fetcher(ticket.uploadUrl, { method: "PUT", headers: ticket.headers, body: photo.blob });
  // The store's refusals (an expired link, a hiccup) pass with a fresh ticket on the next pass.
  if (!put.ok) return { kind: "retry", note: `The photo store answered ${put.status}; trying again soon.` };
  const done = await fetcher(`/api/field/photos/${photo.id}/complete`, { method: "POST", credentials: "same-origin" });
  return done.ok ? { kind: "sent" } : refusalOrRetry(done);
}

/**
 * Sends this volunteer's photos whose visit (and sighting) the server already has. A network
 * failure or 401 stops the pass; a passing fault on one photo asks for a retry and moves on.
 */
export async function sendPhotos(fetcher: typeof fetch, run: OutboxRun, userId: string): Promise<void> {
  const db = phoneStore();
  const waiting = (await db.photos.toArray()).filter((p) => isWaiting(p.outbox));
  for (const photo of waiting) {
    const visit = await db.visits.get(photo.visitId);
    const sighting = photo.sightingId ? await db.sightings.get(photo.sightingId) : null;
    if (visit?.ownerId !== userId || visit.outbox !== "sent" || (sighting && sighting.outbox !== "sent")) continue;
    await db.photos.update(photo.id, { outbox: "sending" });
    let outcome: Outcome;
    try {
      outcome = await sendOne(fetcher, photo);
    } catch {
      await db.photos.update(photo.id, { outbox: "on-phone", attempts: photo.attempts + 1 });
      run.offline = true;
      run.retryLater = true;
      return;
    }
    switch (outcome.kind) {
      case "sent":
        // The server keeps the photo now; free the phone's storage.
        await db.photos.update(photo.id, { outbox: "sent", attention: null, blob: new Blob([], { type: photo.contentType }) });
        run.sent++;
        break;
      case "retry":
        await db.photos.update(photo.id, { outbox: "on-phone", attention: outcome.note, attempts: photo.attempts + 1 });
        run.retryLater = true;
        break;
      case "signed-out":
        await db.photos.update(photo.id, { outbox: "on-phone", attention: "Sign in again to send this photo." });
        run.signedOut = true;
        return;
      case "refused":
        await db.photos.update(photo.id, { outbox: "needs-attention", attention: outcome.reason });
        run.needsAttention++;
        break;
    }
  }
}

/** Removes a photo the server refused for good (it will never upload) from this phone. */
export async function removeRefusedPhoto(photoId: string): Promise<void> {
  const photos = phoneStore().photos;
  const photo = await photos.get(photoId);
  if (photo?.outbox !== "needs-attention") throw new Error("Only a photo Turnstone refused can be removed here.");
  await ownWalk(photo.visitId);
  await photos.delete(photoId);
}
