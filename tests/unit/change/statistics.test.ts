import { describe, expect, it } from "vitest";
import { compareSeasonsSync } from "../../../lib/change/compare";
import { Xoshiro128 } from "../../../lib/change/random";
import { PERMUTATION_MODES } from "../../../lib/change/types";
import { table } from "./support";

/** Poisson variate by Knuth's multiplication method (fine for small means). */
function poisson(rng: Xoshiro128, mean: number): number {
  const limit = Math.exp(-mean);
  let k = 0;
  let prod = rng.nextFloat();
  while (prod > limit) {
    k++;
    prod *= rng.nextFloat();
  }
  return k;
}

/**
 * Null data: every site's values in both seasons drawn independently from one distribution
 * per species, so sites are exchangeable and nothing changed anywhere. `continuous` gives
 * zero-inflated exponential abundances (e.g. biomass), where D almost never ties; otherwise
 * Poisson counts.
 */
function nullPair(rng: Xoshiro128, n: number, p: number, continuous: boolean) {
  const means = Array.from({ length: p }, () => 0.5 + 2.5 * rng.nextFloat());
  const value = (m: number) => (continuous ? (rng.nextFloat() < 0.6 ? -Math.log(1 - rng.nextFloat()) * m : 0) : poisson(rng, m));
  const grid = () => Array.from({ length: n }, () => means.map(value));
  return { before: table(grid()), after: table(grid()) };
}

/** Two-sided Kolmogorov-Smirnov distance of a sample from the uniform(0, 1) CDF. */
function ksUniform(sample: number[]): number {
  const sorted = [...sample].sort((a, b) => a - b);
  const n = sorted.length;
  return Math.max(...sorted.map((x, i) => Math.max((i + 1) / n - x, x - i / n)));
}

describe("statistical behaviour", () => {
  // One p-value (site 1) per independent null data set, so the sample is i.i.d.; continuous
  // abundances, because ties in D make permutation p-values conservative (tested below).
  // Critical value: the asymptotic Kolmogorov distribution gives 1.628/sqrt(n) at the 1%
  // level (Smirnov 1948, Ann. Math. Statist. 19: 279-281). Permutation p-values live on the
  // grid k/(R+1), which moves the CDF by at most 1/(R+1): added to the tolerance.
  it.each(PERMUTATION_MODES)("per-site p-values are uniform under the null (%s mode, KS test)", (mode) => {
    const rng = Xoshiro128.stream(2024, 3, PERMUTATION_MODES.indexOf(mode));
    const R = 199;
    const sample: number[] = [];
    for (let k = 0; sample.length < 400; k++) {
      const { before, after } = nullPair(rng, 15, 10, true);
      const result = compareSeasonsSync(before, after, { index: "percentage-difference", mode, permutations: R, seed: 1000 + k });
      if (result.excluded.length > 0) continue; // keep all 15 sites exchangeable
      sample.push(result.sites[0]!.p!);
    }
    const critical = 1.628 / Math.sqrt(sample.length) + 1 / (R + 1);
    expect(ksUniform(sample)).toBeLessThan(critical);
    // The same check must reject p-values that are not uniform (a sanity check of the statistic).
    expect(ksUniform(sample.map((p) => p ** 1.5))).toBeGreaterThan(critical);
  });

  // Presence-absence D takes few values, so ties make p-values conservative, never liberal:
  // P(p <= 0.05) must not exceed 0.05 by more than 3 binomial sd.
  it("presence-absence p-values are not liberal under the null", () => {
    const rng = Xoshiro128.stream(2025, 3, 0);
    const sample: number[] = [];
    for (let k = 0; sample.length < 400; k++) {
      const { before, after } = nullPair(rng, 15, 10, false);
      const result = compareSeasonsSync(before, after, { index: "jaccard", permutations: 99, seed: 5000 + k });
      if (result.excluded.length === 0) sample.push(result.sites[0]!.p!);
    }
    const share = sample.filter((p) => p <= 0.05).length / sample.length;
    expect(share).toBeLessThan(0.05 + 3 * Math.sqrt((0.05 * 0.95) / sample.length));
  });

  it.each(["percentage-difference", "jaccard"] as const)("flags a planted complete-turnover site among 40 stable sites after Holm (%s)", (index) => {
    const rng = Xoshiro128.stream(7, 3, 0);
    const p = 30;
    const means = Array.from({ length: p }, () => 1 + 3 * rng.nextFloat());
    const t1: number[][] = [];
    const t2: number[][] = [];
    for (let i = 0; i < 40; i++) {
      const row = means.map((m) => poisson(rng, m));
      t1.push(row);
      // Stable: the same counts give or take one individual.
      t2.push(row.map((v) => Math.max(0, v + (rng.nextFloat() < 0.2 ? (rng.nextFloat() < 0.5 ? -1 : 1) : 0))));
    }
    // Complete turnover: species 1-15 at T1 only, species 16-30 at T2 only.
    t1.push(means.map((m, j) => (j < 15 ? 1 + poisson(rng, m) : 0)));
    t2.push(means.map((m, j) => (j >= 15 ? 1 + poisson(rng, m) : 0)));
    for (const mode of PERMUTATION_MODES) {
      const result = compareSeasonsSync(table(t1), table(t2), { index, mode, permutations: 999, seed: 3, adjust: "holm" });
      const planted = result.sites[40]!;
      expect(planted.dissimilarity).toBe(1);
      expect(planted.pAdjusted!).toBeLessThanOrEqual(0.05);
      expect(planted.exceptional).toBe(true);
      expect(result.sites.slice(0, 40).filter((s) => s.exceptional)).toEqual([]);
    }
  });
});
