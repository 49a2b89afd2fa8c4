import type { Position } from "./types";

/**
 * Reads one GeoJSON position (RFC 7946 §3.1.1: longitude, latitude, optional altitude, which a
 * transect does not need and is dropped) and says what is wrong with it, if anything.
 */
export function readPosition(value: unknown, where: string): { position: Position } | { error: string } {
  if (!Array.isArray(value) || value.length < 2 || value.length > 3) {
    return { error: `${where}: a position must be [longitude, latitude].` };
  }
  const [lon, lat] = value as unknown[];
  if (typeof lon !== "number" || typeof lat !== "number" || !Number.isFinite(lon) || !Number.isFinite(lat)) {
    return { error: `${where}: longitude and latitude must be numbers.` };
  }
  if (lon < -180 || lon > 180) return { error: `${where}: longitude ${lon} is outside −180 to 180.` };
  if (lat < -90 || lat > 90) return { error: `${where}: latitude ${lat} is outside −90 to 90.` };
  return { position: [lon, lat] };
}

/** Checked positions of one line, repeated consecutive points dropped; errors stop at the first five. */
export function readLine(values: unknown, where: string): { positions: Position[]; errors: string[] } {
  if (!Array.isArray(values)) return { positions: [], errors: [`${where}: coordinates must be a list of positions.`] };
  const positions: Position[] = [];
  const errors: string[] = [];
  values.forEach((value, i) => {
    if (errors.length >= 5) return;
    const read = readPosition(value, `${where}, point ${i + 1}`);
    if ("error" in read) errors.push(read.error);
    else if (!sameSpot(positions[positions.length - 1], read.position)) positions.push(read.position);
  });
  return { positions, errors };
}

export const sameSpot = (a: Position | undefined, b: Position | undefined) => Boolean(a && b && a[0] === b[0] && a[1] === b[1]);

const EARTH_RADIUS_METRES = 6_371_008.8;

/**
 * Distance in metres from p to the segment a–b on a local equirectangular projection: accurate
 * to well under a metre over the few metres this is used for (joints between sections).
 */
export function metresToSegment(p: Position, a: Position, b: Position): number {
  const k = Math.cos((p[1] * Math.PI) / 180);
  const toXY = (q: Position) => [((q[0] - p[0]) * Math.PI * EARTH_RADIUS_METRES * k) / 180, ((q[1] - p[1]) * Math.PI * EARTH_RADIUS_METRES) / 180] as const;
  const [ax, ay] = toXY(a);
  const [bx, by] = toXY(b);
  const dx = bx - ax;
  const dy = by - ay;
  const span = dx * dx + dy * dy;
  const t = span === 0 ? 0 : Math.max(0, Math.min(1, -(ax * dx + ay * dy) / span));
  return Math.hypot(ax + t * dx, ay + t * dy);
}
