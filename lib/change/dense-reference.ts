// A deliberately plain dense implementation of the per-site permutation test, used as a
// test oracle and as the baseline of the engine benchmark. It aligns the tables itself,
// builds whole permuted site-by-species tables and recomputes every cell: O(sites x species)
// per permutation.
//
// shuffle "sparse-compatible" draws exactly the numbers the fast engine draws (permutation r
// uses stream (seed, r); per species, a partial Fisher-Yates over the occupied sites in
// ascending site order, independent mode shuffling T1 then T2), so both must give identical
// counts. shuffle "full" draws a fresh complete Fisher-Yates permutation of every column: a
// different stream with the same distribution, for statistical comparison.
import { TOLERANCE, doublesShared, isPresenceAbsence } from "./indices";
import { STREAM_SITE_PERMUTATION, Xoshiro128 } from "./random";
import type { IndexName, PermutationMode, SpeciesTable } from "./types";

export interface DenseOptions {
  readonly index: IndexName;
  readonly mode: PermutationMode;
  readonly seed: number;
  readonly permutations: number;
  readonly shuffle?: "sparse-compatible" | "full";
}

export interface DenseResult {
  readonly sites: string[];
  readonly observed: Float64Array;
  readonly counts: Int32Array;
}

export function denseReference(before: SpeciesTable, after: SpeciesTable, options: DenseOptions): DenseResult {
  const { index, mode, seed, permutations } = options;
  const shuffle = options.shuffle ?? "sparse-compatible";
  const presence = isPresenceAbsence(index);
  const species = [...new Set([...before.species, ...after.species])];
  const p = species.length;
  const afterRow = new Map(after.sites.map((s, i) => [s, i]));
  const columns = new Map<SpeciesTable, Map<string, number>>([before, after].map((t) => [t, new Map(t.species.map((s, j) => [s, j]))]));
  const value = (t: SpeciesTable, row: number, name: string) => {
    const j = columns.get(t)!.get(name);
    const v = j === undefined ? 0 : t.values[row]![j]!;
    return presence ? (v > 0 ? 1 : 0) : v;
  };
  const sites: string[] = [];
  const y1: number[][] = [];
  const y2: number[][] = [];
  before.sites.forEach((site, i) => {
    const k = afterRow.get(site);
    if (k === undefined) return;
    const r1 = species.map((s) => value(before, i, s));
    const r2 = species.map((s) => value(after, k, s));
    if (r1.every((v) => v === 0) && r2.every((v) => v === 0)) return;
    sites.push(site);
    y1.push(r1);
    y2.push(r2);
  });
  const n = sites.length;
  const double = doublesShared(index);
  // Species-major (column j at j*n .. j*n+n-1), so shuffling and summing run sequentially.
  const Y1 = new Float64Array(p * n);
  const Y2 = new Float64Array(p * n);
  for (let i = 0; i < n; i++) {
    for (let j = 0; j < p; j++) {
      Y1[j * n + i] = y1[i]![j]!;
      Y2[j * n + i] = y2[i]![j]!;
    }
  }
  const A = new Float64Array(n);
  const B = new Float64Array(n);
  const C = new Float64Array(n);
  /** D of every site of (t1, t2) into out; NaN where the denominator is empty. */
  const dissimilarities = (t1: Float64Array, t2: Float64Array, out: Float64Array) => {
    A.fill(0);
    B.fill(0);
    C.fill(0);
    for (let j = 0; j < p; j++) {
      for (let i = 0; i < n; i++) {
        const x1 = t1[j * n + i]!;
        const x2 = t2[j * n + i]!;
        const m = Math.min(x1, x2);
        A[i]! += m;
        B[i]! += x1 - m;
        C[i]! += x2 - m;
      }
    }
    for (let i = 0; i < n; i++) {
      const den = (double ? 2 * A[i]! : A[i]!) + B[i]! + C[i]!;
      out[i] = den > 0 ? (B[i]! + C[i]!) / den : Number.NaN;
    }
  };
  const observed = new Float64Array(n);
  dissimilarities(Y1, Y2, observed);
  const occupied = species.map((_, j) => sites.flatMap((_, i) => (y1[i]![j]! > 0 || y2[i]![j]! > 0 ? [i] : [])));

  const counts = new Int32Array(n);
  const P1 = new Float64Array(p * n);
  const P2 = new Float64Array(p * n);
  const D = new Float64Array(n);
  const pos = new Int32Array(n);
  for (let r = 0; r < permutations; r++) {
    const rng = Xoshiro128.stream(seed, STREAM_SITE_PERMUTATION, r);
    for (let i = 0; i < n; i++) pos[i] = i;
    for (let j = 0; j < p; j++) {
      const col = j * n;
      if (shuffle === "full") {
        const perm1 = fullPermutation(rng, n);
        const perm2 = mode === "paired" ? perm1 : fullPermutation(rng, n);
        for (let i = 0; i < n; i++) {
          P1[col + perm1[i]!] = Y1[col + i]!;
          P2[col + perm2[i]!] = Y2[col + i]!;
        }
        continue;
      }
      // Sites not drawn below keep zeros: the permuted column has zeros everywhere else.
      P1.fill(0, col, col + n);
      P2.fill(0, col, col + n);
      const occ = occupied[j]!;
      if (mode === "paired") {
        for (let t = 0; t < occ.length; t++) {
          const dest = swapIn(pos, t, t + rng.below(n - t));
          P1[col + dest] = Y1[col + occ[t]!]!;
          P2[col + dest] = Y2[col + occ[t]!]!;
        }
      } else {
        for (const [target, source] of [
          [P1, Y1],
          [P2, Y2],
        ] as const) {
          for (let t = 0; t < occ.length; t++) {
            const dest = swapIn(pos, t, t + rng.below(n - t));
            target[col + dest] = source[col + occ[t]!]!;
          }
        }
      }
    }
    dissimilarities(P1, P2, D);
    for (let i = 0; i < n; i++) {
      if (!Number.isNaN(D[i]!) && D[i]! >= observed[i]! - TOLERANCE) counts[i]!++;
    }
  }
  return { sites, observed, counts };
}

/** One Fisher-Yates step: swaps positions t and u and returns the site now at t. */
function swapIn(pos: Int32Array, t: number, u: number): number {
  const site = pos[u]!;
  pos[u] = pos[t]!;
  pos[t] = site;
  return site;
}

function fullPermutation(rng: Xoshiro128, n: number): Int32Array {
  const perm = Int32Array.from({ length: n }, (_, i) => i);
  for (let t = 0; t < n - 1; t++) {
    const u = t + rng.below(n - t);
    const x = perm[t]!;
    perm[t] = perm[u]!;
    perm[u] = x;
  }
  return perm;
}
