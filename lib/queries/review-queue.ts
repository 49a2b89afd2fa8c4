import "server-only";
import { sql, type SQL } from "drizzle-orm";
import { uuidArray } from "@/lib/sync/sql-arrays";
import { db, type Database, type Transaction } from "@/db/client";
import type { SightingStatus } from "@/db/schema/field";
import { presignView } from "@/lib/photos/objects";
import type { QueuePage, QueueRow } from "@/lib/review/contract";
import type { QueueFilter, QueueQuery, QueueSort } from "@/lib/review/queue-filter";
import type { WalkBreach } from "@/lib/review/walk-rules";
import type { SightingWarning } from "@/lib/review/warnings";

// The review queue: which sightings match a filter (in SQL, through indexes: the warnings are
// kept in sightings.warnings and visits.rule_breaches by triggers), one page of them in a stable
// order, and each row's tally, marks and thumbnail, read for the page's rows only.

type Db = Database | Transaction;

/** Sightings still to decide: waiting for review, or with a question asked. */
export const UNDECIDED: readonly SightingStatus[] = ["pending", "queried"];

/** Whether the last word in the sighting's question-and-answer thread is the volunteer's. */
const answeredSql = (id: SQL) => sql`coalesce((
  select e.action = 'reply' from verification_events e
  where e.sighting_id = ${id} and e.action in ('query', 'reply')
  order by e.created_at desc, e.id desc limit 1), false)`;

/** The filter's conditions on s (sightings), v (visits), t (transects). */
function conditions(f: QueueFilter): SQL[] {
  const where: SQL[] = [];
  if (f.status === "waiting") where.push(sql`s.status in ('pending', 'queried')`);
  else if (f.status === "answered") where.push(sql`s.status = 'queried' and ${answeredSql(sql`s.id`)}`);
  else if (f.status !== "any") where.push(sql`s.status = ${f.status}::sighting_status`);
  if (f.season) where.push(sql`v.season_id = ${f.season}`);
  if (f.transect) where.push(sql`v.transect_id = ${f.transect}`);
  if (f.habitat) where.push(sql`t.habitat_group_id = ${f.habitat}`);
  if (f.species) where.push(sql`s.species_id = ${f.species}`);
  if (f.volunteer) where.push(sql`v.volunteer_id = ${f.volunteer}`);
  if (f.from) where.push(sql`v.visit_date >= ${f.from}::date`);
  if (f.to) where.push(sql`v.visit_date <= ${f.to}::date`);
  if (f.warning === "walk_rules") where.push(sql`cardinality(v.rule_breaches) > 0`);
  else if (f.warning) where.push(sql`s.warnings @> array[${f.warning}]::text[]`);
  return where;
}

const whereSql = (parts: SQL[]) => (parts.length ? sql`where ${sql.join(parts, sql` and `)}` : sql``);

/** Whether the filter reads the walk (v) or its transect (t), beyond the sighting itself. */
const needsWalk = (f: QueueFilter) => Boolean(f.season || f.transect || f.habitat || f.volunteer || f.from || f.to || f.warning === "walk_rules");

/**
 * The sightings matching a filter, joining only what the filter needs: a count by status or
 * warning alone reads sightings and its indexes, not every walk.
 */
export function matchingSql(f: QueueFilter): SQL {
  const walk = needsWalk(f) ? sql`join visits v on v.id = s.visit_id` : sql``;
  const transect = f.habitat ? sql`join transects t on t.id = v.transect_id` : sql``;
  return sql`from sightings s ${walk} ${transect} ${whereSql(conditions(f))}`;
}

const sortColumn: Record<QueueSort, SQL> = {
  date: sql`v.visit_date`,
  species: sql`sp.vernacular_name`,
  transect: sql`t.code`,
  volunteer: sql`u.name`,
  count: sql`s.count`,
  status: sql`s.status`,
};

/**
 * One page's ids in order. After the chosen column the order keeps a walk's sightings together
 * by section and species, so a volunteer's tally (several entries of one species in one section)
 * sits in adjacent rows.
 */
export function pageIdsSql(q: QueueQuery): SQL {
  const dir = q.dir === "asc" ? sql`asc` : sql`desc`;
  const needsSpecies = q.sort === "species";
  const needsUser = q.sort === "volunteer";
  const needsTransect = q.sort === "transect" || Boolean(q.habitat);
  return sql`select s.id from sightings s join visits v on v.id = s.visit_id
    ${needsTransect ? sql`join transects t on t.id = v.transect_id` : sql``}
    ${needsSpecies ? sql`join species sp on sp.id = s.species_id` : sql``}
    ${needsUser ? sql`join users u on u.id = v.volunteer_id` : sql``}
    ${whereSql(conditions(q))}
    order by ${sortColumn[q.sort]} ${dir}, v.visit_date desc, v.id, s.section nulls last, s.species_id, s.created_at, s.id
    limit ${q.pageSize} offset ${(q.page - 1) * q.pageSize}`;
}

export function countSql(f: QueueFilter): SQL {
  return sql`select count(*)::int as n ${matchingSql(f)}`;
}

type RawRow = {
  id: string; revision: number; status: SightingStatus; answered: boolean; corrected: boolean; count: number; section: number | null;
  species_id: string; vernacular_name: string; scientific_name: string; taxon_rank: string;
  transect_id: string; transect_code: string; transect_name: string;
  visit_id: string; visit_date: string; rule_breaches: string[]; entered_by: string | null; imported_from: string | null;
  volunteer_id: string; volunteer_name: string; photo_count: number; thumbnail_key: string | null; warnings: string[];
  tally_entries: number; tally_sum: number;
};

/** Queue rows for these sightings, in the order of `ids`; unknown ids are left out. */
export async function queueRowsByIds(ids: readonly string[], tx: Db = db()): Promise<QueueRow[]> {
  if (ids.length === 0) return [];
  const rows = await tx.execute<RawRow>(sql`
    select s.id, s.revision, s.status, ${answeredSql(sql`s.id`)} as answered,
      exists (select 1 from verification_events e where e.sighting_id = s.id and e.action = 'edit') as corrected,
      s.count, s.section, sp.id as species_id, sp.vernacular_name, sp.scientific_name, sp.taxon_rank,
      t.id as transect_id, t.code as transect_code, t.name as transect_name,
      v.id as visit_id, v.visit_date::text as visit_date, v.rule_breaches,
      (select eu.name from users eu where eu.id = v.entered_by_id) as entered_by,
      (select 'imported from ' || i.walks_file_name || ' on ' || to_char(i.created_at at time zone 'UTC', 'YYYY-MM-DD') from season_imports i where i.id = v.import_id) as imported_from,
      u.id as volunteer_id, u.name as volunteer_name,
      (select count(*)::int from photos p where p.sighting_id = s.id and p.status <> 'refused') as photo_count,
      (select p.thumbnail_key from photos p where p.sighting_id = s.id and p.status = 'ready' order by p.created_at, p.id limit 1) as thumbnail_key,
      s.warnings, tally.entries as tally_entries, tally.total as tally_sum
    from sightings s
    join visits v on v.id = s.visit_id
    join transects t on t.id = v.transect_id
    join species sp on sp.id = s.species_id
    join users u on u.id = v.volunteer_id
    cross join lateral (
      select count(*)::int as entries, coalesce(sum(x.count), 0)::int as total from sightings x
      where x.visit_id = s.visit_id and x.species_id = s.species_id and x.section is not distinct from s.section and x.status <> 'rejected'
    ) tally
    where s.id = any(${uuidArray(ids)})`);
  const byId = new Map<string, QueueRow>();
  for (const r of rows) {
    byId.set(r.id, {
      id: r.id,
      revision: r.revision,
      status: r.status,
      answered: r.answered,
      corrected: r.corrected,
      count: r.count,
      section: r.section,
      species: { id: r.species_id, vernacularName: r.vernacular_name, scientificName: r.scientific_name, aggregate: r.taxon_rank === "species_aggregate" },
      transect: { id: r.transect_id, code: r.transect_code, name: r.transect_name },
      walk: { id: r.visit_id, date: r.visit_date, breaches: r.rule_breaches as WalkBreach[], enteredBy: r.entered_by, importedFrom: r.imported_from },
      volunteer: { id: r.volunteer_id, name: r.volunteer_name },
      photoCount: r.photo_count,
      thumbnailUrl: r.thumbnail_key ? await presignView(r.thumbnail_key) : null,
      warnings: r.warnings as SightingWarning[],
      tally: { entries: Math.max(1, r.tally_entries), sum: r.tally_entries > 0 ? r.tally_sum : r.count },
    });
  }
  return ids.flatMap((id) => byId.get(id) ?? []);
}

/** One page of the queue, with the total that match and the time it was read. */
export async function reviewQueuePage(q: QueueQuery): Promise<QueuePage> {
  const [ids, [counted], [clock]] = await Promise.all([
    db().execute<{ id: string }>(pageIdsSql(q)),
    db().execute<{ n: number }>(countSql(q)),
    db().execute<{ at: string }>(sql`select to_char(clock_timestamp() at time zone 'UTC', 'YYYY-MM-DD"T"HH24:MI:SS.US"Z"') as at`),
  ]);
  const rows = await queueRowsByIds(ids.map((r) => r.id));
  return { rows, total: counted?.n ?? 0, page: q.page, pageSize: q.pageSize, listedAt: clock!.at };
}

/** The counts the review area's home shows, by status. */
export async function reviewCounts(): Promise<Record<SightingStatus, number>> {
  const rows = await db().execute<{ status: SightingStatus; n: number }>(sql`select status, count(*)::int as n from sightings group by status`);
  const counts: Record<SightingStatus, number> = { pending: 0, accepted: 0, queried: 0, rejected: 0 };
  for (const r of rows) counts[r.status] = r.n;
  return counts;
}
