import { describe, expect, it } from "vitest";
import { compareSeasonsSync, comparisonChunks, finishComparison, prepareComparison, resolveOptions, runComparisonChunk } from "../../../lib/change/compare";
import { siteParts } from "../../../lib/change/indices";
import { randomPair, table } from "./support";

describe("compareSeasonsSync", () => {
  const { before, after } = randomPair(31, 25, 12, 0.3);

  it("reports per-site parts that match the per-site formula", () => {
    const result = compareSeasonsSync(before, after, { index: "ruzicka", permutations: 19 });
    for (const s of result.sites) {
      const i = before.sites.indexOf(s.site);
      const expected = siteParts(before.values[i]!, after.values[i]!, "ruzicka")!;
      expect(s).toMatchObject({ shared: expected.shared, lost: expected.lost, gained: expected.gained, direction: expected.direction });
      expect(s.dissimilarity).toBeCloseTo(expected.dissimilarity, 12);
    }
  });

  it("summarises means, shares and direction over the compared sites", () => {
    const r = compareSeasonsSync(before, after, { permutations: 0 });
    const mean = (f: (s: (typeof r.sites)[number]) => number) => r.sites.reduce((a, s) => a + f(s), 0) / r.sites.length;
    expect(r.summary.meanLosses!).toBeCloseTo(mean((s) => s.losses), 12);
    expect(r.summary.meanGains!).toBeCloseTo(mean((s) => s.gains), 12);
    expect(r.summary.meanDissimilarity!).toBeCloseTo(mean((s) => s.dissimilarity), 12);
    expect(r.summary.lossShare! + r.summary.gainShare!).toBeCloseTo(1, 12);
    expect(r.summary.direction).toBe(r.summary.meanGains! > r.summary.meanLosses! ? "gain" : "loss");
  });

  // Ten one-species sites built so that each site's gains minus losses is a tenth of the
  // difference drug 2 - drug 1 in Student's (1908) sleep data (R's `sleep`). t does not change when
  // every d is scaled, so the network test must print what R's t.test(extra ~ group, data = sleep,
  // paired = TRUE) prints for those data: t = 4.0621, df = 9, p-value = 0.002833 (from memory,
  // the values lib/change/README.md lists as check values). Per site, by hand (percentage
  // difference, Legendre 2019): T1 = [A, 5], T2 = [A + g, 0] share A, lose 5 and gain g, and with
  // A = (95 - g) / 2 the denominator 2A + 5 + g is 100, so losses = 0.05 and gains = g / 100;
  // g = 10 d + 5 makes gains - losses = d / 10.
  it("tests gains against losses over the network as Student's paired t test does (sleep data)", () => {
    const sleepDifferences = [1.2, 2.4, 1.3, 1.3, 0.0, 1.0, 1.8, 0.8, 4.6, 1.4]; // drug 2 - drug 1, hours
    const gained = sleepDifferences.map((d) => 10 * d + 5);
    const before = table(gained.map((g) => [(95 - g) / 2, 5]));
    const after = table(gained.map((g) => [(95 - g) / 2 + g, 0]));
    const r = compareSeasonsSync(before, after, { index: "percentage-difference", permutations: 0 });
    for (const [i, s] of r.sites.entries()) {
      expect(s.losses).toBeCloseTo(0.05, 12);
      expect(s.gains).toBeCloseTo(gained[i]! / 100, 12);
    }
    expect(r.pairedTest.n).toBe(10);
    expect(r.pairedTest.df).toBe(9);
    expect(r.pairedTest.t!).toBeCloseTo(4.0621, 4);
    expect(r.pairedTest.p!).toBeCloseTo(0.002833, 6);
    // Mean d of the sleep data is 1.58 hours, so mean gains - losses is 0.158.
    expect(r.pairedTest.meanDifference!).toBeCloseTo(0.158, 12);
    // By hand: mean losses 0.05, mean gains (15.8 + 5) / 100 = 0.208, mean D 0.258.
    expect(r.summary).toMatchObject({ direction: "gain" });
    expect(r.summary.meanLosses!).toBeCloseTo(0.05, 12);
    expect(r.summary.meanGains!).toBeCloseTo(0.208, 12);
    expect(r.summary.gainShare!).toBeCloseTo(0.208 / 0.258, 12);
  });

  it("with 0 permutations gives null p-values, no exceptional sites and no minimum p", () => {
    const r = compareSeasonsSync(before, after, { permutations: 0 });
    expect(r.minimumP).toBeNull();
    expect(r.pairedTest.pPermutation).toBeNull();
    expect(r.pairedTest.p).not.toBeNull();
    for (const s of r.sites) expect(s).toMatchObject({ p: null, pAdjusted: null, exceptional: false });
  });

  it("reports the minimum possible p, 1/(R+1), and p-values on that grid", () => {
    const r = compareSeasonsSync(before, after, { permutations: 49 });
    expect(r.minimumP).toBe(1 / 50);
    for (const s of r.sites) {
      expect(s.p! * 50).toBeCloseTo(Math.round(s.p! * 50), 9);
      expect(s.p!).toBeGreaterThanOrEqual(r.minimumP!);
    }
  });

  it("is reproducible for one seed and changes with the seed", () => {
    const a = compareSeasonsSync(before, after, { permutations: 99, seed: 4 });
    expect(compareSeasonsSync(before, after, { permutations: 99, seed: 4 })).toEqual(a);
    expect(compareSeasonsSync(before, after, { permutations: 99, seed: 5 }).sites.map((s) => s.p)).not.toEqual(a.sites.map((s) => s.p));
  });

  it("handles a single compared site and no compared site without crashing", () => {
    const one = compareSeasonsSync(table([[1, 2]]), table([[0, 2]]), { permutations: 9 });
    expect(one.sites).toHaveLength(1);
    expect(one.pairedTest).toMatchObject({ n: 1, t: null, df: null, p: null, pPermutation: null });
    const none = compareSeasonsSync(table([[0, 0]]), table([[0, 0]]), { permutations: 9 });
    expect(none.sites).toEqual([]);
    expect(none.excluded).toEqual([{ site: "S1", reason: "no species recorded in either season" }]);
    expect(none.summary).toEqual({ meanLosses: null, meanGains: null, meanDissimilarity: null, lossShare: null, gainShare: null, direction: null });
    expect(none.pairedTest.n).toBe(0);
  });

  it("job-queue path (prepare, run chunks anywhere, finish) equals the one-call result", () => {
    const options = { permutations: 130, seed: 9, mode: "independent" as const };
    const comparison = prepareComparison(before, after, options);
    // Chunks may be planned with any size and finish in any order.
    const chunks = comparisonChunks(comparison, 17).map((range) => runComparisonChunk(comparison, range)).reverse();
    const viaJson = JSON.parse(JSON.stringify(chunks));
    expect(finishComparison(comparison, viaJson)).toEqual(compareSeasonsSync(before, after, options));
  });

  it("refuses chunk counts from another comparison", () => {
    const options = { permutations: 40, seed: 9 };
    const comparison = prepareComparison(before, after, options);
    const other = prepareComparison(before, after, { ...options, seed: 10 });
    const reordered = prepareComparison({ ...before, sites: [...before.sites].reverse(), values: [...before.values].reverse() }, after, options);
    expect(other.fingerprint).not.toBe(comparison.fingerprint);
    expect(reordered.fingerprint).not.toBe(comparison.fingerprint);
    expect(prepareComparison(before, after, options).fingerprint).toBe(comparison.fingerprint);
    const mixed = [runComparisonChunk(comparison, { start: 0, count: 20 }), runComparisonChunk(other, { start: 20, count: 20 })];
    expect(() => finishComparison(comparison, mixed)).toThrow(/another comparison/);
  });

  it("applies defaults and rejects bad options", () => {
    expect(resolveOptions()).toEqual({ index: "percentage-difference", permutations: 9999, seed: 1, mode: "paired", adjust: "holm", alpha: 0.05 });
    expect(() => resolveOptions({ permutations: -1 })).toThrow(RangeError);
    expect(() => resolveOptions({ permutations: 2.5 })).toThrow(RangeError);
    expect(() => resolveOptions({ alpha: 0 })).toThrow(RangeError);
    expect(() => resolveOptions({ alpha: 1 })).toThrow(RangeError); // alpha lies in (0, 1)
    expect(resolveOptions({ permutations: 10_000_000 }).permutations).toBe(10_000_000); // the command line's offline cap
    expect(() => resolveOptions({ permutations: 10_000_001 })).toThrow(RangeError);
    expect(() => resolveOptions({ index: "bray" as never })).toThrow(/unknown index/);
  });
});
