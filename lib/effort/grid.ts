// The organiser's weekly effort grid, pure: which state each transect's week is in, how far each
// transect has got against the season's target, and which transects have gone unwalked too long.
// The query layer (lib/queries/effort.ts) gathers the facts; this file decides what they mean.
import { addDays, mondayOf, weekStartsBetween } from "./weeks";

/**
 * A week of one transect. A walk with no sightings is still effort ("nothing_seen"); a weather
 * report only counts when nobody walked that week. "upcoming" is a week that has not begun.
 */
export type CellState = "sightings" | "nothing_seen" | "weather" | "not_walked" | "upcoming";

/** One walk as the grid needs it: its day and its sightings that stand (rejected ones do not). */
export type WalkFact = { transectId: string; date: string; sightings: number; pending: number };
/** "Not walked this week because of the weather", filed under the week's Monday. */
export type WeatherFact = { transectId: string; weekStart: string };

export type Cell = { weekStart: string; state: CellState; walks: number; sightings: number };

export type GridRow = {
  transectId: string;
  cells: Cell[];
  walks: number;
  pending: number;
  lastWalk: string | null;
  /** Whole weeks of the season that have ended since the week of the last walk (all ended weeks when never walked). */
  weeksWithoutWalk: number;
};

/** Weeks of the season (Monday starts) unwalked before a transect is listed in the alerts. */
export const ALERT_WEEKS = 3;

/** The Mondays of every week holding a day of the season. */
export const seasonWeeks = (season: { startsOn: string; endsOn: string }) => weekStartsBetween(season.startsOn, season.endsOn);

/** A week has ended once its Sunday is over: on the next Monday. */
export const weekEnded = (weekStart: string, today: string) => addDays(weekStart, 7) <= today;

export function cellState(walks: readonly { sightings: number }[], weatherReported: boolean, weekStart: string, today: string): CellState {
  if (walks.length > 0) return walks.some((w) => w.sightings > 0) ? "sightings" : "nothing_seen";
  if (weekStart > today) return "upcoming";
  return weatherReported ? "weather" : "not_walked";
}

/**
 * Ended weeks of the season after the last week with a walk. A walk in the week under way clears
 * the count; the week under way never adds to it (it may still be walked).
 */
export function weeksWithoutWalk(weeks: readonly string[], walkedWeeks: ReadonlySet<string>, today: string): number {
  let count = 0;
  for (const week of weeks) {
    if (week > today) break;
    if (walkedWeeks.has(week)) count = 0;
    else if (weekEnded(week, today)) count++;
  }
  return count;
}

/** Alerts are for an open season only: a closed one is past chasing. */
export const needsAlert = (weeksUnwalked: number, seasonOpen: boolean) => seasonOpen && weeksUnwalked >= ALERT_WEEKS;

export function buildGrid(season: { startsOn: string; endsOn: string }, transectIds: readonly string[], walks: readonly WalkFact[], weather: readonly WeatherFact[], today: string): { weeks: string[]; rows: GridRow[] } {
  const weeks = seasonWeeks(season);
  const walksBy = new Map<string, WalkFact[]>();
  for (const w of walks) {
    const key = `${w.transectId}|${mondayOf(w.date)}`;
    (walksBy.get(key) ?? walksBy.set(key, []).get(key)!).push(w);
  }
  const weatherBy = new Set(weather.map((m) => `${m.transectId}|${m.weekStart}`));
  const rows = transectIds.map((transectId): GridRow => {
    const mine = walks.filter((w) => w.transectId === transectId);
    const cells = weeks.map((weekStart): Cell => {
      const inWeek = walksBy.get(`${transectId}|${weekStart}`) ?? [];
      return {
        weekStart,
        state: cellState(inWeek, weatherBy.has(`${transectId}|${weekStart}`), weekStart, today),
        walks: inWeek.length,
        sightings: inWeek.reduce((n, w) => n + w.sightings, 0),
      };
    });
    const walkedWeeks = new Set(mine.map((w) => mondayOf(w.date)));
    return {
      transectId,
      cells,
      walks: mine.length,
      pending: mine.reduce((n, w) => n + w.pending, 0),
      lastWalk: mine.reduce<string | null>((last, w) => (last === null || w.date > last ? w.date : last), null),
      weeksWithoutWalk: weeksWithoutWalk(weeks, walkedWeeks, today),
    };
  });
  return { weeks, rows };
}

/** How far a transect has got against the season's target, for the map's colours and its legend. */
export type Progress = "none" | "under_half" | "half_or_more" | "target_reached";

export function progressOf(walks: number, target: number): Progress {
  if (walks >= target) return "target_reached";
  if (walks === 0) return "none";
  return walks * 2 >= target ? "half_or_more" : "under_half";
}
