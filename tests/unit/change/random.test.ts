import { describe, expect, it } from "vitest";
import { STREAM_SITE_PERMUTATION, Xoshiro128, streamState } from "../../../lib/change/random";

describe("Xoshiro128", () => {
  // Expected outputs printed by the authors' reference C code (xoshiro128starstar.c)
  // compiled with gcc, from state {1, 2, 3, 4}.
  it("reproduces the reference xoshiro128** sequence", () => {
    const rng = new Xoshiro128(1, 2, 3, 4);
    expect(Array.from({ length: 6 }, () => rng.nextU32())).toEqual([11520, 0, 5927040, 70819200, 2031721883, 1637235492]);
  });

  // Same C program: splitmix64 from h = mix(mix(42 ^ 1*golden) ^ 7), two outputs split into
  // 32-bit words, then four xoshiro128** outputs.
  it("derives stream (seed 42, purpose 1, index 7) exactly as the C reference", () => {
    expect(Array.from(streamState(42, STREAM_SITE_PERMUTATION, 7), (w) => w >>> 0)).toEqual([2506683728, 2989333583, 3870106905, 4236009859]);
    const rng = Xoshiro128.stream(42, STREAM_SITE_PERMUTATION, 7);
    expect(Array.from({ length: 4 }, () => rng.nextU32())).toEqual([37548965, 3937307268, 3740504037, 4203474330]);
  });

  it("gives different streams for different indices, purposes and seeds", () => {
    const first = (seed: number, purpose: number, index: number) => Xoshiro128.stream(seed, purpose, index).nextU32();
    const values = new Set([first(1, 1, 0), first(1, 1, 1), first(1, 2, 0), first(2, 1, 0), first(0, 1, 0)]);
    expect(values.size).toBe(5);
  });

  it("below(m) is uniform on [0, m): chi-square at 6 cells", () => {
    const rng = Xoshiro128.stream(3, 3, 0);
    const counts = new Array<number>(6).fill(0);
    const draws = 60000;
    let outside = 0;
    for (let i = 0; i < draws; i++) {
      const v = rng.below(6);
      if (v >= 0 && v < 6 && Number.isInteger(v)) counts[v]!++;
      else outside++;
    }
    expect(outside).toBe(0);
    const expected = draws / 6;
    const chi2 = counts.reduce((s, c) => s + (c - expected) ** 2 / expected, 0);
    // 5 degrees of freedom: the upper 0.1% point is 20.52 (standard chi-square table).
    expect(chi2).toBeLessThan(20.52);
  });

  it("below(m) stays in range for large ranges and for m = 1", () => {
    const rng = Xoshiro128.stream(4, 3, 0);
    for (const m of [1, 2, 2097151, 2097152, 2097153, 4294967295]) {
      for (let i = 0; i < 200; i++) {
        const v = rng.below(m);
        expect(Number.isInteger(v) && v >= 0 && v < m).toBe(true);
      }
    }
  });

  it("rejects seeds that are not safe integers", () => {
    expect(() => Xoshiro128.stream(1.5, 1, 0)).toThrow(RangeError);
    expect(() => Xoshiro128.stream(2 ** 60, 1, 0)).toThrow(RangeError);
  });
});
