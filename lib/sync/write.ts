import "server-only";
import { sql } from "drizzle-orm";
import type { BatchTx } from "./batch-transaction";
import { sightings, visits } from "@/db/schema";
import type { SightingRow } from "./sightings";
import { executePrepared } from "./prepared";
import { uuidArray } from "./sql-arrays";
import type { VisitRow } from "./visits";

/** Raised when the database disagrees with what the batch read moments before: the batch is retried. */
export class BatchRaced extends Error {
  constructor(what: string, options?: { cause?: unknown }) {
    super(`sync batch raced with another writer on ${what}`, options);
    this.name = "BatchRaced";
  }
}

// Each write counts the rows it touched and hands the count to sync_expect_rows() (migration
// 0001), which raises serialization_failure when a rule in the WHERE clause left a row out:
// another writer got there after the batch's read. That aborts the transaction in PostgreSQL
// itself, so the COMMIT queued behind the writes rolls back, and the batch is retried.
export async function guarded(what: string, expected: number, write: Promise<{ n: string | number }[]>): Promise<void> {
  const rows = await write.catch((error: unknown) => {
    if ((error as { code?: unknown }).code === "40001") throw new BatchRaced(what, { cause: error });
    throw error;
  });
  if (Number(rows[0]?.n) !== expected) throw new BatchRaced(what); // unreachable while the guard function stands
}

// Rows travel as one JSON parameter unpacked by json_to_recordset: the statement text is the
// same for any batch size (so it is prepared once per connection), and building it costs next to nothing,
// where a generated multi-row VALUES list costs milliseconds per batch to assemble.
// The upserts repeat the conflict rules in their WHERE clauses, so a row another transaction
// created or reviewed after our read is left alone; the short count then triggers a retry.

export function upsertVisits(tx: BatchTx, rows: VisitRow[]): Promise<void> {
  if (!rows.length) return Promise.resolve();
  const json = JSON.stringify(
    rows.map((v) => ({
      id: v.id, transect_id: v.transectId, volunteer_id: v.volunteerId, season_id: v.seasonId, visit_date: v.visitDate,
      start_time: v.startTime, end_time: v.endTime, temperature_c: v.temperatureC, wind_beaufort: v.windBeaufort,
      cloud_cover_percent: v.cloudCoverPercent, sky: v.sky, sunshine_percent: v.sunshinePercent, rain: v.rain,
      co_recorders: v.coRecorders, complete_list: v.completeList, notes: v.notes, submitted_at: v.submittedAt, client_updated_at: v.clientUpdatedAt,
    })),
  );
  return guarded("visits", rows.length, executePrepared(tx, sql`
    with written as (
    insert into ${visits} as cur (id, transect_id, volunteer_id, season_id, visit_date, start_time, end_time, temperature_c,
      wind_beaufort, cloud_cover_percent, sky, sunshine_percent, rain, co_recorders, complete_list, notes, submitted_at, client_updated_at)
    select id, transect_id, volunteer_id, season_id, visit_date, start_time, end_time, temperature_c,
      wind_beaufort, cloud_cover_percent, sky::sky, sunshine_percent, rain::rain, co_recorders, complete_list, notes, submitted_at, client_updated_at
    from json_to_recordset(${json}::json) as r(id uuid, transect_id uuid, volunteer_id uuid, season_id uuid, visit_date date,
      start_time time, end_time time, temperature_c double precision, wind_beaufort smallint, cloud_cover_percent smallint,
      sky text, sunshine_percent smallint, rain text, co_recorders text, complete_list boolean, notes text, submitted_at timestamptz, client_updated_at timestamptz)
    on conflict (id) do update set
      transect_id = excluded.transect_id, season_id = excluded.season_id, visit_date = excluded.visit_date,
      start_time = excluded.start_time, end_time = excluded.end_time, temperature_c = excluded.temperature_c,
      wind_beaufort = excluded.wind_beaufort, cloud_cover_percent = excluded.cloud_cover_percent, sky = excluded.sky,
      sunshine_percent = excluded.sunshine_percent, rain = excluded.rain,
      co_recorders = excluded.co_recorders, complete_list = excluded.complete_list, notes = excluded.notes,
      submitted_at = excluded.submitted_at, client_updated_at = excluded.client_updated_at, updated_at = now()
    where cur.volunteer_id = excluded.volunteer_id
      and (cur.client_updated_at is null or cur.client_updated_at <= excluded.client_updated_at)
      and not exists (select 1 from ${sightings} s where s.visit_id = cur.id and (s.status <> 'pending' or s.reviewed_at is not null))
    returning cur.id)
    select sync_expect_rows(count(*), ${rows.length}, 'visits') as n from written`));
}

export function upsertSightings(tx: BatchTx, volunteerId: string, rows: SightingRow[]): Promise<void> {
  if (!rows.length) return Promise.resolve();
  const json = JSON.stringify(
    rows.map((s) => ({
      id: s.id, visit_id: s.visitId, species_id: s.speciesId, count: s.count, section: s.section, latitude: s.latitude,
      longitude: s.longitude, accuracy_metres: s.accuracyMetres, note: s.note, client_updated_at: s.clientUpdatedAt,
    })),
  );
  return guarded("sightings", rows.length, executePrepared(tx, sql`
    with written as (
    insert into ${sightings} as cur (id, visit_id, species_id, count, section, latitude, longitude, accuracy_metres, note, client_updated_at)
    select id, visit_id, species_id, count, section, latitude, longitude, accuracy_metres, note, client_updated_at
    from json_to_recordset(${json}::json) as r(id uuid, visit_id uuid, species_id uuid, count integer, section smallint,
      latitude double precision, longitude double precision, accuracy_metres double precision, note text, client_updated_at timestamptz)
    on conflict (id) do update set
      visit_id = excluded.visit_id, species_id = excluded.species_id, count = excluded.count, section = excluded.section,
      latitude = excluded.latitude, longitude = excluded.longitude, accuracy_metres = excluded.accuracy_metres,
      note = excluded.note, client_updated_at = excluded.client_updated_at, updated_at = now()
    where cur.status = 'pending' and cur.reviewed_at is null
      and (cur.client_updated_at is null or cur.client_updated_at <= excluded.client_updated_at)
      and exists (select 1 from ${visits} v where v.id = cur.visit_id and v.volunteer_id = ${volunteerId})
    returning cur.id)
    select sync_expect_rows(count(*), ${rows.length}, 'sightings') as n from written`));
}

export function deletePendingSightings(tx: BatchTx, ids: string[]): Promise<void> {
  if (!ids.length) return Promise.resolve();
  return guarded("deleted sightings", ids.length, executePrepared(tx, sql`
    with gone as (delete from ${sightings} where id = any(${uuidArray(ids)}) and status = 'pending' and reviewed_at is null returning id)
    select sync_expect_rows(count(*), ${ids.length}, 'deleted sightings') as n from gone`));
}
