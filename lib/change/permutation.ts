// Permutation test of each site's D (Legendre 2019, section 2.3): species' values are
// reassigned at random among sites and every site's D recomputed. Only non-zero cells are
// touched: for species j with k_j occupied sites, a partial Fisher-Yates shuffle puts those
// k_j cells on k_j distinct random sites, O(sum k_j) per permutation. A partial shuffle from
// any arrangement is uniform, so the position array is never reset between species.
import { TOLERANCE, doublesShared } from "./indices";
import { STREAM_SITE_PERMUTATION, assertSeed, streamState } from "./random";
import { type ChunkCounts, PERMUTATION_MODES, type PermutationMode, type PreparedPair } from "./types";

const TWO_TO_MINUS_32 = 2 ** -32;
/** The inlined bounded draw is exact while sites x 2^32 stays below 2^53. */
export const MAX_SITES = 2 ** 21;

/** Permutations per chunk when none is given; results do not depend on it. */
export const DEFAULT_CHUNK_SIZE = 250;

export interface ObservedSums {
  readonly shared: Float64Array;
  readonly lost: Float64Array;
  readonly gained: Float64Array;
  readonly dissimilarity: Float64Array;
}

/** A, B, C and D of every compared site, summed species by species like the permutations. */
export function observedSums(prepared: PreparedPair): ObservedSums {
  const n = prepared.sites.length;
  const A = new Float64Array(n);
  const B = new Float64Array(n);
  const C = new Float64Array(n);
  const { cellSite, before, after } = prepared;
  for (let c = 0; c < cellSite.length; c++) {
    const s = cellSite[c]!;
    const x1 = before[c]!;
    const x2 = after[c]!;
    const m = x1 < x2 ? x1 : x2;
    A[s]! += m;
    B[s]! += x1 - m;
    C[s]! += x2 - m;
  }
  const double = doublesShared(prepared.index);
  const D = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    const den = (double ? 2 * A[i]! : A[i]!) + B[i]! + C[i]!;
    D[i] = den > 0 ? (B[i]! + C[i]!) / den : Number.NaN;
  }
  return { shared: A, lost: B, gained: C, dissimilarity: D };
}

export interface ChunkRequest {
  readonly prepared: PreparedPair;
  readonly mode: PermutationMode;
  readonly seed: number;
  /** First permutation number (0-based) and how many to run. */
  readonly start: number;
  readonly count: number;
  /** Observed D per site; computed from `prepared` when omitted. */
  readonly observed?: Float64Array;
}

/**
 * Runs permutations start .. start+count-1 and counts, per site, those whose D is at least
 * the observed D (within 1e-10). Permutation r always draws from its own stream, so counts
 * of any set of disjoint ranges add up to the counts of one run over their union.
 */
export function runPermutationChunk(request: ChunkRequest): ChunkCounts {
  const { prepared, mode, seed, start, count } = request;
  assertSeed(seed);
  if (!PERMUTATION_MODES.includes(mode)) throw new RangeError(`unknown permutation mode "${mode}"`);
  if (!Number.isSafeInteger(start) || start < 0 || !Number.isSafeInteger(count) || count < 0) {
    throw new RangeError(`bad permutation range start=${start} count=${count}`);
  }
  if (prepared.sites.length > MAX_SITES) throw new RangeError(`at most ${MAX_SITES} sites can be compared, got ${prepared.sites.length}`);
  const observed = request.observed ?? observedSums(prepared).dissimilarity;
  if (observed.length !== prepared.sites.length) throw new RangeError("observed D does not match the sites");
  const exceed = countExceedances(prepared, observed, mode, seed, start, count);
  return { start, count, exceed: Array.from(exceed) };
}

function countExceedances(
  prepared: PreparedPair,
  observed: Float64Array,
  mode: PermutationMode,
  seed: number,
  start: number,
  count: number,
): Int32Array {
  const exceed = new Int32Array(prepared.sites.length);
  const threshold = Float64Array.from(observed, (d) => d - TOLERANCE);
  // One specialised loop per mode: V8 optimises the smaller loops noticeably better.
  if (mode === "paired") pairedKernel(prepared, threshold, seed, start, count, exceed);
  else independentKernel(prepared, threshold, seed, start, count, exceed);
  return exceed;
}

/**
 * Counts, per site, permuted D >= threshold. A, B, C of site s sit side by side at 3s,
 * 3s+1, 3s+2, so one placement touches one spot; the same expression as observedSums gives
 * D, so an unchanged table reproduces D bit for bit. An empty permuted site has no D and
 * never counts (README.md, "The permutation test").
 */
function countSites(abc: Float64Array, threshold: Float64Array, double: boolean, exceed: Int32Array): void {
  for (let i = 0; i < exceed.length; i++) {
    const A = abc[3 * i]!;
    const B = abc[3 * i + 1]!;
    const C = abc[3 * i + 2]!;
    const den = (double ? 2 * A : A) + B + C;
    if (den > 0 && (B + C) / den >= threshold[i]!) exceed[i]!++;
  }
}

// Both kernels inline xoshiro128** and Lemire's bounded draw exactly as Xoshiro128.below in
// random.ts (a method call per draw costs about three times more); the dense reference uses
// the class, and the tests require identical counts, so the copies cannot drift apart.

/** Paired mode: one shuffle per species moves each cell's (T1, T2) pair together. */
function pairedKernel(prepared: PreparedPair, threshold: Float64Array, seed: number, start: number, count: number, exceed: Int32Array): void {
  const n = prepared.sites.length;
  const p = prepared.species.length;
  const { colStart, before, after } = prepared;
  const double = doublesShared(prepared.index);
  const pos = new Int32Array(n);
  const abc = new Float64Array(3 * n);
  // A cell's parts never change when the pair moves together: precompute them.
  const cellParts = new Float64Array(3 * before.length);
  for (let c = 0; c < before.length; c++) {
    const m = before[c]! < after[c]! ? before[c]! : after[c]!;
    cellParts[3 * c] = m;
    cellParts[3 * c + 1] = before[c]! - m;
    cellParts[3 * c + 2] = after[c]! - m;
  }
  for (let r = start; r < start + count; r++) {
    const state = streamState(seed, STREAM_SITE_PERMUTATION, r);
    let s0 = state[0]!;
    let s1 = state[1]!;
    let s2 = state[2]!;
    let s3 = state[3]!;
    for (let i = 0; i < n; i++) pos[i] = i;
    abc.fill(0);
    for (let j = 0; j < p; j++) {
      const lo = colStart[j]!;
      const k = colStart[j + 1]! - lo;
      for (let t = 0; t < k; t++) {
        const m = n - t;
        let high: number;
        for (;;) {
          const r5 = Math.imul(s1, 5);
          const out = Math.imul((r5 << 7) | (r5 >>> 25), 9) >>> 0;
          const t9 = s1 << 9;
          s2 ^= s0;
          s3 ^= s1;
          s1 ^= s2;
          s0 ^= s3;
          s2 ^= t9;
          s3 = (s3 << 11) | (s3 >>> 21);
          const prod = out * m;
          high = (prod * TWO_TO_MINUS_32) | 0;
          const low = prod - high * 4294967296;
          if (low >= m || low >= (4294967296 - m) % m) break;
        }
        const u = t + high;
        const s = pos[u]!;
        pos[u] = pos[t]!;
        pos[t] = s;
        const q = 3 * s;
        const c = 3 * (lo + t);
        abc[q]! += cellParts[c]!;
        abc[q + 1]! += cellParts[c + 1]!;
        abc[q + 2]! += cellParts[c + 2]!;
      }
    }
    countSites(abc, threshold, double, exceed);
  }
}

/** Independent mode: per species, T1's column is shuffled, then T2's with fresh draws. */
function independentKernel(prepared: PreparedPair, threshold: Float64Array, seed: number, start: number, count: number, exceed: Int32Array): void {
  const n = prepared.sites.length;
  const p = prepared.species.length;
  const { colStart, before, after } = prepared;
  const double = doublesShared(prepared.index);
  const pos = new Int32Array(n);
  const abc = new Float64Array(3 * n);
  const placedT1 = new Int32Array(n);
  // What is left of each site's T1 value once T2's values are placed: lost.
  const remaining = new Float64Array(n);
  for (let r = start; r < start + count; r++) {
    const state = streamState(seed, STREAM_SITE_PERMUTATION, r);
    let s0 = state[0]!;
    let s1 = state[1]!;
    let s2 = state[2]!;
    let s3 = state[3]!;
    for (let i = 0; i < n; i++) pos[i] = i;
    abc.fill(0);
    for (let j = 0; j < p; j++) {
      const lo = colStart[j]!;
      const k = colStart[j + 1]! - lo;
      for (let pass = 0; pass < 2; pass++) {
        for (let t = 0; t < k; t++) {
          const m = n - t;
          let high: number;
          for (;;) {
            const r5 = Math.imul(s1, 5);
            const out = Math.imul((r5 << 7) | (r5 >>> 25), 9) >>> 0;
            const t9 = s1 << 9;
            s2 ^= s0;
            s3 ^= s1;
            s1 ^= s2;
            s0 ^= s3;
            s2 ^= t9;
            s3 = (s3 << 11) | (s3 >>> 21);
            const prod = out * m;
            high = (prod * TWO_TO_MINUS_32) | 0;
            const low = prod - high * 4294967296;
            if (low >= m || low >= (4294967296 - m) % m) break;
          }
          const u = t + high;
          const s = pos[u]!;
          pos[u] = pos[t]!;
          pos[t] = s;
          if (pass === 0) {
            placedT1[t] = s;
            remaining[s] = before[lo + t]!;
          } else {
            const x2 = after[lo + t]!;
            const x1 = remaining[s]!;
            const mn = x1 < x2 ? x1 : x2;
            abc[3 * s]! += mn;
            abc[3 * s + 2]! += x2 - mn;
            remaining[s] = x1 - mn;
          }
        }
      }
      for (let t = 0; t < k; t++) {
        const s = placedT1[t]!;
        abc[3 * s + 1]! += remaining[s]!;
        remaining[s] = 0;
      }
    }
    countSites(abc, threshold, double, exceed);
  }
}

/** Fixed ranges covering permutations 0 .. total-1, for threads or a job queue. */
export function planChunks(total: number, chunkSize = DEFAULT_CHUNK_SIZE): Array<{ start: number; count: number }> {
  if (!Number.isSafeInteger(total) || total < 0) throw new RangeError(`bad permutation count ${total}`);
  if (!Number.isSafeInteger(chunkSize) || chunkSize < 1) throw new RangeError(`bad chunk size ${chunkSize}`);
  const chunks: Array<{ start: number; count: number }> = [];
  for (let start = 0; start < total; start += chunkSize) chunks.push({ start, count: Math.min(chunkSize, total - start) });
  return chunks;
}

/**
 * Sums chunk counts; throws unless the chunks cover 0 .. total-1 exactly once, so a lost
 * or duplicated job cannot silently change the p-values.
 */
export function addChunkCounts(nSites: number, total: number, chunks: readonly ChunkCounts[]): Int32Array {
  const sorted = [...chunks].sort((a, b) => a.start - b.start);
  let next = 0;
  const sum = new Int32Array(nSites);
  for (const chunk of sorted) {
    if (chunk.count === 0) continue;
    if (chunk.start !== next) throw new Error(`permutation chunks do not tile 0..${total - 1}: gap or overlap at ${next}`);
    if (chunk.exceed.length !== nSites) throw new Error(`chunk at ${chunk.start} has ${chunk.exceed.length} counts for ${nSites} sites`);
    chunk.exceed.forEach((v, i) => (sum[i] = sum[i]! + v));
    next = chunk.start + chunk.count;
  }
  if (next !== total) throw new Error(`permutation chunks cover 0..${next - 1}, expected 0..${total - 1}`);
  return sum;
}

/** p_i = (1 + count_i) / (1 + R) (README.md; Legendre 2019); null when R = 0. */
export function permutationPValues(counts: ArrayLike<number>, permutations: number): Array<number | null> {
  return Array.from(counts, (c) => (permutations > 0 ? (1 + c) / (1 + permutations) : null));
}
