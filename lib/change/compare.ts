// Orchestrates one season-pair comparison: align tables, compute per-site parts, run (or
// accept) permutation counts, adjust p-values, summarise, and test gains against losses.
// The steps are exposed separately so a job queue can run the permutation chunks elsewhere.
import { ALPHA, OFFLINE_MAX_PERMUTATIONS, PERMUTATIONS, isAlpha } from "../limits/analysis";
import { adjustPValues, isExceptional } from "./adjust";
import { fingerprintComparison } from "./fingerprint";
import { partsFromSums } from "./indices";
import { pairedTTest } from "./paired-test";
import { type ObservedSums, addChunkCounts, observedSums, permutationPValues, planChunks, runPermutationChunk } from "./permutation";
import { assertSeed } from "./random";
import { summarise } from "./summary";
import { preparePair } from "./tables";
import {
  ADJUST_METHODS,
  type ChangeResult,
  type ChunkCounts,
  type CompareOptions,
  INDICES,
  PERMUTATION_MODES,
  type PreparedPair,
  type ResolvedOptions,
  type SiteChange,
  type SpeciesTable,
} from "./types";

export const DEFAULT_OPTIONS: ResolvedOptions = {
  index: "percentage-difference",
  permutations: PERMUTATIONS.default,
  seed: 1,
  mode: "paired",
  adjust: "holm",
  alpha: ALPHA.default,
};

/**
 * The engine's upper bound on permutations: the command line's (lib/limits/analysis.ts says why
 * it is higher than the app's, which the app's own edges enforce).
 */
export const MAX_PERMUTATIONS = OFFLINE_MAX_PERMUTATIONS;

export function resolveOptions(options: CompareOptions = {}): ResolvedOptions {
  const o: ResolvedOptions = {
    index: options.index ?? DEFAULT_OPTIONS.index,
    permutations: options.permutations ?? DEFAULT_OPTIONS.permutations,
    seed: options.seed ?? DEFAULT_OPTIONS.seed,
    mode: options.mode ?? DEFAULT_OPTIONS.mode,
    adjust: options.adjust ?? DEFAULT_OPTIONS.adjust,
    alpha: options.alpha ?? DEFAULT_OPTIONS.alpha,
  };
  if (!INDICES.includes(o.index)) throw new RangeError(`unknown index "${o.index}"`);
  if (!PERMUTATION_MODES.includes(o.mode)) throw new RangeError(`unknown permutation mode "${o.mode}"`);
  if (!ADJUST_METHODS.includes(o.adjust)) throw new RangeError(`unknown adjustment "${o.adjust}"`);
  if (!Number.isSafeInteger(o.permutations) || o.permutations < 0 || o.permutations > MAX_PERMUTATIONS) {
    throw new RangeError(`permutations must be an integer from 0 to ${MAX_PERMUTATIONS}, got ${o.permutations}`);
  }
  assertSeed(o.seed);
  if (!isAlpha(o.alpha)) throw new RangeError(`alpha must be above ${ALPHA.above} and below ${ALPHA.below}, got ${o.alpha}`);
  return o;
}

/** Everything a permutation chunk and the final step need; plain data (typed arrays). */
export interface PreparedComparison {
  readonly prepared: PreparedPair;
  readonly options: ResolvedOptions;
  readonly observed: ObservedSums;
  /** Identifies data, site order and settings; chunk counts carry it back. */
  readonly fingerprint: string;
}

export function prepareComparison(before: SpeciesTable, after: SpeciesTable, options: CompareOptions = {}): PreparedComparison {
  const resolved = resolveOptions(options);
  const prepared = preparePair(before, after, resolved.index);
  return { prepared, options: resolved, observed: observedSums(prepared), fingerprint: fingerprintComparison(prepared, resolved) };
}

/** The permutation ranges of this comparison (fixed by R, never by thread count). */
export function comparisonChunks(comparison: PreparedComparison, chunkSize?: number) {
  return planChunks(comparison.options.permutations, chunkSize);
}

/** Runs one range of permutations of a prepared comparison. */
export function runComparisonChunk(comparison: PreparedComparison, range: { start: number; count: number }): ChunkCounts {
  const { prepared, options, observed, fingerprint } = comparison;
  const counts = runPermutationChunk({ prepared, mode: options.mode, seed: options.seed, observed: observed.dissimilarity, ...range });
  return { ...counts, fingerprint };
}

/**
 * Combines chunk counts (which must cover 0..R-1 exactly once) into the final result.
 * Chunks carrying another comparison's fingerprint are refused.
 */
export function finishComparison(comparison: PreparedComparison, chunks: readonly ChunkCounts[]): ChangeResult {
  const { prepared, options, observed } = comparison;
  const foreign = chunks.find((c) => c.fingerprint !== undefined && c.fingerprint !== comparison.fingerprint);
  if (foreign) throw new Error(`chunk at ${foreign.start} belongs to another comparison (fingerprint ${foreign.fingerprint}, expected ${comparison.fingerprint})`);
  const counts = addChunkCounts(prepared.sites.length, options.permutations, chunks);
  const p = permutationPValues(counts, options.permutations);
  const pAdjusted = adjustPValues(p, options.adjust);
  const sites: SiteChange[] = prepared.sites.map((site, i) => {
    const parts = partsFromSums(prepared.index, observed.shared[i]!, observed.lost[i]!, observed.gained[i]!);
    if (parts === null) throw new Error(`site "${site}" is empty in both seasons but was not excluded`);
    return { site, ...parts, p: p[i]!, pAdjusted: pAdjusted[i]!, exceptional: isExceptional(pAdjusted[i]!, options.alpha) };
  });
  const pairedTest = pairedTTest(
    sites.map((s) => s.gains),
    sites.map((s) => s.losses),
    { permutations: options.permutations, seed: options.seed },
  );
  return {
    index: options.index,
    mode: options.mode,
    permutations: options.permutations,
    seed: options.seed,
    adjust: options.adjust,
    alpha: options.alpha,
    minimumP: options.permutations > 0 ? 1 / (options.permutations + 1) : null,
    sites,
    excluded: [...prepared.excluded],
    summary: summarise(sites),
    pairedTest,
  };
}

/** The whole comparison in the calling thread. */
export function compareSeasonsSync(before: SpeciesTable, after: SpeciesTable, options: CompareOptions = {}): ChangeResult {
  const comparison = prepareComparison(before, after, options);
  const chunks = comparisonChunks(comparison).map((range) => runComparisonChunk(comparison, range));
  return finishComparison(comparison, chunks);
}
