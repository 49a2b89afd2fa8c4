// Splits what the outbox has to send into request bodies the server accepts: no more items of
// each kind than it allows, and no body over its byte limit. Pure, so the limits can be tested.

import { SYNC_PROTOCOL_VERSION } from "@/lib/sync/protocol";

export type BatchLimits = { visits: number; sightings: number; bodyBytes: number; /** Weather reports per batch (default: as many as sightings). */ weather?: number };

/** An item with its JSON as it will travel, and that JSON's size in UTF-8 bytes. */
export type Encoded<T> = { item: T; json: string; bytes: number };

/** A visit to send with its sightings; `visit` is null when the server already has the visit. */
export type VisitGroup<V, S> = { visit: Encoded<V> | null; sightings: Encoded<S>[] };

/** One request's items; weather reports travel in batches of their own (see weatherBatches). */
export type Batch<V, S, W = never> = { visits: Encoded<V>[]; sightings: Encoded<S>[]; weather?: Encoded<W>[]; bytes: number };

const utf8 = new TextEncoder();

export function encode<T>(item: T, payload: unknown): Encoded<T> {
  const json = JSON.stringify(payload);
  return { item, json, bytes: utf8.encode(json).length };
}

/** The request body for a batch, byte for byte what `bytes` was counted from. */
export function batchBody(batch: Batch<unknown, unknown, unknown>): string {
  const weather = batch.weather?.length ? `,${WEATHER_KEY}[${batch.weather.map((w) => w.json).join(",")}]` : "";
  return `{"protocol":${SYNC_PROTOCOL_VERSION},"visits":[${batch.visits.map((v) => v.json).join(",")}],"sightings":[${batch.sightings.map((s) => s.json).join(",")}]${weather}}`;
}

const WEATHER_KEY = `"weatherMisses":`;

const EMPTY_BODY_BYTES = utf8.encode(`{"protocol":${SYNC_PROTOCOL_VERSION},"visits":[],"sightings":[]}`).length;
// `,"weatherMisses":[]` on top of an empty body.
const WEATHER_LIST_BYTES = utf8.encode(`,${WEATHER_KEY}[]`).length;

function emptyBatch<V, S>(): Batch<V, S> {
  return { visits: [], sightings: [], bytes: EMPTY_BODY_BYTES };
}

/** Bytes that adding `items` to a list of `already` entries costs, commas included. */
function addedBytes(already: number, items: { bytes: number }[]): number {
  return items.reduce((sum, item, i) => sum + item.bytes + (already + i > 0 ? 1 : 0), 0);
}

function fits<V, S>(batch: Batch<V, S>, visits: Encoded<V>[], sightings: Encoded<S>[], limits: BatchLimits): boolean {
  return (
    batch.visits.length + visits.length <= limits.visits &&
    batch.sightings.length + sightings.length <= limits.sightings &&
    batch.bytes + addedBytes(batch.visits.length, visits) + addedBytes(batch.sightings.length, sightings) <= limits.bodyBytes
  );
}

/**
 * Packs groups into batches in order. A visit travels with all its sightings when they fit in
 * one batch (starting a new batch rather than splitting them); a visit with more sightings than
 * fit goes with its first sightings, and the rest follow in later batches, which the server
 * accepts because it stores the visit first. An item too large even for an empty batch goes
 * alone: the server then refuses it and the volunteer is told, instead of it blocking the rest.
 */
export function planBatches<V, S>(groups: VisitGroup<V, S>[], limits: BatchLimits): Batch<V, S>[] {
  const batches: Batch<V, S>[] = [];
  let current = emptyBatch<V, S>();
  const close = () => {
    if (current.visits.length || current.sightings.length) batches.push(current);
    current = emptyBatch<V, S>();
  };
  const add = <K extends "visits" | "sightings">(kind: K, item: Batch<V, S>[K][number]) => {
    current.bytes += addedBytes(current[kind].length, [item]);
    (current[kind] as Encoded<unknown>[]).push(item);
  };

  for (const group of groups) {
    if (group.visit) {
      const wholeGroupFitsAlone = fits(emptyBatch<V, S>(), [group.visit], group.sightings, limits);
      if (wholeGroupFitsAlone && !fits(current, [group.visit], group.sightings, limits)) close();
      if (!fits(current, [group.visit], [], limits)) close();
      add("visits", group.visit);
    }
    for (const sighting of group.sightings) {
      if (!fits(current, [], [sighting], limits)) close();
      add("sightings", sighting);
    }
  }
  close();
  return batches;
}

/**
 * Weather reports in batches of their own (a report is a few hundred bytes, so one batch
 * usually holds them all), within the same count and byte limits.
 */
export function weatherBatches<W>(reports: Encoded<W>[], limits: BatchLimits): Batch<never, never, W>[] {
  const perBatch = limits.weather ?? limits.sightings;
  const batches: { weather: Encoded<W>[]; bytes: number }[] = [];
  for (const report of reports) {
    const current = batches.at(-1);
    const fits = current && current.weather.length < perBatch && current.bytes + addedBytes(current.weather.length, [report]) <= limits.bodyBytes;
    // A report too large even for an empty batch goes alone, as in planBatches.
    if (current && fits) {
      current.bytes += addedBytes(current.weather.length, [report]);
      current.weather.push(report);
    } else batches.push({ weather: [report], bytes: EMPTY_BODY_BYTES + WEATHER_LIST_BYTES + report.bytes });
  }
  return batches.map((b) => ({ visits: [], sightings: [], ...b }));
}
