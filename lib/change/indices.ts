// Temporal beta-diversity indices and their loss/gain parts (Legendre 2019, Ecology and
// Evolution 9: 3500-3514). Presence-absence: Jaccard (1912), Sørensen (1948); abundance:
// Ružička and the percentage difference (Bray-Curtis).
import type { Direction, IndexName } from "./types";

/** Values within this distance count as equal (README.md: "One site" and "The permutation test"). */
export const TOLERANCE = 1e-10;

export function isPresenceAbsence(index: IndexName): boolean {
  return index === "jaccard" || index === "sorensen";
}

/** Whether the denominator counts the shared part twice (Sørensen, percentage difference). */
export function doublesShared(index: IndexName): boolean {
  return index === "sorensen" || index === "percentage-difference";
}

export interface SiteParts {
  /** a or A */
  readonly shared: number;
  /** b or B */
  readonly lost: number;
  /** c or C */
  readonly gained: number;
  readonly losses: number;
  readonly gains: number;
  readonly dissimilarity: number;
  readonly direction: Direction;
}

/**
 * a, b, c for presence-absence or A, B, C for abundance (Legendre 2019, Box 1):
 * A = sum min(y1j, y2j), B = sum (y1j - min), C = sum (y2j - min). On 0/1 data the
 * abundance sums are exactly a, b and c, so one routine serves all four indices.
 * Presence-absence indices first turn counts into presence.
 */
export function rawParts(y1: ArrayLike<number>, y2: ArrayLike<number>, index: IndexName) {
  if (y1.length !== y2.length) throw new Error("vectors differ in length");
  const presence = isPresenceAbsence(index);
  let A = 0;
  let B = 0;
  let C = 0;
  for (let j = 0; j < y1.length; j++) {
    const x1 = presence ? (y1[j]! > 0 ? 1 : 0) : y1[j]!;
    const x2 = presence ? (y2[j]! > 0 ? 1 : 0) : y2[j]!;
    const m = x1 < x2 ? x1 : x2;
    A += m;
    B += x1 - m;
    C += x2 - m;
  }
  return { shared: A, lost: B, gained: C };
}

/** Denominator: a+b+c (Jaccard 1912, Ružička) or 2a+b+c (Sørensen 1948, percentage difference). */
export function denominator(index: IndexName, shared: number, lost: number, gained: number): number {
  return (doublesShared(index) ? 2 * shared : shared) + lost + gained;
}

export function directionOf(losses: number, gains: number): Direction {
  if (Math.abs(gains - losses) <= TOLERANCE) return "none";
  return gains > losses ? "gain" : "loss";
}

/**
 * D = (b+c)/denominator split into losses b/denominator and gains c/denominator, so that
 * losses + gains = D (Legendre 2019). Returns null for an empty denominator (nothing in
 * either season), where D is undefined.
 */
export function partsFromSums(index: IndexName, shared: number, lost: number, gained: number): SiteParts | null {
  const den = denominator(index, shared, lost, gained);
  if (!(den > 0)) return null;
  const losses = lost / den;
  const gains = gained / den;
  return { shared, lost, gained, losses, gains, dissimilarity: (lost + gained) / den, direction: directionOf(losses, gains) };
}

/** All parts for one site's two vectors; null when both are empty. */
export function siteParts(y1: ArrayLike<number>, y2: ArrayLike<number>, index: IndexName): SiteParts | null {
  const { shared, lost, gained } = rawParts(y1, y2, index);
  return partsFromSums(index, shared, lost, gained);
}
