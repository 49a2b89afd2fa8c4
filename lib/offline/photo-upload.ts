import type { PhotoUploadTicket } from "@/lib/photos/contract";
import { fieldDb, type LocalPhoto } from "./db";
import type { OutboxRun } from "./outbox";

async function readError(res: Response): Promise<{ code: string | null; message: string }> {
  try {
    const body = (await res.json()) as { error?: { code?: string; message?: string } };
    return { code: body.error?.code ?? null, message: body.error?.message ?? `The server refused the photo (${res.status}).` };
  } catch {
    return { code: null, message: `The server refused the photo (${res.status}).` };
  }
}

type Step = { ok: true } | { ok: false; retry: boolean; reason: string };

/** Ticket, upload straight to the object store, then ask the server to check and process it. */
async function sendOne(fetcher: typeof fetch, photo: LocalPhoto): Promise<Step> {
  const ticketRes = await fetcher("/api/field/photos", {
    method: "POST",
    credentials: "same-origin",
    headers: { "Content-Type": "application/json" },
    body: JSON.stringify({ id: photo.id, visitId: photo.visitId, sightingId: photo.sightingId, contentType: photo.contentType, bytes: photo.bytes }),
  });
  if (ticketRes.status === 409) return { ok: true }; // the server already has it, processed
  if (!ticketRes.ok) return { ok: false, retry: ticketRes.status >= 500 || ticketRes.status === 401, reason: (await readError(ticketRes)).message };
  const ticket = (await ticketRes.json()) as PhotoUploadTicket;
  const put = await fetcher(ticket.uploadUrl, { method: "PUT", headers: ticket.headers, body: photo.blob });
  if (!put.ok) return { ok: false, retry: true, reason: `The photo store answered ${put.status}; trying again soon.` };
  const done = await fetcher(`/api/field/photos/${photo.id}/complete`, { method: "POST", credentials: "same-origin" });
  if (done.ok) return { ok: true };
  const error = await readError(done);
  // The upload got lost on the way: keep the photo and upload it again on the next pass.
  const lost = error.code === "photo_not_uploaded";
  return { ok: false, retry: lost || done.status >= 500 || done.status === 401, reason: error.message };
}

/** Sends photos whose visit the server already has. Network failures leave them on the phone. */
export async function sendPhotos(fetcher: typeof fetch, run: OutboxRun): Promise<void> {
  const db = fieldDb();
  const waiting = (await db.photos.toArray()).filter((p) => p.outbox === "on-phone" || p.outbox === "sending");
  for (const photo of waiting) {
    const visit = await db.visits.get(photo.visitId);
    const sighting = photo.sightingId ? await db.sightings.get(photo.sightingId) : null;
    if (visit?.outbox !== "sent" || (sighting && sighting.outbox !== "sent")) continue;
    await db.photos.update(photo.id, { outbox: "sending" });
    let step: Step;
    try {
      step = await sendOne(fetcher, photo);
    } catch {
      await db.photos.update(photo.id, { outbox: "on-phone", attempts: photo.attempts + 1 });
      run.offline = true;
      return;
    }
    if (step.ok) {
      // The server keeps the photo now; free the phone's storage.
      await db.photos.update(photo.id, { outbox: "sent", attention: null, blob: new Blob([], { type: photo.contentType }) });
      run.sent++;
    } else if (step.retry) {
      await db.photos.update(photo.id, { outbox: "on-phone", attention: step.reason, attempts: photo.attempts + 1 });
    } else {
      await db.photos.update(photo.id, { outbox: "needs-attention", attention: step.reason });
      run.needsAttention++;
    }
  }
}
