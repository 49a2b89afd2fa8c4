import "server-only";
import { sql } from "drizzle-orm";
import { db } from "@/db/client";
import type { SightingStatus } from "@/db/schema/field";
import type { LineString } from "@/db/schema/sites";
import { notFound } from "@/lib/errors";
import { presignView } from "@/lib/photos/objects";
import type { HistoryEntry, QueueOptions, SightingDetail, SpeciesChoice } from "@/lib/review/contract";
import type { RejectReason } from "@/lib/review/reasons";
import { DEFAULT_WALK_RULES, walkBreachText, walkRulesSchema, type WalkBreach } from "@/lib/review/walk-rules";
import { phaseOf, type SeasonStatus } from "@/lib/seasons/rules";
import { queueRowsByIds } from "./review-queue";
import { seasonGraceDays } from "./seasons";
import { routeVersionOn } from "./transects";

// What a reviewer sees of one sighting beside the queue, and the choices the queue's filters and
// the correction picker offer. Reviewers see exact positions, sensitive species included.

/** The sighting's history, oldest first: every review step, question and answer. */
export async function sightingHistory(sightingId: string): Promise<HistoryEntry[]> {
  const rows = await db().execute<{
    id: string; action: HistoryEntry["action"]; actor_id: string; actor_name: string; at: Date;
    from_status: SightingStatus | null; to_status: SightingStatus | null; reason: RejectReason | null; message: string | null;
    from_species_id: string | null; from_species_name: string | null; to_species_id: string | null; to_species_name: string | null;
    from_count: number | null; to_count: number | null;
  }>(sql`
    select e.id, e.action, u.id as actor_id, u.name as actor_name, e.created_at as at, e.from_status, e.to_status, e.reason, e.message,
      e.from_species_id, e.from_species_name, e.to_species_id, e.to_species_name, e.from_count, e.to_count
    from verification_events e join users u on u.id = e.actor_id
    where e.sighting_id = ${sightingId} order by e.created_at, e.id`);
  return rows.map((r) => ({
    id: r.id,
    action: r.action,
    actor: { id: r.actor_id, name: r.actor_name },
    at: new Date(r.at).toISOString(),
    fromStatus: r.from_status,
    toStatus: r.to_status,
    reason: r.reason,
    message: r.message,
    fromSpecies: r.from_species_name ? { id: r.from_species_id, name: r.from_species_name } : null,
    toSpecies: r.to_species_name ? { id: r.to_species_id, name: r.to_species_name } : null,
    fromCount: r.from_count,
    toCount: r.to_count,
  }));
}

export async function sightingDetail(id: string): Promise<SightingDetail> {
  const [row] = await queueRowsByIds([id]);
  if (!row) throw notFound("That sighting");
  const [facts] = await db().execute<{
    note: string | null; latitude: number | null; longitude: number | null; accuracy_metres: number | null; sensitive: boolean;
    start_time: string; end_time: string | null; temperature_c: number | null; wind_beaufort: number | null; cloud_cover_percent: number | null;
    sunshine_percent: number | null; rain: "none" | "light" | "heavy" | null; complete_list: boolean; notes: string | null;
    season_id: string | null; season_starts_on: string | null; season_status: SeasonStatus | null; season_closed_at: Date | null; walk_rules: unknown;
  }>(sql`
    select s.note, s.latitude, s.longitude, s.accuracy_metres, sp.sensitive,
      to_char(v.start_time, 'HH24:MI') as start_time, to_char(v.end_time, 'HH24:MI') as end_time, v.temperature_c, v.wind_beaufort,
      v.cloud_cover_percent, v.sunshine_percent, v.rain, v.complete_list, v.notes,
      se.id as season_id, se.starts_on::text as season_starts_on, se.status as season_status, se.closed_at as season_closed_at,
      network_walk_rules() as walk_rules
    from sightings s join visits v on v.id = s.visit_id join species sp on sp.id = s.species_id left join seasons se on se.id = v.season_id
    where s.id = ${id}`);
  if (!facts) throw notFound("That sighting");
  const rules = walkRulesSchema.safeParse(facts.walk_rules).data ?? DEFAULT_WALK_RULES;
  const [photoRows, earlier, history, version, graceDays] = await Promise.all([
    db().execute<{ id: string; thumbnail_key: string; display_key: string; width: number | null; height: number | null }>(sql`
      select id, thumbnail_key, display_key, width, height from photos
      where sighting_id = ${id} and status = 'ready' and thumbnail_key is not null and display_key is not null order by created_at, id`),
    db().execute<{ season_id: string; season_name: string; sightings: number; total: number; max_count: number }>(sql`
      select x.season_id, e.name as season_name, x.sightings, x.total, x.max_count
      from transect_species_seasons x join seasons e on e.id = x.season_id
      where x.transect_id = ${row.transect.id} and x.species_id = ${row.species.id}
        ${facts.season_starts_on ? sql`and e.starts_on < ${facts.season_starts_on}::date` : sql`and e.ends_on < ${row.walk.date}::date`}
      order by e.starts_on`),
    sightingHistory(id),
    routeVersionOn(row.transect.id, row.walk.date),
    seasonGraceDays(),
  ]);
  const seasonPhase = facts.season_status ? phaseOf({ status: facts.season_status, closedAt: facts.season_closed_at }, graceDays) : null;
  return {
    ...row,
    note: facts.note,
    position: facts.latitude != null && facts.longitude != null ? { latitude: facts.latitude, longitude: facts.longitude, accuracyMetres: facts.accuracy_metres } : null,
    sensitive: facts.sensitive,
    photos: await Promise.all(photoRows.map(async (p) => ({ id: p.id, thumbnailUrl: await presignView(p.thumbnail_key), displayUrl: await presignView(p.display_key), width: p.width, height: p.height }))),
    walkDetail: {
      startTime: facts.start_time,
      endTime: facts.end_time,
      temperatureC: facts.temperature_c,
      windBeaufort: facts.wind_beaufort,
      cloudCoverPercent: facts.cloud_cover_percent,
      sunshinePercent: facts.sunshine_percent,
      rain: facts.rain,
      completeList: facts.complete_list,
      notes: facts.notes,
      breachTexts: row.walk.breaches.map((b: WalkBreach) => walkBreachText(rules, b)),
    },
    route: { line: (version?.route ?? { type: "LineString", coordinates: [] }) as LineString, sectionCount: version?.sectionCount ?? 0 },
    earlier: earlier.map((e) => ({ seasonId: e.season_id, seasonName: e.season_name, sightings: e.sightings, total: e.total, maxCount: e.max_count })),
    history,
    canReopen: (row.status === "accepted" || row.status === "rejected") && reopenAllowed(seasonPhase),
  };
}

/** A reviewed sighting may be reopened while its season takes changes: open or in its grace period (or no season). */
export function reopenAllowed(phase: ReturnType<typeof phaseOf> | null): boolean {
  return phase === null || phase === "open" || phase === "grace";
}

/** Choices for the queue's filters: seasons newest first, transects by code, people who walked. */
export async function queueOptions(): Promise<QueueOptions> {
  const [seasonRows, transectRows, habitatRows, volunteerRows] = await Promise.all([
    db().execute<{ id: string; name: string }>(sql`select id, name from seasons order by starts_on desc`),
    db().execute<{ id: string; code: string; name: string }>(sql`select id, code, name from transects order by code`),
    db().execute<{ id: string; name: string }>(sql`select id, name from habitat_groups order by name`),
    db().execute<{ id: string; name: string }>(sql`select u.id, u.name from users u where exists (select 1 from visits v where v.volunteer_id = u.id) order by u.name, u.id`),
  ]);
  return { seasons: [...seasonRows], transects: [...transectRows], habitats: [...habitatRows], volunteers: [...volunteerRows] };
}

export const SPECIES_CHOICES = 20;

/**
 * Checklist entries whose vernacular, scientific or other name contains `q` (any case), the
 * closest first; aggregates come with the names of the species they stand for.
 */
export async function speciesChoices(q: string): Promise<SpeciesChoice[]> {
  const like = `%${q.replace(/[\\%_]/g, (c) => `\\${c}`)}%`;
  const rows = await db().execute<{ id: string; vernacular_name: string; scientific_name: string; taxon_rank: string; members: string[] | null }>(sql`
    select sp.id, sp.vernacular_name, sp.scientific_name, sp.taxon_rank,
      (select array_agg(m.vernacular_name order by m.sort_order) from species_aggregate_members a join species m on m.id = a.member_id where a.aggregate_id = sp.id) as members
    from species sp
    where ${q === "" ? sql`true` : sql`(sp.vernacular_name ilike ${like} or sp.scientific_name ilike ${like}
      or exists (select 1 from species_synonyms y where y.species_id = sp.id and y.name ilike ${like}))`}
    order by (lower(sp.vernacular_name) = lower(${q}) or lower(sp.scientific_name) = lower(${q})) desc, sp.sort_order, sp.vernacular_name
    limit ${SPECIES_CHOICES}`);
  return rows.map((r) => ({ id: r.id, vernacularName: r.vernacular_name, scientificName: r.scientific_name, aggregate: r.taxon_rank === "species_aggregate", members: r.members ?? [] }));
}
