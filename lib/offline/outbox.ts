import { settledStatuses, type ItemResult, type SightingPayload, type SyncResponse, type VisitPayload } from "@/lib/sync/protocol";
import { fieldDb, type LocalSighting, type LocalVisit } from "./db";
import { sendPhotos } from "./photo-upload";

export type OutboxRun = { sent: number; needsAttention: number; offline: boolean; signedOut: boolean };

const MAX_VISITS_PER_BATCH = 10;

function toVisitPayload(v: LocalVisit): VisitPayload {
  return {
    id: v.id,
    transectId: v.transectId,
    visitDate: v.visitDate,
    startTime: v.startTime,
    endTime: v.endTime,
    temperatureC: v.temperatureC,
    windBeaufort: v.windBeaufort,
    cloudCoverPercent: v.cloudCoverPercent,
    sky: v.sky,
    coRecorders: v.coRecorders,
    completeList: v.completeList,
    notes: v.notes,
    submittedAt: v.submittedAt,
    clientUpdatedAt: v.updatedAt,
  };
}

function toSightingPayload(s: LocalSighting): SightingPayload {
  return {
    id: s.id,
    visitId: s.visitId,
    speciesId: s.speciesId,
    count: s.count,
    section: s.section,
    latitude: s.latitude,
    longitude: s.longitude,
    accuracyMetres: s.accuracyMetres,
    note: s.note,
    clientUpdatedAt: s.updatedAt,
  };
}

function describe(result: ItemResult): string {
  if (result.status === "forbidden") return result.reason ?? "This transect is not assigned to you any more.";
  const fieldMessages = Object.entries(result.errors ?? {}).map(([field, msgs]) => `${field}: ${msgs.join(" ")}`);
  return [result.reason, ...fieldMessages].filter(Boolean).join("; ") || "The server could not accept this item.";
}

/**
 * Submitted visits waiting to go. "sending" ones are included: a tab closed mid-request leaves
 * them so, and resending is safe because the server is idempotent by id. Visits that need the
 * volunteer's attention wait until they are corrected and submitted again.
 */
async function pendingVisits(): Promise<LocalVisit[]> {
  const all = await fieldDb().visits.where("phase").equals("submitted").toArray();
  return all.filter((v) => v.outbox === "on-phone" || v.outbox === "sending");
}

/**
 * One pass of the outbox: sends submitted visits with their sightings, then their photos.
 * Items move on-phone -> sending -> sent, or to needs-attention with the server's reason.
 * A failure of the network leaves everything on the phone for the next pass.
 */
export async function runOutbox(fetcher: typeof fetch = fetch): Promise<OutboxRun> {
  const db = fieldDb();
  const run: OutboxRun = { sent: 0, needsAttention: 0, offline: false, signedOut: false };
  const visits = await pendingVisits();
  for (let i = 0; i < visits.length; i += MAX_VISITS_PER_BATCH) {
    const batch = visits.slice(i, i + MAX_VISITS_PER_BATCH);
    const visitIds = batch.map((v) => v.id);
    const sightings = (await db.sightings.where("visitId").anyOf(visitIds).toArray()).filter((s) => s.outbox !== "sent");
    await db.transaction("rw", db.visits, db.sightings, async () => {
      await db.visits.where("id").anyOf(visitIds).modify({ outbox: "sending" });
      await db.sightings.where("id").anyOf(sightings.map((s) => s.id)).modify({ outbox: "sending" });
    });

    let response: Response;
    try {
      response = await fetcher("/api/field/sync", {
        method: "POST",
        credentials: "same-origin",
        headers: { "Content-Type": "application/json" },
        body: JSON.stringify({ visits: batch.map(toVisitPayload), sightings: sightings.map(toSightingPayload) }),
      });
    } catch {
      await backToPhone(visitIds, sightings.map((s) => s.id));
      run.offline = true;
      return run;
    }
    if (response.status === 401) {
      await backToPhone(visitIds, sightings.map((s) => s.id), "Sign in again to send these records.");
      run.signedOut = true;
      return run;
    }
    let body: SyncResponse | null = null;
    try {
      body = (await response.json()) as SyncResponse;
    } catch {
      body = null;
    }
    if (!body || !Array.isArray(body.results)) {
      // A server error or an unexpected answer: keep everything and try again later.
      await backToPhone(visitIds, sightings.map((s) => s.id), `The server could not take them just now (${response.status}); trying again soon.`);
      run.offline = true;
      return run;
    }
    await applyResults(body.results, batch, sightings, run);
  }
  await sendPhotos(fetcher, run);
  return run;
}

/** Leaves items on the phone for the next pass, with a note the outbox can show. */
async function backToPhone(visitIds: string[], sightingIds: string[], note?: string) {
  const db = fieldDb();
  await db.transaction("rw", db.visits, db.sightings, async () => {
    await db.visits.where("id").anyOf(visitIds).modify((v) => {
      v.outbox = "on-phone";
      v.attention = note ?? null;
      v.attempts += 1;
    });
    await db.sightings.where("id").anyOf(sightingIds).modify({ outbox: "on-phone" });
  });
}

async function applyResults(results: ItemResult[], visits: LocalVisit[], sightings: LocalSighting[], run: OutboxRun) {
  const db = fieldDb();
  const byKey = new Map(results.map((r) => [`${r.kind}:${r.index}`, r]));
  await db.transaction("rw", db.visits, db.sightings, async () => {
    for (const [index, v] of visits.entries()) {
      const r = byKey.get(`visit:${index}`);
      if (r && settledStatuses.includes(r.status)) {
        await db.visits.update(v.id, { outbox: "sent", attention: null });
        run.sent++;
      } else {
        await db.visits.update(v.id, { outbox: "needs-attention", attention: r ? describe(r) : "The server did not answer for this visit." });
        run.needsAttention++;
      }
    }
    for (const [index, s] of sightings.entries()) {
      const r = byKey.get(`sighting:${index}`);
      if (r && settledStatuses.includes(r.status)) {
        await db.sightings.update(s.id, { outbox: "sent", attention: null });
        run.sent++;
      } else {
        await db.sightings.update(s.id, { outbox: "needs-attention", attention: r ? describe(r) : "no answer for this record" });
        run.needsAttention++;
        // The visit is not done until all its sightings are.
        await db.visits.update(s.visitId, { outbox: "needs-attention", attention: "A record in this visit needs attention." });
      }
    }
  });
}
