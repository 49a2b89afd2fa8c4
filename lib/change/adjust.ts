// Multiple-testing adjustment of the per-site p-values.
import type { AdjustMethod } from "./types";

/**
 * Adjusted p-values in input order; nulls pass through and do not count as tests.
 * - holm: Holm (1979), step-down: p_(i) * (m - i + 1), made non-decreasing, capped at 1.
 * - bh: Benjamini & Hochberg (1995), step-up: p_(i) * m / i, made non-increasing from the top.
 * - bonferroni: p * m, capped at 1.
 */
export function adjustPValues(pValues: ReadonlyArray<number | null>, method: AdjustMethod): Array<number | null> {
  const tested: Array<{ i: number; p: number }> = [];
  pValues.forEach((p, i) => {
    if (p !== null) {
      if (!(p >= 0 && p <= 1)) throw new RangeError(`p-value ${p} is outside [0, 1]`);
      tested.push({ i, p });
    }
  });
  const out: Array<number | null> = pValues.map(() => null);
  const m = tested.length;
  if (method === "none" || method === "bonferroni") {
    for (const { i, p } of tested) out[i] = method === "none" ? p : Math.min(1, p * m);
    return out;
  }
  // Stable order keeps ties deterministic.
  tested.sort((a, b) => a.p - b.p || a.i - b.i);
  if (method === "holm") {
    let running = 0;
    tested.forEach(({ i, p }, rank) => {
      running = Math.max(running, Math.min(1, p * (m - rank)));
      out[i] = running;
    });
  } else {
    let running = 1;
    for (let rank = m - 1; rank >= 0; rank--) {
      const { i, p } = tested[rank]!;
      running = Math.min(running, (p * m) / (rank + 1));
      out[i] = running;
    }
  }
  return out;
}

/** A site is exceptional where its adjusted p-value is at most alpha (README.md, "Many sites at once"). */
export function isExceptional(pAdjusted: number | null, alpha: number): boolean {
  return pAdjusted !== null && pAdjusted <= alpha;
}
