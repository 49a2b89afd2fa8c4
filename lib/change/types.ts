// Shared types of the season-to-season change engine. Plain data only, so results can be
// stored as JSON and chunk inputs can cross thread and process boundaries.
import type { SiteParts } from "./indices";

/** The four temporal beta-diversity indices of Legendre (2019). */
export const INDICES = ["jaccard", "sorensen", "ruzicka", "percentage-difference"] as const;
export type IndexName = (typeof INDICES)[number];

export const PERMUTATION_MODES = ["paired", "independent"] as const;
export type PermutationMode = (typeof PERMUTATION_MODES)[number];

export const ADJUST_METHODS = ["holm", "bh", "bonferroni", "none"] as const;
export type AdjustMethod = (typeof ADJUST_METHODS)[number];

export type Direction = "gain" | "loss" | "none";

/**
 * A site-by-species table for one season. `values[i][j]` is the value of species
 * `species[j]` at site `sites[i]`: presence-absence (0/1) or a non-negative abundance.
 */
export interface SpeciesTable {
  readonly sites: readonly string[];
  readonly species: readonly string[];
  readonly values: ReadonlyArray<ArrayLike<number>>;
}

/** One non-zero record, for building a table from database rows. */
export interface SpeciesRecord {
  readonly site: string;
  readonly species: string;
  readonly value: number;
}

export interface ExcludedSite {
  readonly site: string;
  readonly reason: string;
}

/**
 * The two seasons aligned on the compared sites and the union of species, stored per
 * species (CSR-like): the cells of species j are `colStart[j] .. colStart[j+1]-1`, each with
 * its site (`cellSite`, ascending within a species) and its two values. A cell is kept when
 * the species occurs at that site in either season; everything else is zero.
 * Values are already turned into 0/1 for the presence-absence indices.
 */
export interface PreparedPair {
  readonly index: IndexName;
  readonly sites: readonly string[];
  readonly species: readonly string[];
  readonly excluded: readonly ExcludedSite[];
  readonly colStart: Int32Array;
  readonly cellSite: Int32Array;
  readonly before: Float64Array;
  readonly after: Float64Array;
}

/** Per-site change, in the shape the JSON output uses: the parts (a/A shared, b/B lost, c/C gained, ...) plus the test. */
export interface SiteChange extends SiteParts {
  readonly site: string;
  readonly p: number | null;
  readonly pAdjusted: number | null;
  readonly exceptional: boolean;
}

export interface ChangeSummary {
  readonly meanLosses: number | null;
  readonly meanGains: number | null;
  readonly meanDissimilarity: number | null;
  readonly lossShare: number | null;
  readonly gainShare: number | null;
  readonly direction: Direction | null;
}

export interface PairedTestResult {
  readonly n: number;
  readonly meanDifference: number | null;
  readonly t: number | null;
  readonly df: number | null;
  readonly p: number | null;
  readonly pPermutation: number | null;
}

export interface ChangeResult {
  readonly index: IndexName;
  readonly mode: PermutationMode;
  readonly permutations: number;
  readonly seed: number;
  readonly adjust: AdjustMethod;
  readonly alpha: number;
  /** 1/(R+1), the smallest p-value R permutations can give; null when R = 0. */
  readonly minimumP: number | null;
  readonly sites: SiteChange[];
  readonly excluded: ExcludedSite[];
  readonly summary: ChangeSummary;
  readonly pairedTest: PairedTestResult;
}

export interface CompareOptions {
  readonly index?: IndexName;
  readonly permutations?: number;
  readonly seed?: number;
  readonly mode?: PermutationMode;
  readonly adjust?: AdjustMethod;
  readonly alpha?: number;
}

export interface ResolvedOptions {
  readonly index: IndexName;
  readonly permutations: number;
  readonly seed: number;
  readonly mode: PermutationMode;
  readonly adjust: AdjustMethod;
  readonly alpha: number;
}

/**
 * Counts from a range of permutations: `exceed[i]` is how many permutations gave site i a
 * D at least as large as observed. Counts of disjoint ranges simply add up.
 */
export interface ChunkCounts {
  readonly start: number;
  readonly count: number;
  readonly exceed: number[];
  /** Which prepared comparison the counts belong to (set by runComparisonChunk). */
  readonly fingerprint?: string;
}
