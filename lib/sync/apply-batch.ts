import "server-only";
import type { Actor } from "@/lib/auth/guard";
import { invalid } from "@/lib/errors";
import { fieldErrorsOf } from "@/lib/validation";
import {
  batchStatus,
  sightingPayload,
  syncEnvelope,
  visitPayloadFor,
  weatherPayload,
  type ItemResult,
  type SightingPayload,
  type SyncResponse,
  type VisitPayload,
  type WeatherPayload,
} from "./contract";
import { inBatchTransaction, type BatchTx, type BatchWork } from "./batch-transaction";
import { parseItems, type ParsedItems } from "./parse";
import { loadServerState } from "./server-state";
import { planSightings } from "./sightings";
import { planVisits, serverStanding, type VisitStanding } from "./visits";
import { insertWeatherMisses, loadStoredMisses, planWeather } from "./weather";
import { BatchRaced, deletePendingSightings, upsertSightings, upsertVisits } from "./write";

export type SyncOutcome = { status: 200 | 400 | 403; response: SyncResponse };

const MAX_ATTEMPTS = 3;
// Serialization failure, deadlock, unique violation: all mean a parallel writer got there first.
const RETRYABLE_CODES = new Set(["40001", "40P01", "23505"]);

function isRetryable(error: unknown): boolean {
  for (let e: unknown = error; e; e = (e as { cause?: unknown }).cause) {
    if (e instanceof BatchRaced) return true;
    const code = (e as { code?: unknown }).code;
    if (typeof code === "string" && RETRYABLE_CODES.has(code)) return true;
  }
  return false;
}

const byIndex = (a: ItemResult, b: ItemResult) => a.index - b.index;

type ParsedBatch = { visits: ParsedItems<VisitPayload>; sightings: ParsedItems<SightingPayload>; weather: ParsedItems<WeatherPayload> };

async function applyInTransaction(tx: BatchTx, begun: Promise<unknown>, actor: Actor, batch: ParsedBatch): Promise<BatchWork<ItemResult[]>> {
  const { visits: parsedVisits, sightings: parsedSightings, weather: parsedWeather } = batch;
  const visitItems = parsedVisits.valid.map((v) => v.value);
  const sightingItems = parsedSightings.valid.map((s) => s.value);

  const [state, storedMisses] = await Promise.all([
    loadServerState(tx, actor, {
      visitIds: [...new Set([...visitItems.map((v) => v.id), ...sightingItems.map((s) => s.visitId)])],
      sightingIds: sightingItems.map((s) => s.id),
      speciesIds: [...new Set(sightingItems.filter((s) => !s.deleted).map((s) => s.speciesId))],
    }),
    loadStoredMisses(tx, actor, parsedWeather.valid.map((w) => w.value)),
    begun, // nothing is written unless the transaction really began
  ]);

  const visitPlan = planVisits(actor, parsedVisits.valid, state);
  const standingOf = (visitId: string): VisitStanding => visitPlan.standings.get(visitId) ?? serverStanding(actor, visitId, state);
  const sightingPlan = planSightings(actor.id, parsedSightings.valid, state, standingOf);
  const weatherPlan = planWeather(actor, parsedWeather.valid, state, storedMisses);

  // Sent now, in this order, on the batch's connection (the visits land before the sightings
  // that reference them); the COMMIT follows in the same network write.
  const written = Promise.all([
    upsertVisits(tx, visitPlan.writes),
    upsertSightings(tx, actor.id, sightingPlan.writes),
    deletePendingSightings(tx, sightingPlan.deletes),
    insertWeatherMisses(tx, weatherPlan.writes),
  ]);

  const value = [
    ...[...visitPlan.results, ...parsedVisits.rejected].sort(byIndex),
    ...[...sightingPlan.results, ...parsedSightings.rejected].sort(byIndex),
    ...[...weatherPlan.results, ...parsedWeather.rejected].sort(byIndex),
  ];
  return { value, written };
}

/**
 * Applies one batch from a volunteer's phone: validates the envelope (a malformed one is a 400
 * AppError), then every item on its own, and writes all accepted items in one transaction.
 * Safe to resend: ids come from the phone, so a repeat reports "unchanged" and writes nothing.
 */
export async function applySyncBatch(actor: Actor, body: unknown): Promise<SyncOutcome> {
  const envelope = syncEnvelope.safeParse(body);
  if (!envelope.success) throw invalid(fieldErrorsOf(envelope.error), "The sync batch is not in the expected shape.");
  const batch: ParsedBatch = {
    // The envelope's protocol decides what a visit must carry (from 2: the complete-list answer).
    visits: parseItems("visit", envelope.data.visits, visitPayloadFor(envelope.data.protocol)),
    sightings: parseItems("sighting", envelope.data.sightings, sightingPayload),
    weather: parseItems("weather", envelope.data.weatherMisses, weatherPayload),
  };

  if (!batch.visits.valid.length && !batch.sightings.valid.length && !batch.weather.valid.length) {
    // Nothing to write: answer without touching the database.
    const results = [...batch.visits.rejected, ...batch.sightings.rejected, ...batch.weather.rejected];
    return { status: batchStatus(results), response: { results, serverTime: new Date().toISOString() } };
  }
  for (let attempt = 1; ; attempt++) {
    try {
      const results = await inBatchTransaction((tx, begun) => applyInTransaction(tx, begun, actor, batch));
      return { status: batchStatus(results), response: { results, serverTime: new Date().toISOString() } };
    } catch (error) {
      if (attempt >= MAX_ATTEMPTS || !isRetryable(error)) throw error;
    }
  }
}
