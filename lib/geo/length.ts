import { length } from "@turf/length";
import type { Position } from "./types";

/**
 * Geodesic length of a line in metres, from @turf/length (haversine on the mean-radius sphere,
 * 6,371,008.8 m). Never typed by hand.
 */
export function lengthMetres(coordinates: Position[]): number {
  if (coordinates.length < 2) return 0;
  return length({ type: "Feature", properties: {}, geometry: { type: "LineString", coordinates } }, { units: "meters" });
}
