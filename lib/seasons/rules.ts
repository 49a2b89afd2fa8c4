// The season rules, pure and dependency-free: the sync, the field screens, the paper-walk form
// and the organiser's season routes all ask these questions here.
//   planning → open → closed; closed is "grace" for season_grace_days after closed_at (late walks
//   and late checking still come in), then "frozen" (the records are fixed for analysis: a change
//   needs an organiser and is logged).
// A closed season is never reopened: late work fits the grace period, and after it an organiser
// can still change a frozen record (logged), so reopening would only blur which records a
// finished analysis used.

export type SeasonStatus = "planning" | "open" | "closed";
export type SeasonPhase = "planning" | "open" | "grace" | "frozen";

export type SeasonDates = { startsOn: string; endsOn: string };
export type SeasonState = { status: SeasonStatus; closedAt: Date | string | null };

const DAY_MS = 24 * 60 * 60 * 1000;

/** When a closed season's grace period ends (the first frozen instant); null while not closed. */
export function graceEndsAt(season: SeasonState, graceDays: number): Date | null {
  if (season.status !== "closed" || season.closedAt === null) return null;
  return new Date(new Date(season.closedAt).getTime() + graceDays * DAY_MS);
}

/** A season's phase at `now`: the grace period runs from closed_at for exactly graceDays × 24 h. */
export function phaseOf(season: SeasonState, graceDays: number, now: Date = new Date()): SeasonPhase {
  if (season.status === "planning") return "planning";
  const ends = graceEndsAt(season, graceDays);
  if (!ends) return "open";
  return now.getTime() < ends.getTime() ? "grace" : "frozen";
}

/** Phases whose seasons still take walks from the field. */
export const TAKES_FIELD_WALKS: readonly SeasonPhase[] = ["open", "grace"];

export const takesFieldWalks = (phase: SeasonPhase) => TAKES_FIELD_WALKS.includes(phase);

/** Whether the day (YYYY-MM-DD) lies inside the season's dates, both ends included. */
export const contains = (season: SeasonDates, day: string) => season.startsOn <= day && day <= season.endsOn;

/** The latest field date accepted: tomorrow by UTC, a day's allowance for phone clocks and time zones. */
export function latestFieldDate(now: Date = new Date()): string {
  return new Date(now.getTime() + DAY_MS).toISOString().slice(0, 10);
}

export const FIELD_DATE_REASONS = {
  noSeason: "No season covers this date. Walks can only be dated inside a season that is open.",
  notOpen: (name: string) => `The ${name} has not opened yet.`,
  frozen: (name: string) => `The ${name} is closed and its grace period is over, so it takes no more walks.`,
  future: "This date is in the future.",
} as const;

export type FieldDateVerdict<S> = { ok: true; season: S } | { ok: false; reason: string };

/**
 * Whether a volunteer's walk dated `day` is accepted: the day lies in a season that is open or in
 * its grace period, and is not later than tomorrow (UTC).
 */
export function fieldDateVerdict<S extends SeasonDates & SeasonState & { name: string }>(
  day: string,
  seasons: readonly S[],
  graceDays: number,
  now: Date = new Date(),
): FieldDateVerdict<S> {
  if (day > latestFieldDate(now)) return { ok: false, reason: FIELD_DATE_REASONS.future };
  const season = seasons.find((s) => contains(s, day));
  if (!season) return { ok: false, reason: FIELD_DATE_REASONS.noSeason };
  const phase = phaseOf(season, graceDays, now);
  if (phase === "planning") return { ok: false, reason: FIELD_DATE_REASONS.notOpen(season.name) };
  if (phase === "frozen") return { ok: false, reason: FIELD_DATE_REASONS.frozen(season.name) };
  return { ok: true, season };
}

/** Who may change a record of a season in this phase, and whether the change goes to the change log. */
export type RecordChange = { allowed: true; logged: boolean } | { allowed: false; reason: string };

export function recordChangeRule(phase: SeasonPhase, isOrganiser: boolean): RecordChange {
  if (phase !== "frozen") return { allowed: true, logged: false };
  if (isOrganiser) return { allowed: true, logged: true };
  return { allowed: false, reason: "This season is frozen for analysis: only an organiser can change its sightings, and the change is logged." };
}

/** The moves an organiser can make: planning → open → closed, nothing back. */
export const SEASON_TRANSITIONS: Readonly<Record<SeasonStatus, readonly SeasonStatus[]>> = {
  planning: ["open"],
  open: ["closed"],
  closed: [],
};

export const canMove = (from: SeasonStatus, to: SeasonStatus) => SEASON_TRANSITIONS[from].includes(to);

/** Dates can change only while planning; targets (and the name) at any time. */
export const datesEditable = (status: SeasonStatus) => status === "planning";

/** Whether two seasons share at least one day (both ends included, as the database's '[]' range). */
export const overlaps = (a: SeasonDates, b: SeasonDates) => a.startsOn <= b.endsOn && b.startsOn <= a.endsOn;

/** The first other season sharing a day with `candidate`, for a clear field message before the constraint. */
export function firstOverlap<S extends SeasonDates & { id: string }>(candidate: SeasonDates, others: readonly S[], exceptId?: string): S | null {
  return others.find((o) => o.id !== exceptId && overlaps(candidate, o)) ?? null;
}

export const overlapMessage = (other: SeasonDates & { name: string }) =>
  `These dates overlap the ${other.name} (${other.startsOn} to ${other.endsOn}). Seasons never share a day.`;
