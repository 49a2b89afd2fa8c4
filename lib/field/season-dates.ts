import { contains, type SeasonPhase } from "@/lib/seasons/rules";

// Which dates the phone offers, from the seasons in its reference data (those taking walks now:
// open, or closed and in their grace period). The server checks again (lib/seasons/rules.ts
// fieldDateVerdict); this only keeps the volunteer from choosing a date it would refuse.
// Pure and zod-free: the field home and the start form use it.

export type FieldSeason = { name: string; startsOn: string; endsOn: string; phase: SeasonPhase };

const describe = (s: FieldSeason) => `the ${s.name} (${s.startsOn} to ${s.endsOn})`;

export const NO_SEASON_TAKES_WALKS = "No season is open for walks just now, so this phone cannot record one. Your network organiser opens the season.";

/** The earliest and latest date to offer (never after today), or null when no season takes walks up to today. */
export function fieldDateBounds(seasons: readonly FieldSeason[], today: string): { min: string; max: string } | null {
  const started = seasons.filter((s) => s.startsOn <= today);
  if (!started.length) return null;
  const min = started.map((s) => s.startsOn).sort()[0]!;
  const latestEnd = started.map((s) => s.endsOn).sort().at(-1)!;
  return { min, max: latestEnd < today ? latestEnd : today };
}

/** Why a walk cannot be dated `day` on this phone, or null when it can. */
export function fieldDateProblem(day: string, seasons: readonly FieldSeason[], today: string): string | null {
  if (day > today) return "This date is in the future: choose the day you walk.";
  if (seasons.some((s) => contains(s, day))) return null;
  const offered = seasons.filter((s) => s.startsOn <= today);
  if (!offered.length) return NO_SEASON_TAKES_WALKS;
  return `Choose a date inside ${offered.map(describe).join(" or ")}: walks can only be dated in a season that takes them.`;
}

/** The open season holding `today`, if any: weather reports are only taken while it is open. */
export function openSeasonOn(seasons: readonly FieldSeason[], today: string): FieldSeason | null {
  return seasons.find((s) => s.phase === "open" && contains(s, today)) ?? null;
}
