import "server-only";
import { eq, getTableColumns, sql } from "drizzle-orm";
import type { BatchTx } from "./batch-transaction";
import { seasons, sightings, species, transectAssignments, transects, visits } from "@/db/schema";
import type { Actor } from "@/lib/auth/guard";
import { executePrepared } from "./prepared";
import { uuidArray } from "./sql-arrays";

export type ServerVisit = typeof visits.$inferSelect & { sectionCount: number; hasReviewed: boolean };
export type ServerSighting = typeof sightings.$inferSelect & { ownerId: string };
export type SeasonSpan = { id: string; startsOn: string; endsOn: string };

/** Everything one batch needs to know about the server, read in a fixed handful of queries. */
export type ServerState = {
  /** Section counts of every transect the volunteer is assigned to (stored visits are checked too). */
  assigned: Map<string, number>;
  visits: Map<string, ServerVisit>;
  sightings: Map<string, ServerSighting>;
  knownSpecies: Set<string>;
  seasons: SeasonSpan[];
};

export type StateKeys = { visitIds: string[]; sightingIds: string[]; speciesIds: string[] };

const reviewedSightingOfVisit = sql<boolean>`exists (select 1 from ${sightings} s where s.visit_id = ${visits.id} and (s.status <> 'pending' or s.reviewed_at is not null))`;

type Facts = { assigned: [string, number][]; species: string[]; seasons: SeasonSpan[] };

/**
 * The small lookups in one statement (each statement costs the server more than these reads do):
 * all of the volunteer's assignments (a handful; a stored visit a sighting names may be on a
 * transect none of the batch's visits mention, and it must still be assigned), which of the
 * batch's species exist, and the seasons (a visit's season is derived from its date).
 */
function loadFacts(tx: BatchTx, actor: Actor, speciesIds: string[]): Promise<Facts[]> {
  return executePrepared<Facts>(tx, sql`
    select
      (select coalesce(json_agg(json_build_array(t.id, t.section_count)), '[]'::json)
         from ${transectAssignments} a join ${transects} t on t.id = a.transect_id where a.user_id = ${actor.id}) as assigned,
      (select coalesce(json_agg(s.id), '[]'::json) from ${species} s where s.id = any(${uuidArray(speciesIds)})) as species,
      (select coalesce(json_agg(json_build_object('id', x.id, 'startsOn', x.starts_on, 'endsOn', x.ends_on)), '[]'::json)
         from ${seasons} x) as seasons`);
}

/**
 * Reads the batch's server state inside its transaction. Existing visits and sightings are
 * locked (FOR UPDATE) so a coordinator's review or a parallel resend cannot slip in between
 * this read and the batch's writes. The queries are issued together: postgres-js pipelines
 * them on the transaction's connection, so they cost about one round trip. All of them run as
 * prepared statements (see ./prepared.ts), parsed once per connection.
 */
export async function loadServerState(tx: BatchTx, actor: Actor, keys: StateKeys): Promise<ServerState> {
  const none = Promise.resolve([] as never[]);
  const [[facts], visitRows, sightingRows] = await Promise.all([
    loadFacts(tx, actor, keys.speciesIds),
    keys.visitIds.length
      ? tx.builder
          .select({ ...getTableColumns(visits), sectionCount: transects.sectionCount, hasReviewed: reviewedSightingOfVisit })
          .from(visits)
          .innerJoin(transects, eq(transects.id, visits.transectId))
          .where(sql`${visits.id} = any(${uuidArray(keys.visitIds)})`)
          .orderBy(visits.id)
          .for("update", { of: visits })
          .execute()
      : none,
    keys.sightingIds.length
      ? tx.builder
          .select({ ...getTableColumns(sightings), ownerId: visits.volunteerId })
          .from(sightings)
          .innerJoin(visits, eq(visits.id, sightings.visitId))
          .where(sql`${sightings.id} = any(${uuidArray(keys.sightingIds)})`)
          .orderBy(sightings.id)
          .for("update", { of: sightings })
          .execute()
      : none,
  ]);
  return {
    assigned: new Map(facts!.assigned),
    visits: new Map(visitRows.map((v) => [v.id, v])),
    sightings: new Map(sightingRows.map((s) => [s.id, s])),
    knownSpecies: new Set(facts!.species),
    seasons: facts!.seasons,
  };
}

/** The season whose dates contain the visit date (the latest-starting one if seasons overlap). */
export function seasonFor(date: string, spans: SeasonSpan[]): string | null {
  let best: SeasonSpan | null = null;
  for (const s of spans) {
    if (s.startsOn <= date && date <= s.endsOn && (!best || s.startsOn > best.startsOn)) best = s;
  }
  return best?.id ?? null;
}
