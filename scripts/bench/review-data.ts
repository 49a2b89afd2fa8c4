// bench:review's review mix, made in SQL over what scripts/bench/network-data.ts generated (there
// nearly every sighting is checked, each species spread evenly, no walk records sunshine or rain).
// Every change is an ordinary write, so the triggers of drizzle/0008 compute sightings.warnings,
// visits.rule_breaches and transect_species_seasons the way the app's writes do:
// - the open season mostly waiting (older walks half checked), some with a question asked and about
//   half of those answered, some set aside; the closed seasons keep the generator's mix;
// - the history (verification_events) each status implies: query, reply, accept, reject with a
//   reason, and a few count corrections;
// - one rare species (all but 1 % of its sightings renamed to a common one) and one species new to
//   six transects this season, which give "first on this transect";
// - a few counts far above earlier ones; photos on some sightings (most sensitive ones), so
//   "sensitive species without a photo" is the rest;
// - the open season's walks with sunshine and rain, some windy, wet or cool.
import type postgres from "postgres";

export type ReviewMix = { rareSpeciesId: string; commonSpeciesId: string; openSeasonId: string };

export async function giveReviewMix(sql: postgres.Sql, say: (line: string) => void): Promise<ReviewMix> {
  await sql`select setseed(0.1010)`;
  const [open] = await sql<{ id: string }[]>`select id from seasons where status = 'open' order by starts_on desc limit 1`;
  // Plain species (not sensitive, not an aggregate) in checklist order: the first becomes
  // common, the last rare, the one before it new to six transects.
  const plain = await sql<{ id: string }[]>`
    select id from species where not sensitive and taxon_rank = 'species' order by sort_order, id`;
  const common = plain[0]!.id, rare = plain[plain.length - 1]!.id, newcomer = plain[plain.length - 2]!.id;

  await walkConditions(sql, open!.id);
  await photos(sql, open!.id);
  await sql`
    create temp table review_plan as
    select s.id, s.species_id, s.count, s.status, v.volunteer_id, v.visit_date, v.season_id = ${open!.id} as open_season,
      v.visit_date < current_date - 42 as older,
      v.transect_id in (select id from transects order by code limit 6) as newcomer_transect,
      random() as r_status, random() as r_species, random() as r_count, random() as r_answer
    from sightings s join visits v on v.id = s.visit_id`;
  await sql`
    alter table review_plan add column to_species uuid, add column to_count int, add column to_status sighting_status,
      add column answered boolean`;
  await sql`
    update review_plan set
      to_species = case
        when species_id = ${rare} and r_species > 0.01 then ${common}::uuid
        when species_id = ${newcomer} and newcomer_transect and not open_season then ${common}::uuid
        else species_id end,
      to_count = case when open_season and r_count < 0.004 then 30 + floor(r_species * 50)::int else count end,
      to_status = case
        when not open_season then status::text
        when older then case when r_status < 0.50 then 'accepted' when r_status < 0.56 then 'rejected' when r_status < 0.66 then 'queried' else 'pending' end
        else case when r_status < 0.07 then 'accepted' when r_status < 0.09 then 'rejected' when r_status < 0.15 then 'queried' else 'pending' end
      end::sighting_status`;
  await sql`update review_plan set answered = to_status = 'queried' and r_answer < 0.45`;

  // One statement, so the statement-level triggers refresh the summaries and warnings once.
  const started = performance.now();
  await sql`
    update sightings s set species_id = p.to_species, count = p.to_count, status = p.to_status,
      reviewed_by_id = case when p.to_status = 'pending' then null else coalesce(s.reviewed_by_id, (select id from users where 'coordinator' = any(roles) order by id limit 1)) end,
      reviewed_at = case when p.to_status = 'pending' then null else coalesce(s.reviewed_at, least(now(), (p.visit_date + interval '2 days 10 hours')::timestamptz)) end
    from review_plan p
    where s.id = p.id and (p.to_species, p.to_count, p.to_status) is distinct from (p.species_id, p.count, p.status)`;
  say(`  review mix written in ${Math.round((performance.now() - started) / 1000)} s (the triggers recomputed warnings and summaries)`);
  await history(sql);
  await sql`drop table review_plan`;
  // The refreshes rewrote most rows: vacuum as autovacuum soon would on a live database, so the
  // timings do not measure the generator's dead row versions.
  await sql`vacuum analyze`;
  return { rareSpeciesId: rare, commonSpeciesId: common, openSeasonId: open!.id };
}

/** Sunshine and rain on the open season's walks (earlier seasons were walked before the fields existed); a few windy, wet or cool ones. */
async function walkConditions(sql: postgres.Sql, openSeasonId: string) {
  await sql`
    update visits set
      sunshine_percent = (20 + floor(random() * 81))::smallint,
      rain = (case when random() < 0.03 then 'light' when random() < 0.005 then 'heavy' else 'none' end)::rain
    where season_id = ${openSeasonId}`;
  await sql`update visits set wind_beaufort = 6 where random() < 0.02`;
  await sql`update visits set temperature_c = 11 where season_id = ${openSeasonId} and random() < 0.02`;
}

/** A ready photo on 5 % of sightings and on 60 % of sensitive species' sightings (each with a thumbnail). */
async function photos(sql: postgres.Sql, openSeasonId: string) {
  await sql`
    insert into photos (id, sighting_id, visit_id, uploaded_by_id, status, upload_key, display_key, thumbnail_key, content_type, bytes, width, height, created_at, processed_at)
    select gen_random_uuid(), s.id, s.visit_id, v.volunteer_id, 'ready', 'bench/' || s.id || '/upload', 'bench/' || s.id || '/display.jpg',
      'bench/' || s.id || '/thumb.jpg', 'image/jpeg', 250000, 2048, 1536, s.created_at, s.created_at + interval '1 minute'
    from sightings s join visits v on v.id = s.visit_id join species sp on sp.id = s.species_id
    where random() < case when sp.sensitive then 0.6 when v.season_id = ${openSeasonId} then 0.05 else 0.01 end`;
}

/** The review history each sighting's status implies, in order: a question and maybe its answer, then the decision. */
async function history(sql: postgres.Sql) {
  await sql`
    with checker as (select id from users where 'coordinator' = any(roles) order by id limit 1),
    decided as (
      select p.*, s.status as now_status, s.reviewed_at, s.count as now_count,
        -- Some checked sightings were questioned and answered first.
        p.to_status in ('accepted', 'rejected') and p.r_answer < 0.05 as asked_first
      from review_plan p join sightings s on s.id = p.id where s.status <> 'pending'
    ),
    events as (
      select id as sighting_id, (select id from checker) as actor_id, 'query'::review_action as action, 'pending'::sighting_status as from_status,
        'queried'::sighting_status as to_status, 'Could you say how you told it apart? A photo would help.' as message, null as reason,
        case when asked_first then reviewed_at - interval '1 day' else reviewed_at end as created_at
      from decided where now_status = 'queried' or asked_first
      union all
      select id, volunteer_id, 'reply', 'queried', 'queried', 'It was resting with open wings; I saw the underside too.', null,
        case when asked_first then reviewed_at - interval '12 hours' else least(now(), reviewed_at + interval '12 hours') end
      from decided where answered or asked_first
      union all
      select id, (select id from checker), 'accept', case when asked_first then 'queried' else 'pending' end::sighting_status,
        now_status, null, null, reviewed_at
      from decided where now_status = 'accepted'
      union all
      select id, (select id from checker), 'reject', case when asked_first then 'queried' else 'pending' end::sighting_status, now_status,
        'Set aside in the bench data.', (array['photo_not_conclusive', 'likely_other_species', 'unlikely_here_or_now', 'entered_twice', 'wrong_place', 'other'])[1 + floor(r_species * 6)::int],
        reviewed_at
      from decided where now_status = 'rejected'
      union all
      select id, (select id from checker), 'edit', case when asked_first then 'queried' else 'pending' end::sighting_status,
        case when asked_first then 'queried' else 'pending' end::sighting_status, 'Count corrected after the answer.', null, reviewed_at - interval '1 hour'
      from decided where now_status = 'accepted' and open_season and r_count > 0.995
    )
    insert into verification_events (sighting_id, actor_id, action, from_status, to_status, message, reason, created_at, from_count, to_count)
    select e.sighting_id, e.actor_id, e.action, e.from_status, e.to_status, e.message, e.reason, e.created_at,
      case when e.action = 'edit' then s.count + 1 end, case when e.action = 'edit' then s.count end
    from events e join sightings s on s.id = e.sighting_id`;
}
