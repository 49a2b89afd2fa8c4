import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { denseReference } from "../../../lib/change/dense-reference";
import { addChunkCounts, observedSums, permutationPValues, planChunks, runPermutationChunk } from "../../../lib/change/permutation";
import { preparePair } from "../../../lib/change/tables";
import { INDICES, PERMUTATION_MODES } from "../../../lib/change/types";
import { randomPair, table, tablePair } from "./support";

const run = (prepared: ReturnType<typeof preparePair>, mode: "paired" | "independent", seed: number, start: number, count: number) =>
  runPermutationChunk({ prepared, mode, seed, start, count }).exceed;

describe("sparse permutation engine against the dense reference", () => {
  // The dense reference rebuilds whole permuted tables and recomputes every cell, drawing
  // the same random numbers: any bookkeeping error in the sparse engine changes counts.
  it("gives identical counts on random small tables, all indices and both modes", () => {
    fc.assert(
      fc.property(
        tablePair({ maxSites: 7, maxSpecies: 5, decimals: true }),
        fc.constantFrom(...INDICES),
        fc.constantFrom(...PERMUTATION_MODES),
        fc.nat({ max: 1000 }),
        ({ before, after }, index, mode, seed) => {
          const prepared = preparePair(before, after, index);
          fc.pre(prepared.sites.length > 0);
          const dense = denseReference(before, after, { index, mode, seed, permutations: 40 });
          expect(dense.sites).toEqual(prepared.sites);
          expect(run(prepared, mode, seed, 0, 40)).toEqual(Array.from(dense.counts));
        },
      ),
      { numRuns: 150 },
    );
  });

  it("gives identical counts on a larger sparse case", () => {
    const { before, after } = randomPair(11, 60, 25, 0.15);
    for (const mode of PERMUTATION_MODES) {
      const prepared = preparePair(before, after, "percentage-difference");
      const dense = denseReference(before, after, { index: "percentage-difference", mode, seed: 5, permutations: 60 });
      expect(run(prepared, mode, 5, 0, 60)).toEqual(Array.from(dense.counts));
    }
  });

  // A dense implementation with its own complete shuffles (a different stream with the
  // same distribution) must give p-values within Monte Carlo error: binomial sd of p is
  // at most 0.5/sqrt(R) per estimate; 5 sd of the difference of two estimates is the bound.
  it("agrees in distribution with full Fisher-Yates shuffles of every column", () => {
    const { before, after } = randomPair(12, 25, 12, 0.3);
    const R = 2000;
    const bound = 5 * Math.SQRT2 * (0.5 / Math.sqrt(R));
    for (const mode of PERMUTATION_MODES) {
      const prepared = preparePair(before, after, "ruzicka");
      const fast = run(prepared, mode, 21, 0, R);
      const full = denseReference(before, after, { index: "ruzicka", mode, seed: 22, permutations: R, shuffle: "full" });
      fast.forEach((c, i) => expect(Math.abs(c - full.counts[i]!) / R).toBeLessThan(bound));
    }
  });
});

describe("p-values", () => {
  it("lie in [1/(R+1), 1]", () => {
    fc.assert(
      fc.property(tablePair(), fc.constantFrom(...INDICES), fc.constantFrom(...PERMUTATION_MODES), fc.integer({ min: 1, max: 30 }), ({ before, after }, index, mode, R) => {
        const prepared = preparePair(before, after, index);
        const p = permutationPValues(run(prepared, mode, 3, 0, R), R);
        for (const v of p) {
          expect(v).not.toBeNull();
          expect(v!).toBeGreaterThanOrEqual(1 / (R + 1));
          expect(v!).toBeLessThanOrEqual(1);
        }
      }),
      { numRuns: 100 },
    );
  });

  it("are null without permutations", () => {
    expect(permutationPValues([0, 3], 0)).toEqual([null, null]);
  });

  // With one species at every site the permuted tables are the observed ones up to site
  // order; a site whose D equals every other site's D is always matched (within 1e-10).
  it("count ties as >= and reach 1 when every permuted D ties", () => {
    const t1 = table([[1, 1], [1, 1], [1, 1]]);
    const t2 = table([[1, 0], [1, 0], [1, 0]]);
    const prepared = preparePair(t1, t2, "jaccard");
    expect(run(prepared, "paired", 1, 0, 50)).toEqual([50, 50, 50]);
  });

  // Two sites, one species at one site only: in every permutation one of the two sites
  // is empty, and an empty permuted site never counts as >=.
  it("never count a permuted site with an empty denominator", () => {
    const prepared = preparePair(table([[1, 0], [0, 1]]), table([[0, 0], [0, 1]]), "jaccard");
    const R = 400;
    const counts = run(prepared, "paired", 9, 0, R);
    // Site 1 (D = 1) matches only when it receives species 1 and not species 2: about R/4.
    expect(counts[0]!).toBeGreaterThan(R * 0.15);
    expect(counts[0]!).toBeLessThan(R * 0.35);
    // Site 2 (D = 0) matches whenever it is non-empty: 3/4 of permutations, never all.
    expect(counts[1]!).toBeGreaterThan(R * 0.65);
    expect(counts[1]!).toBeLessThan(R * 0.85);
  });
});

describe("seeds and chunks", () => {
  it("same seed gives identical counts; another seed gives other counts", () => {
    const { before, after } = randomPair(13, 40, 15, 0.25);
    const prepared = preparePair(before, after, "sorensen");
    const a = run(prepared, "paired", 77, 0, 200);
    expect(run(prepared, "paired", 77, 0, 200)).toEqual(a);
    expect(run(prepared, "paired", 78, 0, 200)).not.toEqual(a);
  });

  it("counts of any split into chunks add up to the single-run counts", () => {
    const { before, after } = randomPair(14, 30, 10, 0.3);
    const total = 120;
    fc.assert(
      fc.property(
        fc.uniqueArray(fc.integer({ min: 1, max: total - 1 }), { maxLength: 8 }),
        fc.constantFrom(...PERMUTATION_MODES),
        (cuts, mode) => {
          const prepared = preparePair(before, after, "percentage-difference");
          const bounds = [0, ...[...cuts].sort((x, y) => x - y), total];
          const chunks = bounds.slice(1).map((end, k) => runPermutationChunk({ prepared, mode, seed: 5, start: bounds[k]!, count: end - bounds[k]! }));
          const whole = run(prepared, mode, 5, 0, total);
          // Chunks in any order.
          expect(Array.from(addChunkCounts(prepared.sites.length, total, chunks.reverse()))).toEqual(whole);
        },
      ),
      { numRuns: 20 },
    );
  });

  it("planChunks tiles 0..R-1 and addChunkCounts refuses gaps, overlaps and wrong totals", () => {
    expect(planChunks(7, 3)).toEqual([{ start: 0, count: 3 }, { start: 3, count: 3 }, { start: 6, count: 1 }]);
    expect(planChunks(0, 3)).toEqual([]);
    const c = (start: number, count: number) => ({ start, count, exceed: [1] });
    expect(() => addChunkCounts(1, 6, [c(0, 3), c(4, 2)])).toThrow(/gap or overlap/);
    expect(() => addChunkCounts(1, 6, [c(0, 3), c(2, 4)])).toThrow(/gap or overlap/);
    expect(() => addChunkCounts(1, 6, [c(0, 3)])).toThrow(/expected 0..5/);
    expect(Array.from(addChunkCounts(1, 6, [c(3, 3), c(0, 3)]))).toEqual([2]);
  });

  it("rejects unknown modes, bad ranges and observed D of the wrong length", () => {
    const prepared = preparePair(table([[1, 0], [0, 1]]), table([[1, 1], [0, 1]]), "jaccard");
    expect(() => runPermutationChunk({ prepared, mode: "shuffled" as never, seed: 1, start: 0, count: 1 })).toThrow(/unknown permutation mode/);
    expect(() => runPermutationChunk({ prepared, mode: "paired", seed: 1, start: -1, count: 1 })).toThrow(RangeError);
    expect(() => runPermutationChunk({ prepared, mode: "paired", seed: 1, start: 0, count: 1.5 })).toThrow(RangeError);
    expect(() => runPermutationChunk({ prepared, mode: "paired", seed: 1, start: 0, count: 1, observed: new Float64Array(1) })).toThrow(/observed D/);
  });

  it("observed D from the cell lists matches the per-site formula", () => {
    const { before, after } = randomPair(15, 20, 8, 0.3);
    const prepared = preparePair(before, after, "percentage-difference");
    const dense = denseReference(before, after, { index: "percentage-difference", mode: "paired", seed: 1, permutations: 0 });
    expect(Array.from(observedSums(prepared).dissimilarity)).toEqual(Array.from(dense.observed));
  });
});
