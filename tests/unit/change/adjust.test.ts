import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { adjustPValues, isExceptional } from "../../../lib/change/adjust";
import { ADJUST_METHODS } from "../../../lib/change/types";

const close = (actual: Array<number | null>, expected: number[]) => {
  expect(actual).toHaveLength(expected.length);
  actual.forEach((v, i) => expect(v).toBeCloseTo(expected[i]!, 12));
};

describe("check values (lib/change/README.md, worked by hand)", () => {
  const p = [0.01, 0.02, 0.03, 0.04, 0.05];

  // Holm (1979): sorted p times (m - i + 1) = 0.05, 0.08, 0.09, 0.08, 0.05, then the
  // running maximum: 0.05, 0.08, 0.09, 0.09, 0.09.
  it("Holm", () => close(adjustPValues(p, "holm"), [0.05, 0.08, 0.09, 0.09, 0.09]));

  // Benjamini & Hochberg (1995): p_(i) m / i = 0.05 for all five.
  it("Benjamini-Hochberg", () => close(adjustPValues(p, "bh"), [0.05, 0.05, 0.05, 0.05, 0.05]));

  it("Bonferroni and none", () => {
    close(adjustPValues(p, "bonferroni"), [0.05, 0.1, 0.15, 0.2, 0.25]);
    close(adjustPValues(p, "none"), p);
  });

  it("keeps input order and caps at 1", () => {
    close(adjustPValues([0.04, 0.5, 0.01], "holm"), [0.08, 0.5, 0.03]);
    close(adjustPValues([0.9, 0.6], "bonferroni"), [1, 1]);
    close(adjustPValues([0.04, 0.5, 0.01], "bh"), [0.06, 0.5, 0.03]);
  });
});

describe("properties", () => {
  const pValues = fc.array(fc.double({ min: 0, max: 1, noNaN: true }), { minLength: 1, maxLength: 30 });

  it("adjusted p >= raw p, <= 1, and ordered like the raw p-values", () => {
    fc.assert(
      fc.property(pValues, fc.constantFrom(...ADJUST_METHODS), (p, method) => {
        const adj = adjustPValues(p, method) as number[];
        p.forEach((v, i) => {
          expect(adj[i]!).toBeGreaterThanOrEqual(v - 1e-15);
          expect(adj[i]!).toBeLessThanOrEqual(1);
        });
        for (let i = 0; i < p.length; i++) for (let k = 0; k < p.length; k++) if (p[i]! < p[k]!) expect(adj[i]!).toBeLessThanOrEqual(adj[k]!);
      }),
    );
  });

  it("Holm is never above Bonferroni and BH never above Holm", () => {
    fc.assert(
      fc.property(pValues, (p) => {
        const bonf = adjustPValues(p, "bonferroni") as number[];
        const holm = adjustPValues(p, "holm") as number[];
        const bh = adjustPValues(p, "bh") as number[];
        p.forEach((_, i) => {
          expect(holm[i]!).toBeLessThanOrEqual(bonf[i]! + 1e-15);
          expect(bh[i]!).toBeLessThanOrEqual(holm[i]! + 1e-15);
        });
      }),
    );
  });

  it("passes nulls through without counting them as tests", () => {
    close(adjustPValues([0.01, null, 0.02], "bonferroni").filter((v) => v !== null), [0.02, 0.04]);
    expect(adjustPValues([null, null], "holm")).toEqual([null, null]);
  });

  it("flags exceptional at adjusted p <= alpha only", () => {
    expect(isExceptional(0.05, 0.05)).toBe(true);
    expect(isExceptional(0.0500001, 0.05)).toBe(false);
    expect(isExceptional(null, 0.05)).toBe(false);
  });

  it("rejects p-values outside [0, 1]", () => {
    expect(() => adjustPValues([1.2], "holm")).toThrow(RangeError);
  });
});
