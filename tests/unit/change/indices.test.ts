import fc from "fast-check";
import { distance } from "ml-distance";
import { describe, expect, it } from "vitest";
import { siteParts } from "../../../lib/change/indices";
import { INDICES } from "../../../lib/change/types";
import { countVector } from "./support";

describe("check values", () => {
  // Worked by hand from the Jaccard (1912) formula: species 1 and 4 in both (a = 2),
  // species 2 only at T1 (b = 1), species 3 and 5 only at T2 (c = 2): D = 3/5.
  it("Jaccard on a small presence-absence pair", () => {
    const parts = siteParts([1, 1, 0, 1, 0], [1, 0, 1, 1, 1], "jaccard")!;
    expect([parts.shared, parts.lost, parts.gained]).toEqual([2, 1, 2]);
    expect(parts.losses).toBeCloseTo(1 / 5, 12);
    expect(parts.gains).toBeCloseTo(2 / 5, 12);
    expect(parts.dissimilarity).toBeCloseTo(3 / 5, 12);
    expect(parts.direction).toBe("gain");
  });

  // Worked by hand from the Sørensen (1948) formula: same a, b, c; D = (b+c)/(2a+b+c) = 3/7.
  it("Sørensen on the same pair, with counts turned into presence", () => {
    const parts = siteParts([5, 2, 0, 1, 0], [3, 0, 7, 1, 2], "sorensen")!;
    expect([parts.shared, parts.lost, parts.gained]).toEqual([2, 1, 2]);
    expect(parts.losses).toBeCloseTo(1 / 7, 12);
    expect(parts.gains).toBeCloseTo(2 / 7, 12);
    expect(parts.dissimilarity).toBeCloseTo(3 / 7, 12);
  });

  // Hand-worked loss-dominated case: a = 1, b = 3, c = 0.
  it("direction is loss when losses exceed gains and none when equal", () => {
    expect(siteParts([1, 1, 1, 1], [1, 0, 0, 0], "jaccard")!.direction).toBe("loss");
    expect(siteParts([1, 0, 1], [0, 1, 1], "jaccard")!.direction).toBe("none");
    expect(siteParts([0.1, 0.2, 0], [0, 0, 0.30000000000000004], "ruzicka")!.direction).toBe("none");
  });

  // ml-distance: distance.sorensen is the percentage difference, distance.soergel the
  // Ružička dissimilarity (lib/change/README.md, "Check values").
  it("abundance indices match ml-distance on x=[1,0,3,2], y=[0,2,3,4]", () => {
    const x = [1, 0, 3, 2];
    const y = [0, 2, 3, 4];
    expect(siteParts(x, y, "percentage-difference")!.dissimilarity).toBeCloseTo(0.3333, 4);
    expect(siteParts(x, y, "ruzicka")!.dissimilarity).toBeCloseTo(0.5, 12);
    expect(distance.sorensen(x, y)).toBeCloseTo(0.3333, 4);
    expect(distance.soergel(x, y)).toBeCloseTo(0.5, 12);
  });

  it("abundance indices match ml-distance on random vectors", () => {
    fc.assert(
      fc.property(
        fc.integer({ min: 1, max: 12 }).chain((p) => fc.tuple(countVector(p), countVector(p))),
        ([x, y]) => {
          fc.pre(x.some((v) => v > 0) || y.some((v) => v > 0));
          expect(siteParts(x, y, "percentage-difference")!.dissimilarity).toBeCloseTo(distance.sorensen(x, y), 12);
          expect(siteParts(x, y, "ruzicka")!.dissimilarity).toBeCloseTo(distance.soergel(x, y), 12);
        },
      ),
      { numRuns: 300 },
    );
  });

  it("is undefined (null) for two empty vectors", () => {
    for (const index of INDICES) expect(siteParts([0, 0], [0, 0], index)).toBeNull();
  });
});

describe("properties", () => {
  const pair = fc
    .integer({ min: 1, max: 10 })
    .chain((p) => fc.tuple(countVector(p), countVector(p)))
    .filter(([x, y]) => x.some((v) => v > 0) || y.some((v) => v > 0));

  it("losses + gains = D and 0 <= D <= 1, for every index", () => {
    fc.assert(
      fc.property(pair, fc.constantFrom(...INDICES), ([x, y], index) => {
        const s = siteParts(x, y, index)!;
        expect(s.losses + s.gains).toBeCloseTo(s.dissimilarity, 12);
        expect(s.dissimilarity).toBeGreaterThanOrEqual(0);
        expect(s.dissimilarity).toBeLessThanOrEqual(1);
        expect(s.losses).toBeGreaterThanOrEqual(0);
        expect(s.gains).toBeGreaterThanOrEqual(0);
      }),
    );
  });

  it("swapping the surveys swaps losses and gains", () => {
    fc.assert(
      fc.property(pair, fc.constantFrom(...INDICES), ([x, y], index) => {
        const forward = siteParts(x, y, index)!;
        const back = siteParts(y, x, index)!;
        expect(back.losses).toBeCloseTo(forward.gains, 14);
        expect(back.gains).toBeCloseTo(forward.losses, 14);
        expect(back.shared).toBe(forward.shared);
        expect(back.dissimilarity).toBeCloseTo(forward.dissimilarity, 14);
      }),
    );
  });

  it("abundance indices on 0/1 data equal the presence-absence ones", () => {
    fc.assert(
      fc.property(pair, ([x, y]) => {
        const px = x.map((v) => (v > 0 ? 1 : 0));
        const py = y.map((v) => (v > 0 ? 1 : 0));
        expect(siteParts(px, py, "ruzicka")).toEqual(siteParts(x, y, "jaccard"));
        expect(siteParts(px, py, "percentage-difference")).toEqual(siteParts(x, y, "sorensen"));
      }),
    );
  });
});
