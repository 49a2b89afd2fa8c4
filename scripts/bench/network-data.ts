// The data for bench:network, made in SQL (INSERT ... SELECT generate_series) in a throwaway
// database that already holds the demo network: its people, checklist and habitat groups stay,
// its transects are copied until there are BENCH_TRANSECTS, and its seasons and walks are
// replaced by five seasons of weekly walks, the current one open and containing today, with
// weather reports for about half the weeks missed. Sightings go in through the table's triggers,
// so visit_summaries (drizzle/0007) is filled the way the app's writes fill it.
import type postgres from "postgres";

export type Shape = { transects: number; seasons: number; weeks: number; sightings: number; changes: number };

export const defaultShape: Shape = {
  transects: Number(process.env.BENCH_TRANSECTS ?? 60),
  seasons: 5,
  weeks: 26,
  sightings: Number(process.env.BENCH_SIGHTINGS ?? 5_000_000),
  changes: Number(process.env.BENCH_CHANGES ?? 50_000),
};

/** Fills the database; returns what it wrote (counted back from the tables). */
export async function generate(sql: postgres.Sql, shape: Shape, say: (line: string) => void) {
  await sql`select setseed(0.2026)`;
  // The demo's own seasons and activity go; everything that hangs off a season goes with them.
  await sql`truncate seasons, visits, sightings, photos, verification_events, weather_misses, season_imports, network_changes cascade`;
  await copyTransects(sql, shape.transects);
  await makeSeasons(sql, shape);
  const walks = await makeWalks(sql, shape);
  await makeWeatherReports(sql, shape);
  say(`  ${walks.toLocaleString("en-GB")} walks; writing ${shape.sightings.toLocaleString("en-GB")} sightings season by season`);
  const seasons = await sql<{ seq: number }[]>`select seq from bench_seasons order by seq`;
  for (const { seq } of seasons) {
    const started = performance.now();
    await makeSightings(sql, seq);
    // The warnings' trigger plans its lookups of this summary once per connection: with fresh
    // statistics after each season it does not keep a plan made while the table was empty.
    await sql`analyze transect_species_seasons`;
    say(`  season ${seq}: ${Math.round((performance.now() - started) / 1000)} s`);
  }
  await makeChanges(sql, shape.changes);
  await sql`analyze`;
  const [counts] = await sql<{ transects: number; seasons: number; visits: number; sightings: number; changes: number }[]>`
    select (select count(*) from transects)::int as transects, (select count(*) from seasons)::int as seasons,
      (select count(*) from visits)::int as visits, (select count(*) from sightings)::int as sightings,
      (select count(*) from network_changes)::int as changes`;
  return counts!;
}

/** Copies the demo's transects (route, versions, sections, assignment) until there are `target`. */
async function copyTransects(sql: postgres.Sql, target: number) {
  await sql`
    create temp table bench_copies as
    select t.id as source_id, gen_random_uuid() as id, t.code || '-' || k as code, t.name || ' ' || k as name, k
    from transects t cross join generate_series(2, 100) k
    order by k, t.code
    limit greatest(0, ${target}::int - (select count(*) from transects))`;
  await sql`
    insert into transects (id, code, name, habitat_group_id, route, section_count, length_metres, access_notes, coastal, sensitive)
    select c.id, c.code, c.name, t.habitat_group_id, t.route, t.section_count, t.length_metres, t.access_notes, t.coastal, t.sensitive
    from bench_copies c join transects t on t.id = c.source_id`;
  await sql`
    create temp table bench_version_copies as
    select v.id as source_id, gen_random_uuid() as id, c.id as transect_id
    from bench_copies c join transect_route_versions v on v.transect_id = c.source_id`;
  await sql`
    insert into transect_route_versions (id, transect_id, version, valid_from, route, section_count, length_metres, created_by_id)
    select vc.id, vc.transect_id, v.version, v.valid_from, v.route, v.section_count, v.length_metres, v.created_by_id
    from bench_version_copies vc join transect_route_versions v on v.id = vc.source_id`;
  await sql`
    insert into transect_sections (version_id, number, from_point, to_point, length_metres, habitat)
    select vc.id, s.number, s.from_point, s.to_point, s.length_metres, s.habitat
    from bench_version_copies vc join transect_sections s on s.version_id = vc.source_id`;
  await sql`
    insert into transect_assignments (transect_id, user_id, assigned_by_id)
    select c.id, a.user_id, a.assigned_by_id from bench_copies c join transect_assignments a on a.transect_id = c.source_id`;
}

/**
 * Five seasons of `weeks` weeks, a year apart, each starting on a Monday; the last is open and
 * has run for all but its final few weeks, so today falls inside it.
 */
async function makeSeasons(sql: postgres.Sql, shape: Shape) {
  const weeksRun = shape.weeks - 5;
  await sql`
    create temp table bench_seasons as
    select seq, starts_on, (starts_on + ${shape.weeks * 7 - 1}::int)::date as ends_on, seq = ${shape.seasons}::int as current
    from (
      select seq, (date_trunc('week', current_date - make_interval(years => ${shape.seasons}::int - seq)) - make_interval(weeks => ${weeksRun}::int))::date as starts_on
      from generate_series(1, ${shape.seasons}::int) seq
    ) s`;
  await sql`
    insert into seasons (name, starts_on, ends_on, status, opened_at, closed_at, min_visits, target_visits)
    select 'Season ' || to_char(starts_on, 'YYYY') || ' (bench)', starts_on, ends_on,
      (case when current then 'open' else 'closed' end)::season_status,
      starts_on::timestamptz, case when current then null else ends_on + interval '18 hours' end, 3, ${shape.weeks}::int
    from bench_seasons`;
  await sql`alter table bench_seasons add column id uuid`;
  await sql`update bench_seasons b set id = s.id from seasons s where s.starts_on = b.starts_on`;
}

/** One walk a week per transect by its assigned volunteer (about 1 in 12 weeks missed), none after today. */
async function makeWalks(sql: postgres.Sql, shape: Shape): Promise<number> {
  await sql`
    create temp table bench_walks as
    select row_number() over (order by s.seq, t.code, w)::int as seq, s.seq as season_seq, gen_random_uuid() as id,
      t.id as transect_id, t.section_count, s.id as season_id, s.current,
      (s.starts_on + w * 7 + floor(random() * 5)::int)::date as walk_date,
      (select a.user_id from transect_assignments a where a.transect_id = t.id order by a.user_id limit 1) as volunteer_id
    from bench_seasons s cross join transects t cross join generate_series(0, ${shape.weeks - 1}::int) w
    where random() > 0.08`;
  await sql`delete from bench_walks where walk_date > current_date`;
  await sql`
    insert into visits (id, transect_id, volunteer_id, season_id, visit_date, start_time, end_time, temperature_c, wind_beaufort,
      cloud_cover_percent, sky, complete_list, submitted_at, created_at, updated_at)
    select id, transect_id, volunteer_id, season_id, walk_date, time '10:30' + make_interval(mins => (seq % 20) * 15),
      time '11:45' + make_interval(mins => (seq % 20) * 15), 14 + (seq % 11), seq % 5, (seq % 9) * 10,
      (array['clear', 'mostly_sunny', 'broken_cloud', 'mostly_cloudy'])[1 + seq % 4]::sky, true,
      walk_date + interval '18 hours', walk_date + interval '18 hours', walk_date + interval '18 hours'
    from bench_walks`;
  // Sightings per walk so that the total comes out exactly: the first walks take one more.
  const [{ walks }] = (await sql<{ walks: number }[]>`select count(*)::int as walks from bench_walks`) as unknown as [{ walks: number }];
  await sql`alter table bench_walks add column n int`;
  await sql`
    update bench_walks w set n = ${Math.floor(shape.sightings / walks)}::int + case when r.rank <= ${shape.sightings % walks}::int then 1 else 0 end
    from (select id, row_number() over (order by seq) as rank from bench_walks) r where r.id = w.id`;
  return walks;
}

/** About half the weeks a transect was not walked, up to today, reported as missed for the weather. */
async function makeWeatherReports(sql: postgres.Sql, shape: Shape) {
  await sql`
    insert into weather_misses (id, transect_id, volunteer_id, season_id, week_start, reported_on)
    select gen_random_uuid(), t.id, a.user_id, s.id, s.starts_on + w * 7, s.starts_on + w * 7 + 4
    from bench_seasons s cross join transects t cross join generate_series(0, ${shape.weeks - 1}::int) w
    join lateral (select user_id from transect_assignments where transect_id = t.id order by user_id limit 1) a on true
    where s.starts_on + w * 7 + 4 <= current_date and random() < 0.5
      and not exists (select 1 from bench_walks b where b.transect_id = t.id and b.season_seq = s.seq
        and b.walk_date >= s.starts_on + w * 7 and b.walk_date < s.starts_on + w * 7 + 7)`;
}

/**
 * One season's sightings in one statement. Ids count up (a UUID made of the walk and row
 * numbers), so the primary key grows at its end. Statuses: a closed season is nearly all
 * checked; in the open one, walks older than three weeks mostly are, recent ones mostly wait.
 */
async function makeSightings(sql: postgres.Sql, seasonSeq: number) {
  await sql`
    with sp as (select array_agg(id order by sort_order) as ids from species),
    checker as (select id from users where 'coordinator' = any(roles) order by id limit 1),
    rows as (
      select w.seq, w.id as visit_id, w.section_count, w.walk_date, w.current, i, random() as r,
        w.walk_date < current_date - 21 as old
      from bench_walks w cross join generate_series(1, w.n) i
      where w.season_seq = ${seasonSeq}::int
    ),
    statused as (
      select rows.*, case
        when not current or old then case when r < 0.01 then 'pending' when r < 0.02 then 'queried' when r < 0.045 then 'rejected' else 'accepted' end
        else case when r < 0.9 then 'pending' when r < 0.95 then 'queried' else 'accepted' end
      end::sighting_status as status
      from rows
    )
    insert into sightings (id, visit_id, species_id, count, section, status, reviewed_by_id, reviewed_at, created_at, updated_at)
    select (lpad(to_hex(seq), 16, '0') || lpad(to_hex(i), 16, '0'))::uuid, visit_id,
      sp.ids[1 + (seq * 7 + i) % array_length(sp.ids, 1)], 1 + (seq + i * 13) % 9, 1 + (i / array_length(sp.ids, 1)) % section_count,
      status, case when status = 'pending' then null else (select id from checker) end,
      case when status = 'pending' then null else walk_date + interval '20 hours' end,
      walk_date + interval '18 hours', walk_date + interval '18 hours'
    from statused cross join sp`;
}

/** The network's change log: `n` entries over the five years, by the organiser. */
async function makeChanges(sql: postgres.Sql, n: number) {
  await sql`
    with org as (select id from users where 'organiser' = any(roles) order by id limit 1),
    ts as (select array_agg(id::text order by code) as ids from transects),
    kinds as (select enum_range(null::network_entity) as e)
    insert into network_changes (actor_id, entity, entity_id, action, summary, before, after, created_at)
    select (select id from org), kinds.e[1 + g % array_length(kinds.e, 1)], ts.ids[1 + g % array_length(ts.ids, 1)],
      (array['create', 'update', 'retire', 'open', 'close', 'import'])[1 + g % 6], 'Bench change number ' || g,
      jsonb_build_object('name', 'Before ' || g, 'active', true), jsonb_build_object('name', 'After ' || g, 'active', g % 3 > 0),
      now() - make_interval(mins => g * 50)
    from generate_series(1, ${n}::int) g cross join kinds cross join ts`;
}
