import { describe, expect, it } from "vitest";
import { pairedTTest } from "../../../lib/change/paired-test";

// Student's (1908) sleep data as shipped with R (`sleep`): extra hours of sleep.
const drug1 = [0.7, -1.6, -0.2, -1.2, -0.1, 3.4, 3.7, 0.8, 0.0, 2.0];
const drug2 = [1.9, 0.8, 1.1, 0.1, -0.1, 4.4, 5.5, 1.6, 4.6, 3.4];

describe("paired t-test", () => {
  // R: t.test(extra ~ group, data = sleep, paired = TRUE) on drug 2 minus drug 1 prints
  // t = 4.0621, df = 9, p-value = 0.002833, mean difference 1.58.
  it("reproduces R's t.test on Student's sleep data", () => {
    const r = pairedTTest(drug2, drug1, { permutations: 0, seed: 1 });
    expect(r.n).toBe(10);
    expect(r.t!).toBeCloseTo(4.0621, 4);
    expect(r.df).toBe(9);
    expect(r.p!).toBeCloseTo(0.002833, 6);
    expect(r.meanDifference!).toBeCloseTo(1.58, 12);
    expect(r.pPermutation).toBeNull();
  });

  it("is antisymmetric in the two samples", () => {
    const a = pairedTTest(drug2, drug1, { permutations: 0, seed: 1 });
    const b = pairedTTest(drug1, drug2, { permutations: 0, seed: 1 });
    expect(b.t!).toBeCloseTo(-a.t!, 12);
    expect(b.p!).toBeCloseTo(a.p!, 12);
  });

  // The exact sign-flip p-value comes from enumerating all 2^10 sign patterns of the sleep
  // differences; the seeded Monte Carlo estimate must be within 4 binomial sd of it.
  it("sign-flip p-value agrees with full enumeration and is reproducible", () => {
    const d = drug2.map((x, i) => x - drug1[i]!);
    const tOf = (v: number[]) => {
      const m = v.reduce((s, x) => s + x, 0) / v.length;
      const sd = Math.sqrt(v.reduce((s, x) => s + (x - m) ** 2, 0) / (v.length - 1));
      return Math.abs(m / (sd / Math.sqrt(v.length)));
    };
    const tObs = tOf(d);
    let hits = 0;
    for (let mask = 0; mask < 1 << d.length; mask++) {
      if (tOf(d.map((x, i) => ((mask >> i) & 1 ? -x : x))) >= tObs - 1e-9) hits++;
    }
    const exact = hits / (1 << d.length);
    const R = 4000;
    const r = pairedTTest(drug2, drug1, { permutations: R, seed: 8 });
    const sd = Math.sqrt((exact * (1 - exact)) / R);
    expect(Math.abs(r.pPermutation! - exact)).toBeLessThan(4 * sd + 1 / R);
    expect(pairedTTest(drug2, drug1, { permutations: R, seed: 8 }).pPermutation).toBe(r.pPermutation);
  });

  it("returns nulls, not NaN or Infinity, for n < 2 or constant differences", () => {
    expect(pairedTTest([], [], { permutations: 10, seed: 1 })).toEqual({ n: 0, meanDifference: null, t: null, df: null, p: null, pPermutation: null });
    expect(pairedTTest([0.5], [0.2], { permutations: 10, seed: 1 })).toMatchObject({ n: 1, t: null, df: null, p: null, pPermutation: null });
    expect(pairedTTest([0.5], [0.2], { permutations: 10, seed: 1 }).meanDifference!).toBeCloseTo(0.3, 12);
    const constant = pairedTTest([0.3, 0.4, 0.5], [0.1, 0.2, 0.3], { permutations: 10, seed: 1 });
    expect(constant).toMatchObject({ n: 3, df: 2, t: null, p: null, pPermutation: null });
    const zero = pairedTTest([0.2, 0.2], [0.2, 0.2], { permutations: 10, seed: 1 });
    expect(zero).toMatchObject({ meanDifference: 0, t: null, p: null });
  });

  it("gives t = 0 and p = 1 for a zero mean difference with spread", () => {
    const r = pairedTTest([0.3, 0.1], [0.1, 0.3], { permutations: 50, seed: 1 });
    expect(r.t).toBe(0);
    expect(r.p!).toBeCloseTo(1, 12);
    expect(r.pPermutation).toBe(1);
  });
});
