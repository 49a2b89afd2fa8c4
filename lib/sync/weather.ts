import "server-only";
import { sql } from "drizzle-orm";
import { weatherMisses } from "@/db/schema";
import type { Actor } from "@/lib/auth/guard";
import { mondayOf } from "@/lib/effort/weeks";
import { contains, FIELD_DATE_REASONS, latestFieldDate, phaseOf } from "@/lib/seasons/rules";
import type { BatchTx } from "./batch-transaction";
import type { ItemResult, WeatherPayload } from "./contract";
import type { Indexed } from "./parse";
import { executePrepared } from "./prepared";
import { uuidArray } from "./sql-arrays";
import { guarded } from "./write";
import type { ServerState } from "./server-state";

// "Not walked this week because of the weather" from the field home. A report is a fact about a
// week, never edited: a resend (same id) is unchanged, and so is a second report of a week already
// marked for that transect by that volunteer. A walk later in the week leaves the report alone:
// the effort grid shows the walk.

export type StoredMiss = { id: string; volunteerId: string; transectId: string; weekStart: string };

export type WeatherRow = { id: string; transectId: string; volunteerId: string; seasonId: string; weekStart: string; reportedOn: string };

export type WeatherPlan = { results: ItemResult[]; writes: WeatherRow[] };

export const WEATHER_REASONS = {
  otherVolunteer: "This weather report belongs to another volunteer.",
  notAssigned: "You are not assigned to that transect.",
  weekMarked: "This week is already marked as not walked because of the weather.",
  notOpen: (name: string) => `The ${name} is not open, so it takes no weather reports.`,
} as const;

/** The stored reports the batch's items may repeat: by id, or by this volunteer's transect and week. */
export async function loadStoredMisses(tx: BatchTx, actor: Actor, items: WeatherPayload[]): Promise<StoredMiss[]> {
  if (!items.length) return [];
  const weeks = [...new Set(items.map((i) => mondayOf(i.reportedOn)))];
  return executePrepared<StoredMiss>(tx, sql`
    select id, volunteer_id as "volunteerId", transect_id as "transectId", week_start::text as "weekStart"
    from ${weatherMisses}
    where id = any(${uuidArray(items.map((i) => i.id))})
       or (volunteer_id = ${actor.id} and transect_id = any(${uuidArray([...new Set(items.map((i) => i.transectId))])})
           and week_start = any(${`{${weeks.join(",")}}`}::date[]))`);
}

/**
 * Decides each valid report: forbidden unless the transect is among the volunteer's active
 * assignments (or when the id is another volunteer's); invalid when dated in the future (a day's
 * allowance for phone clocks) or outside a season that is open; unchanged for a resend or a week
 * already marked; otherwise created, filed under the Monday of its week.
 */
export function planWeather(actor: Actor, items: Indexed<WeatherPayload>[], state: ServerState, stored: StoredMiss[]): WeatherPlan {
  const results: ItemResult[] = [];
  const writes: WeatherRow[] = [];
  const byId = new Map(stored.map((m) => [m.id, m]));
  const marked = new Set(stored.filter((m) => m.volunteerId === actor.id).map((m) => `${m.transectId}:${m.weekStart}`));
  for (const { index, value } of items) {
    const answer = (status: ItemResult["status"], reason?: string, errors?: Record<string, string[]>) =>
      results.push({ kind: "weather", id: value.id, index, status, ...(reason ? { reason } : {}), ...(errors ? { errors } : {}) });
    const existing = byId.get(value.id);
    if (existing && existing.volunteerId !== actor.id) {
      answer("forbidden", WEATHER_REASONS.otherVolunteer);
      continue;
    }
    if (existing) {
      answer("unchanged");
      continue;
    }
    if (!state.assigned.has(value.transectId)) {
      answer("forbidden", WEATHER_REASONS.notAssigned);
      continue;
    }
    const verdict = dateVerdict(value.reportedOn, state);
    if ("reason" in verdict) {
      answer("invalid", verdict.reason, { reportedOn: [verdict.reason] });
      continue;
    }
    const weekStart = mondayOf(value.reportedOn);
    const key = `${value.transectId}:${weekStart}`;
    if (marked.has(key)) {
      answer("unchanged", WEATHER_REASONS.weekMarked);
      continue;
    }
    marked.add(key);
    writes.push({ id: value.id, transectId: value.transectId, volunteerId: actor.id, seasonId: verdict.seasonId, weekStart, reportedOn: value.reportedOn });
    answer("created");
  }
  return { results, writes };
}

function seasonOf(day: string, state: ServerState) {
  return state.seasons.filter((s) => contains(s, day)).sort((a, b) => b.startsOn.localeCompare(a.startsOn))[0];
}

/** The open season a report dated `day` is filed under, or why it cannot be taken (not in the future, in a season open now). */
function dateVerdict(day: string, state: ServerState): { seasonId: string } | { reason: string } {
  if (day > latestFieldDate(state.now)) return { reason: FIELD_DATE_REASONS.future };
  const season = seasonOf(day, state);
  if (!season) return { reason: FIELD_DATE_REASONS.noSeason };
  if (phaseOf(season, state.graceDays, state.now) !== "open") return { reason: WEATHER_REASONS.notOpen(season.name) };
  return { seasonId: season.id };
}

/** Inserts the reports planned; a report of the same week stored by a parallel batch makes the batch retry (and then be unchanged). */
export function insertWeatherMisses(tx: BatchTx, rows: WeatherRow[]): Promise<void> {
  if (!rows.length) return Promise.resolve();
  const json = JSON.stringify(rows.map((r) => ({ id: r.id, transect_id: r.transectId, volunteer_id: r.volunteerId, season_id: r.seasonId, week_start: r.weekStart, reported_on: r.reportedOn })));
  return guarded("weather reports", rows.length, executePrepared(tx, sql`
    with written as (
    insert into ${weatherMisses} (id, transect_id, volunteer_id, season_id, week_start, reported_on)
    select id, transect_id, volunteer_id, season_id, week_start, reported_on
    from json_to_recordset(${json}::json) as r(id uuid, transect_id uuid, volunteer_id uuid, season_id uuid, week_start date, reported_on date)
    on conflict do nothing
    returning id)
    select sync_expect_rows(count(*), ${rows.length}, 'weather reports') as n from written`));
}
