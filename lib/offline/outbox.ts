import { MAX_BATCH_ITEMS, MAX_SYNC_BODY_BYTES, type ItemResult, type SightingPayload, type SyncResponse, type VisitPayload, type WeatherPayload } from "@/lib/sync/protocol";
import { belongsTo, phoneStore, isWaiting, type LocalSighting, type LocalVisit, type LocalWeatherMiss, type OutboxState } from "./phone-store";
import { batchBody, encode, planBatches, weatherBatches, type BatchLimits, type VisitGroup } from "./outbox-batches";
import { applyResults, backToPhone, refuseBatch, setSightings, type OutboxBatch } from "./outbox-results";
import { sendPhotos } from "./photo-upload";
import { ownWalk } from "./records";
import { isPassingFault, readServerError } from "./server-answers";

/**
 * What one batch may hold. Item counts come from the contract (lib/sync/contract.ts syncEnvelope
 * allows MAX_BATCH_ITEMS visits and as many sightings). Few visits per batch, so that a batch
 * refused as a whole holds back few visits.
 */
export const OUTBOX_LIMITS: BatchLimits = {
  visits: Math.min(10, MAX_BATCH_ITEMS),
  sightings: MAX_BATCH_ITEMS,
  weather: MAX_BATCH_ITEMS,
  bodyBytes: MAX_SYNC_BODY_BYTES,
};

export type OutboxRun = {
  sent: number;
  needsAttention: number;
  /** Sent, but the server kept its reviewed (or newer) copy: the volunteer is told. */
  keptOnServer: number;
  offline: boolean;
  signedOut: boolean;
  /** Something failed that may pass (no signal, a server or photo store fault): try again later. */
  retryLater: boolean;
};

export const SIGN_IN_AGAIN = "Sign in again to send what is on this phone.";

function toVisitPayload(v: LocalVisit): VisitPayload {
  const payload: Omit<VisitPayload, "completeList"> = {
    id: v.id,
    transectId: v.transectId,
    visitDate: v.visitDate,
    startTime: v.startTime,
    endTime: v.endTime,
    temperatureC: v.temperatureC,
    windBeaufort: v.windBeaufort,
    cloudCoverPercent: v.cloudCoverPercent,
    sky: v.sky,
    sunshinePercent: v.sunshinePercent ?? null,
    rain: v.rain ?? null,
    coRecorders: v.coRecorders,
    notes: v.notes,
    submittedAt: v.submittedAt,
    clientUpdatedAt: v.updatedAt,
  };
  // A submitted walk has its answer (submitVisit asks for it); were it missing, the server would say so.
  return (v.completeList === null ? payload : { ...payload, completeList: v.completeList }) as VisitPayload;
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

function toWeatherPayload(w: LocalWeatherMiss): WeatherPayload {
  return { id: w.id, transectId: w.transectId, reportedOn: w.reportedOn, clientUpdatedAt: w.clientUpdatedAt };
}

/** This volunteer's weather reports still to send ("sending" too: resending is safe, ids are the phone's). */
async function pendingWeather(userId: string) {
  const reports = await phoneStore().weatherMisses.where("ownerId").equals(userId).filter((w) => isWaiting(w.outbox)).toArray();
  reports.sort((a, b) => a.clientUpdatedAt.localeCompare(b.clientUpdatedAt) || a.id.localeCompare(b.id));
  return reports.map((w) => encode(w, toWeatherPayload(w)));
}

/**
 * This volunteer's submitted visits still to send, each with its sightings still to send. A
 * "sending" item is included: a tab closed mid-request leaves it so, and resending is safe
 * because the server is idempotent by id. A visit the server already has can still have
 * sightings waiting (a visit split over batches). Visits that need attention wait until the
 * volunteer corrects and submits them again.
 */
async function pendingGroups(userId: string): Promise<VisitGroup<LocalVisit, LocalSighting>[]> {
  const db = phoneStore();
  const visits = (await db.visits.where("ownerId").equals(userId).toArray())
    .filter((v) => v.phase === "submitted" && v.outbox !== "needs-attention")
    .sort((a, b) => (a.submittedAt ?? "").localeCompare(b.submittedAt ?? "") || a.id.localeCompare(b.id));
  const sightings = await db.sightings.where("visitId").anyOf(visits.map((v) => v.id)).toArray();
  sightings.sort((a, b) => a.updatedAt.localeCompare(b.updatedAt) || a.id.localeCompare(b.id));
  return visits.flatMap((visit) => {
    const resendVisit = isWaiting(visit.outbox);
    const toSend = sightings.filter((s) => s.visitId === visit.id && (resendVisit ? s.outbox !== "sent" : isWaiting(s.outbox)));
    if (!resendVisit && toSend.length === 0) return [];
    return [{ visit: resendVisit ? encode(visit, toVisitPayload(visit)) : null, sightings: toSend.map((s) => encode(s, toSightingPayload(s))) }];
  });
}

type SyncAnswer =
  | { kind: "results"; results: ItemResult[] }
  | { kind: "signed-out" }
  | { kind: "retry"; note: string }
  | { kind: "refused"; message: string };

async function readSyncAnswer(response: Response): Promise<SyncAnswer> {
  if (response.status === 401) return { kind: "signed-out" };
  if (isPassingFault(response.status)) return { kind: "retry", note: `Turnstone could not take them just now (${response.status}); trying again soon.` };
  const body = (await response.clone().json().catch(() => null)) as Partial<SyncResponse> | null;
  if (body && Array.isArray(body.results)) return { kind: "results", results: body.results };
  if (response.status >= 400) {
    // A refusal of the whole batch (malformed, too large): sending it again would meet the same answer.
    const { message } = await readServerError(response);
    return { kind: "refused", message: message ?? `Turnstone did not take these walks and sightings (${response.status}).` };
  }
  // A 2xx that is not our answer (a Wi-Fi sign-in page, say): nothing was confirmed, try later.
  return { kind: "retry", note: "Turnstone's answer could not be read; trying again soon." };
}

/**
 * One pass of the outbox for the signed-in volunteer: sends their weather reports, then their
 * submitted visits with their sightings in batches within the server's limits, then their photos. Items move on-phone ->
 * sending -> sent, or to needs-attention with the server's reason. No signal or a server fault
 * leaves everything on the phone and asks for a retry; a 401 keeps everything and asks the
 * volunteer to sign in again.
 */
export async function runOutbox(userId: string, fetcher: typeof fetch = fetch): Promise<OutboxRun> {
  const run: OutboxRun = { sent: 0, needsAttention: 0, keptOnServer: 0, offline: false, signedOut: false, retryLater: false };
  // Weather reports first: they are small, and a week's report matters while the week lasts.
  const batches: OutboxBatch[] = [...weatherBatches(await pendingWeather(userId), OUTBOX_LIMITS), ...planBatches(await pendingGroups(userId), OUTBOX_LIMITS)];
  // Visits that needed attention in an earlier batch: their later sightings wait with them.
  const held = new Set<string>();
  for (const planned of batches) {
    const batch: OutboxBatch = { ...planned, sightings: planned.sightings.filter((s) => !held.has(s.item.visitId)) };
    if (!batch.visits.length && !batch.sightings.length && !batch.weather?.length) continue;
    if ((await sendBatch(batch, fetcher, run, held)) === "stop") return run;
  }
  await sendPhotos(fetcher, run, userId);
  return run;
}

async function sendBatch(batch: OutboxBatch, fetcher: typeof fetch, run: OutboxRun, held: Set<string>): Promise<"next" | "stop"> {
  const db = phoneStore();
  const visitIds = batch.visits.map((v) => v.item.id);
  const sightingIds = batch.sightings.map((s) => s.item.id);
  const weatherIds = (batch.weather ?? []).map((w) => w.item.id);
  await db.transaction("rw", db.visits, db.sightings, db.weatherMisses, async () => {
    await db.visits.where("id").anyOf(visitIds).modify({ outbox: "sending" });
    await setSightings(sightingIds, { outbox: "sending" });
    await db.weatherMisses.where("id").anyOf(weatherIds).modify({ outbox: "sending" });
  });
  const ids = { visitIds, sightingIds, weatherIds };

  let answer: SyncAnswer;
  try {
    const response = await fetcher("/api/field/sync", {
      method: "POST",
      credentials: "same-origin",
      headers: { "Content-Type": "application/json" },
      body: batchBody(batch),
    });
    answer = await readSyncAnswer(response);
  } catch {
    await backToPhone(ids);
    run.offline = true;
    run.retryLater = true;
    return "stop";
  }
  switch (answer.kind) {
    case "signed-out":
      await backToPhone(ids, SIGN_IN_AGAIN);
      run.signedOut = true;
      return "stop";
    case "retry":
      await backToPhone(ids, answer.note);
      run.retryLater = true;
      return "stop";
    case "refused":
      await refuseBatch(batch, answer.message, run, held);
      return "next";
    case "results":
      await applyResults(answer.results, batch, run, held);
      return "next";
  }
}

export type UnsentOnPhone = { visits: number; sightings: number; photos: number; weatherReports?: number };

/** What this volunteer has on the phone that the server does not have yet, drafts included. */
export async function unsentOnPhone(userId: string): Promise<UnsentOnPhone> {
  const db = phoneStore();
  const visits = (await db.visits.toArray()).filter((v) => belongsTo(v, userId));
  const visitIds = visits.map((v) => v.id);
  const [sightings, photos, weatherReports] = await Promise.all([
    db.sightings.where("visitId").anyOf(visitIds).toArray(),
    db.photos.where("visitId").anyOf(visitIds).toArray(),
    db.weatherMisses.where("ownerId").equals(userId).toArray(),
  ]);
  const unsent = (items: { outbox: OutboxState }[]) => items.filter((i) => i.outbox !== "sent").length;
  return { visits: unsent(visits), sightings: unsent(sightings), photos: unsent(photos), weatherReports: unsent(weatherReports) };
}

/** The volunteer has read that the server kept its copy; the note can go. */
export async function acknowledgeKeptOnServer(visitId: string): Promise<void> {
  await ownWalk(visitId);
  await phoneStore().visits.update(visitId, { keptOnServer: null });
}
