// How each week's state and each progress band are shown. Every state has its own symbol and
// words, so nothing depends on telling colours apart; the colours (tailwind.config.ts, and the
// habitat palette for map lines) only help.
import type { CellState, Progress } from "@/lib/effort/grid";

export const CELL_STATES: Record<CellState, { symbol: string; label: string; className: string }> = {
  sightings: { symbol: "●", label: "Walked, with sightings", className: "bg-lichen-700 text-white" },
  nothing_seen: { symbol: "○", label: "Walked, nothing seen", className: "bg-lichen-100 text-lichen-700" },
  weather: { symbol: "W", label: "Not walked: weather", className: "bg-sand-100 text-sand-800" },
  not_walked: { symbol: "–", label: "Not walked", className: "bg-white text-shingle-600" },
  upcoming: { symbol: "·", label: "Week still to come", className: "bg-shingle-50 text-shingle-400" },
};

export const CELL_STATE_ORDER: CellState[] = ["sightings", "nothing_seen", "weather", "not_walked", "upcoming"];

/** Map line colours (palette keys, lib/geo/palette.ts) and words; no walks yet is also dashed. */
export const PROGRESS_BANDS: Record<Progress, { colour: string; label: string; dashed: boolean }> = {
  none: { colour: "brick", label: "No walks yet", dashed: true },
  under_half: { colour: "gorse", label: "Under half the target", dashed: false },
  half_or_more: { colour: "kingfisher", label: "Half the target or more", dashed: false },
  target_reached: { colour: "downland", label: "Target reached", dashed: false },
};

export const PROGRESS_ORDER: Progress[] = ["none", "under_half", "half_or_more", "target_reached"];

const dayFormat = (options: Intl.DateTimeFormatOptions) => (day: string) => new Date(`${day}T00:00:00Z`).toLocaleDateString("en-GB", { ...options, timeZone: "UTC" });

export const shortDay = dayFormat({ day: "numeric", month: "short" });
export const longDay = dayFormat({ weekday: "long", day: "numeric", month: "long", year: "numeric" });
export const plainDay = dayFormat({ day: "numeric", month: "short", year: "numeric" });
