import type { Position } from "./types";

// Where a route crosses or touches itself. Loops and out-and-back routes are common, so this
// only ever warns. Segments are bucketed into a grid so a long GPS track costs about n checks
// rather than n² (the plain pairwise test is quadratic).

type Segment = [Position, Position];

const orient = (a: Position, b: Position, c: Position) => Math.sign((b[0] - a[0]) * (c[1] - a[1]) - (b[1] - a[1]) * (c[0] - a[0]));
const within = (a: Position, b: Position, c: Position) =>
  Math.min(a[0], b[0]) <= c[0] && c[0] <= Math.max(a[0], b[0]) && Math.min(a[1], b[1]) <= c[1] && c[1] <= Math.max(a[1], b[1]);

/** Whether two segments meet, touching and collinear overlaps included (the orientation test). */
export function segmentsMeet([p1, p2]: Segment, [q1, q2]: Segment): boolean {
  const o1 = orient(p1, p2, q1);
  const o2 = orient(p1, p2, q2);
  const o3 = orient(q1, q2, p1);
  const o4 = orient(q1, q2, p2);
  if (o1 !== o2 && o3 !== o4) return true;
  return (o1 === 0 && within(p1, p2, q1)) || (o2 === 0 && within(p1, p2, q2)) || (o3 === 0 && within(q1, q2, p1)) || (o4 === 0 && within(q1, q2, p2));
}

/**
 * Pairs of segment numbers (0-based, i < j) where the line meets itself, neighbours excluded
 * (they share a point by construction), as are the first and last segments of a closed loop.
 * Stops after `limit` pairs. `stats` counts the pairs it had to test (the grid's work).
 */
export function selfCrossings(coordinates: Position[], limit = 20, stats?: { pairsTested: number }): [number, number][] {
  const n = coordinates.length - 1;
  if (n < 3) return [];
  let [minX, minY, maxX, maxY] = [Infinity, Infinity, -Infinity, -Infinity];
  for (const [x, y] of coordinates) {
    minX = Math.min(minX, x);
    minY = Math.min(minY, y);
    maxX = Math.max(maxX, x);
    maxY = Math.max(maxY, y);
  }
  const cells = Math.max(1, Math.ceil(Math.sqrt(n)));
  const cellW = (maxX - minX) / cells || 1;
  const cellH = (maxY - minY) / cells || 1;
  const cellOf = (v: number, min: number, size: number) => Math.min(cells - 1, Math.floor((v - min) / size));
  const grid = new Map<number, number[]>();
  for (let i = 0; i < n; i++) {
    const [a, b] = [coordinates[i]!, coordinates[i + 1]!];
    for (let cx = cellOf(Math.min(a[0], b[0]), minX, cellW); cx <= cellOf(Math.max(a[0], b[0]), minX, cellW); cx++) {
      for (let cy = cellOf(Math.min(a[1], b[1]), minY, cellH); cy <= cellOf(Math.max(a[1], b[1]), minY, cellH); cy++) {
        const key = cx * cells + cy;
        const list = grid.get(key);
        if (list) list.push(i);
        else grid.set(key, [i]);
      }
    }
  }
  const closed = coordinates[0]![0] === coordinates[n]![0] && coordinates[0]![1] === coordinates[n]![1];
  const seen = new Set<number>();
  const found: [number, number][] = [];
  for (const list of grid.values()) {
    for (let x = 0; x < list.length; x++) {
      for (let y = x + 1; y < list.length; y++) {
        const i = list[x]!;
        const j = list[y]!;
        if (j - i === 1 || (closed && i === 0 && j === n - 1)) continue;
        const key = i * n + j;
        if (seen.has(key)) continue;
        seen.add(key);
        if (stats) stats.pairsTested++;
        if (segmentsMeet([coordinates[i]!, coordinates[i + 1]!], [coordinates[j]!, coordinates[j + 1]!])) {
          found.push([i, j]);
          if (found.length >= limit) return found.sort((p, q) => p[0] - q[0] || p[1] - q[1]);
        }
      }
    }
  }
  return found.sort((p, q) => p[0] - q[0] || p[1] - q[1]);
}
