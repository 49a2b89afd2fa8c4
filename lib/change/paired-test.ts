// Did the network gain or lose overall? Paired t-test of per-site gains against losses
// (Student 1908): d_i = gains_i - losses_i, t = mean(d) / (sd(d) / sqrt(n)), df = n - 1,
// two-sided p from Student's t (jstat). Plus a sign-flip permutation p-value
// (Legendre 2019 uses both): p = (1 + #{|t*| >= |t|}) / (1 + R).
import jStat from "jstat";
import { STREAM_SIGN_FLIP, Xoshiro128, assertSeed } from "./random";
import type { PairedTestResult } from "./types";

/** d values spanning no more than this are treated as constant: sd(d) = 0, t undefined. */
const CONSTANT_SPAN = 1e-12;

export interface PairedTestOptions {
  /** Sign-flip permutations; 0 gives pPermutation = null. */
  readonly permutations: number;
  readonly seed: number;
}

/**
 * Paired t-test of `second` minus `first`. With fewer than 2 pairs, or when every
 * difference is the same (sd = 0), t, p and pPermutation are null rather than infinite or
 * NaN; df is null below 2 pairs.
 */
export function pairedTTest(
  second: ArrayLike<number>,
  first: ArrayLike<number>,
  options: PairedTestOptions,
): PairedTestResult {
  if (second.length !== first.length) throw new Error("paired samples differ in length");
  assertSeed(options.seed);
  const n = second.length;
  const d = Float64Array.from({ length: n }, (_, i) => second[i]! - first[i]!);
  if (n === 0) return { n, meanDifference: null, t: null, df: null, p: null, pPermutation: null };
  const mean = d.reduce((s, x) => s + x, 0) / n;
  if (n < 2) return { n, meanDifference: mean, t: null, df: null, p: null, pPermutation: null };
  const df = n - 1;
  let min = Infinity;
  let max = -Infinity;
  let ss = 0;
  for (const x of d) {
    min = Math.min(min, x);
    max = Math.max(max, x);
    ss += (x - mean) * (x - mean);
  }
  if (max - min <= CONSTANT_SPAN) return { n, meanDifference: mean, t: null, df, p: null, pPermutation: null };
  const sd = Math.sqrt(ss / df);
  const t = mean / (sd / Math.sqrt(n));
  // cdf(-|t|) rather than 1 - cdf(|t|) keeps small p-values accurate.
  const p = Math.min(1, 2 * jStat.studentt.cdf(-Math.abs(t), df));
  const pPermutation = options.permutations > 0 ? signFlipP(d, options.permutations, options.seed) : null;
  return { n, meanDifference: mean, t, df, p, pPermutation };
}

/**
 * Sign-flip permutation p-value. Flipping signs leaves sum(d^2) unchanged, so each t* needs
 * only the signed sum. The observed t goes through the same formula so that the identity
 * flip reproduces it exactly.
 */
function signFlipP(d: Float64Array, permutations: number, seed: number): number {
  const n = d.length;
  let sumSq = 0;
  let sum = 0;
  for (const x of d) {
    sumSq += x * x;
    sum += x;
  }
  const tFrom = (signedSum: number) => {
    const m = signedSum / n;
    const variance = Math.max(0, (sumSq - n * m * m) / (n - 1));
    if (variance === 0) return m === 0 ? 0 : Infinity;
    return Math.abs(m / Math.sqrt(variance / n));
  };
  const tObs = tFrom(sum);
  const limit = tObs - 1e-10 * Math.max(1, tObs);
  const rng = Xoshiro128.stream(seed, STREAM_SIGN_FLIP, 0);
  let hits = 0;
  for (let r = 0; r < permutations; r++) {
    let s = 0;
    for (let i = 0; i < n; i++) s += rng.nextU32() >>> 31 ? d[i]! : -d[i]!;
    if (tFrom(s) >= limit) hits++;
  }
  return (1 + hits) / (1 + permutations);
}
