import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { segmentsMeet, selfCrossings } from "@/lib/geo/crossings";
import type { Position } from "@/lib/geo/types";

// The plain pairwise test (every non-neighbouring pair of segments, as the textbook
// orientation test does it): the grid must find exactly what this finds.
function bruteForce(line: Position[]): [number, number][] {
  const n = line.length - 1;
  const closed = line[0]![0] === line[n]![0] && line[0]![1] === line[n]![1];
  const out: [number, number][] = [];
  for (let i = 0; i < n; i++) {
    for (let j = i + 2; j < n; j++) {
      if (closed && i === 0 && j === n - 1) continue;
      if (segmentsMeet([line[i]!, line[i + 1]!], [line[j]!, line[j + 1]!])) out.push([i, j]);
    }
  }
  return out;
}

describe("self-crossings", () => {
  it("finds a figure of eight's crossing and none on a simple loop or a straight line", () => {
    expect(selfCrossings([[0, 0], [1, 1], [1, 0], [0, 1]])).toEqual([[0, 2]]);
    expect(selfCrossings([[0, 0], [1, 0], [1, 1], [0, 1], [0, 0]])).toEqual([]);
    expect(selfCrossings([[0, 0], [1, 0], [2, 0], [3, 0]])).toEqual([]);
  });

  it("counts a route that doubles back over itself (an out-and-back walk) as touching", () => {
    // Out along y = 0 to x = 2, back to x = 0.5: the way back lies on both outward segments.
    expect(selfCrossings([[0, 0], [1, 0], [2, 0], [1.5, 0], [0.5, 0]])).toEqual([[0, 3], [1, 3]]);
    // Touching at a single point counts too.
    expect(selfCrossings([[0, 0], [2, 0], [2, 1], [1, 0], [1, -1]])).toEqual([[0, 2], [0, 3]]);
  });

  it("agrees with the pairwise test on random lines", () => {
    const point = fc.tuple(fc.integer({ min: 0, max: 20 }), fc.integer({ min: 0, max: 20 })) as fc.Arbitrary<Position>;
    fc.assert(
      fc.property(fc.array(point, { minLength: 2, maxLength: 40 }), (line) => {
        expect(selfCrossings(line, 10_000)).toEqual(bruteForce(line));
      }),
      { numRuns: 300 },
    );
  });

  it("tests a few pairs per segment on a long GPS-like track, not every pair", () => {
    const track: Position[] = Array.from({ length: 20_000 }, (_, i) => [-1.3 + i * 1e-5, 51 + Math.sin(i / 50) * 1e-3]);
    const stats = { pairsTested: 0 };
    expect(selfCrossings(track, 20, stats)).toEqual([]);
    // Every pair would be about 2 × 10⁸ tests.
    expect(stats.pairsTested).toBeGreaterThan(0);
    expect(stats.pairsTested).toBeLessThan(10 * track.length);
  });
});
