import "server-only";
import { and, inArray, isNull, eq, sql } from "drizzle-orm";
import type { Transaction } from "@/db/client";
import { sightings, visits } from "@/db/schema";
import type { SightingRow } from "./sightings";
import type { VisitRow } from "./visits";

/** Raised when the database disagrees with what the batch read moments before: the batch is retried. */
export class BatchRaced extends Error {
  constructor(what: string) {
    super(`sync batch raced with another writer on ${what}`);
    this.name = "BatchRaced";
  }
}

const excluded = (column: string) => sql.raw(`excluded.${column}`);

// The upserts repeat the conflict rules in their WHERE clauses, so a row that another
// transaction created or reviewed after our read is left alone; a short count then triggers a retry.
export async function upsertVisits(tx: Transaction, rows: VisitRow[]): Promise<void> {
  if (!rows.length) return;
  const written = await tx
    .insert(visits)
    .values(rows)
    .onConflictDoUpdate({
      target: visits.id,
      set: {
        transectId: excluded("transect_id"),
        seasonId: excluded("season_id"),
        visitDate: excluded("visit_date"),
        startTime: excluded("start_time"),
        endTime: excluded("end_time"),
        temperatureC: excluded("temperature_c"),
        windBeaufort: excluded("wind_beaufort"),
        cloudCoverPercent: excluded("cloud_cover_percent"),
        sky: excluded("sky"),
        coRecorders: excluded("co_recorders"),
        completeList: excluded("complete_list"),
        notes: excluded("notes"),
        submittedAt: excluded("submitted_at"),
        clientUpdatedAt: excluded("client_updated_at"),
        updatedAt: sql`now()`,
      },
      setWhere: sql`${visits.volunteerId} = excluded.volunteer_id
        and (${visits.clientUpdatedAt} is null or ${visits.clientUpdatedAt} <= excluded.client_updated_at)
        and not exists (select 1 from ${sightings} s where s.visit_id = ${visits.id} and (s.status <> 'pending' or s.reviewed_at is not null))`,
    })
    .returning({ id: visits.id });
  if (written.length !== rows.length) throw new BatchRaced("visits");
}

export async function upsertSightings(tx: Transaction, volunteerId: string, rows: SightingRow[]): Promise<void> {
  if (!rows.length) return;
  const written = await tx
    .insert(sightings)
    .values(rows)
    .onConflictDoUpdate({
      target: sightings.id,
      set: {
        visitId: excluded("visit_id"),
        speciesId: excluded("species_id"),
        count: excluded("count"),
        section: excluded("section"),
        latitude: excluded("latitude"),
        longitude: excluded("longitude"),
        accuracyMetres: excluded("accuracy_metres"),
        note: excluded("note"),
        clientUpdatedAt: excluded("client_updated_at"),
        updatedAt: sql`now()`,
      },
      setWhere: sql`${sightings.status} = 'pending' and ${sightings.reviewedAt} is null
        and (${sightings.clientUpdatedAt} is null or ${sightings.clientUpdatedAt} <= excluded.client_updated_at)
        and exists (select 1 from ${visits} v where v.id = ${sightings.visitId} and v.volunteer_id = ${volunteerId})`,
    })
    .returning({ id: sightings.id });
  if (written.length !== rows.length) throw new BatchRaced("sightings");
}

export async function deletePendingSightings(tx: Transaction, ids: string[]): Promise<void> {
  if (!ids.length) return;
  const gone = await tx
    .delete(sightings)
    .where(and(inArray(sightings.id, ids), eq(sightings.status, "pending"), isNull(sightings.reviewedAt)))
    .returning({ id: sightings.id });
  if (gone.length !== ids.length) throw new BatchRaced("deleted sightings");
}
