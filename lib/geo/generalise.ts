import type { LineString, Position } from "./types";

/** How coarsely a sensitive route is shown to those who may not see it: 0.1° is about 11 km north–south. */
export const GENERALISED_DEGREES = 0.1;

export type GeneralisedRoute = { type: "generalised"; centre: Position; precisionDegrees: number };

const roundTo = (value: number, step: number) => Math.round(Math.round(value / step) * step * 1e6) / 1e6;

/** The centre of the route's bounding box, rounded to GENERALISED_DEGREES: where it is, not its path. */
export function generalise(route: LineString): GeneralisedRoute {
  let [west, south, east, north] = [Infinity, Infinity, -Infinity, -Infinity];
  for (const [lon, lat] of route.coordinates) {
    west = Math.min(west, lon);
    east = Math.max(east, lon);
    south = Math.min(south, lat);
    north = Math.max(north, lat);
  }
  const centre: Position = [roundTo((west + east) / 2, GENERALISED_DEGREES), roundTo((south + north) / 2, GENERALISED_DEGREES)];
  return { type: "generalised", centre, precisionDegrees: GENERALISED_DEGREES };
}
