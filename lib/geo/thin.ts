import type { Position } from "./types";

/**
 * At most `max` points of a line for an overview map (every k-th point, ends kept). Only for
 * drawing many routes at once; lengths and sections always use the full route.
 */
export function thinForOverview(coordinates: Position[], max = 400): Position[] {
  if (coordinates.length <= max) return coordinates;
  const step = (coordinates.length - 1) / (max - 1);
  return Array.from({ length: max }, (_, i) => coordinates[Math.round(i * step)]!);
}
