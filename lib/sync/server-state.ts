import "server-only";
import { eq, getTableColumns, sql } from "drizzle-orm";
import type { BatchTx } from "./batch-transaction";
import { networkSettings, seasons, sightings, species, speciesMerges, transectAssignments, transectRouteVersions, transects, visits } from "@/db/schema";
import type { Actor } from "@/lib/auth/guard";
import type { VersionSpan } from "@/lib/geo/versions";
import { DEFAULT_SEASON_GRACE_DAYS } from "@/lib/limits/seasons";
import type { SeasonStatus } from "@/lib/seasons/rules";
import { executePrepared } from "./prepared";
import { uuidArray } from "./sql-arrays";

export type ServerVisit = typeof visits.$inferSelect & { sectionCount: number; hasReviewed: boolean };
export type ServerSighting = typeof sightings.$inferSelect & { ownerId: string };
export type SeasonSpan = { id: string; name: string; startsOn: string; endsOn: string; status: SeasonStatus; closedAt: string | null };

/** Everything one batch needs to know about the server, read in a fixed handful of queries. */
export type ServerState = {
  /** Section counts of every active transect the volunteer is assigned to (stored visits are checked too). */
  assigned: Map<string, number>;
  /** Route versions of those transects: a walk's sections are those of the version on its date. */
  versions: Map<string, VersionSpan[]>;
  visits: Map<string, ServerVisit>;
  sightings: Map<string, ServerSighting>;
  knownSpecies: Set<string>;
  /** Species merged away since a phone's checklist was loaded, each to the one it now counts as. */
  mergedInto: Map<string, string>;
  seasons: SeasonSpan[];
  graceDays: number;
  /** The batch's clock for the season phases. */
  now: Date;
};

export type StateKeys = { visitIds: string[]; sightingIds: string[]; speciesIds: string[] };

const reviewedSightingOfVisit = sql<boolean>`exists (select 1 from ${sightings} s where s.visit_id = ${visits.id} and (s.status <> 'pending' or s.reviewed_at is not null))`;

type Facts = {
  assigned: [string, number][];
  versions: [string, number, string, number][];
  species: string[];
  merged: [string, string][];
  seasons: SeasonSpan[];
  graceDays: number | null;
};

/**
 * The small lookups in one statement (each statement costs the server more than these reads do):
 * all of the volunteer's assignments (a handful; a stored visit a sighting names may be on a
 * transect none of the batch's visits mention, and it must still be assigned), which of the
 * batch's species exist, and the seasons (a visit's season is derived from its date).
 */
function loadFacts(tx: BatchTx, actor: Actor, speciesIds: string[]): Promise<Facts[]> {
  return executePrepared<Facts>(tx, sql`
    with mine as (select t.id, t.section_count from ${transectAssignments} a join ${transects} t on t.id = a.transect_id where a.user_id = ${actor.id} and t.active)
    select
      (select coalesce(json_agg(json_build_array(m.id, m.section_count)), '[]'::json) from mine m) as assigned,
      (select coalesce(json_agg(json_build_array(v.transect_id, v.version, v.valid_from, v.section_count)), '[]'::json)
         from ${transectRouteVersions} v where v.transect_id in (select id from mine)) as versions,
      (select coalesce(json_agg(s.id), '[]'::json) from ${species} s where s.id = any(${uuidArray(speciesIds)})) as species,
      (select coalesce(json_agg(json_build_array(m.from_species_id, m.into_species_id)), '[]'::json)
         from ${speciesMerges} m where m.from_species_id = any(${uuidArray(speciesIds)})) as merged,
      (select coalesce(json_agg(json_build_object('id', x.id, 'name', x.name, 'startsOn', x.starts_on, 'endsOn', x.ends_on, 'status', x.status, 'closedAt', x.closed_at)), '[]'::json)
         from ${seasons} x) as seasons,
      (select n.season_grace_days from ${networkSettings} n limit 1) as "graceDays"`);
}

// A stored walk's sections are those of the route version in force on its date: the latest
// valid from that day or before, else the first (lib/geo/versions.ts, versionOn).
const sectionsOnVisitDate = sql<number>`coalesce(
  (select v.section_count from ${transectRouteVersions} v where v.transect_id = ${visits.transectId} and v.valid_from <= ${visits.visitDate} order by v.valid_from desc limit 1),
  (select v.section_count from ${transectRouteVersions} v where v.transect_id = ${visits.transectId} order by v.valid_from asc limit 1),
  ${transects.sectionCount})`;

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
          .select({ ...getTableColumns(visits), sectionCount: sectionsOnVisitDate, hasReviewed: reviewedSightingOfVisit })
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
  const versions = new Map<string, VersionSpan[]>();
  for (const [transectId, version, validFrom, sectionCount] of facts!.versions) {
    versions.set(transectId, [...(versions.get(transectId) ?? []), { version, validFrom, sectionCount }]);
  }
  return {
    assigned: new Map(facts!.assigned),
    versions,
    visits: new Map(visitRows.map((v) => [v.id, { ...v, sectionCount: Number(v.sectionCount) }])),
    sightings: new Map(sightingRows.map((s) => [s.id, s])),
    knownSpecies: new Set([...facts!.species, ...facts!.merged.map(([, into]) => into)]),
    mergedInto: new Map(facts!.merged),
    seasons: facts!.seasons,
    graceDays: facts!.graceDays ?? DEFAULT_SEASON_GRACE_DAYS,
    now: new Date(),
  };
}

/** The season whose dates contain the visit date (seasons never overlap; the latest-starting one if old data did). */
export function seasonFor(date: string, spans: SeasonSpan[]): string | null {
  let best: SeasonSpan | null = null;
  for (const s of spans) {
    if (s.startsOn <= date && date <= s.endsOn && (!best || s.startsOn > best.startsOn)) best = s;
  }
  return best?.id ?? null;
}
