// Settings of a season comparison run inside the app: its API, its forms and the analysis_runs
// table's check constraints read them from here. Zod-free and dependency-free.

/**
 * Permutations per run, 0 (no permutation test) to 99,999. With R permutations the smallest
 * p-value is 1/(R + 1), and Holm's first step needs it at or below alpha/m for m sites, so the
 * cap still lets a network of 5,000 sites flag one at alpha 0.05; above it a run costs more time
 * on a shared server than an organiser should spend by one typing slip. Our choice.
 */
export const PERMUTATIONS = { min: 0, max: 99_999, default: 9_999 } as const;

/**
 * The engine's own cap, for the command line (`npm run compare`) only: offline work on one's own
 * machine may wait hours for a very large network (10,000 sites at alpha 0.05 need 199,999
 * permutations before Holm can flag any), so it allows up to 10 million, which still stops a
 * typing slip from tying a machine up for days.
 */
export const OFFLINE_MAX_PERMUTATIONS = 10_000_000;

/**
 * The significance level a site's adjusted p-value is compared with: strictly between 0 and 1
 * (0 flags nothing ever, 1 flags every site). The default, 0.05, is common practice.
 */
export const ALPHA = { above: 0, below: 1, default: 0.05 } as const;

export const isPermutationCount = (n: number, max: number = PERMUTATIONS.max) => Number.isSafeInteger(n) && n >= PERMUTATIONS.min && n <= max;
export const isAlpha = (alpha: number) => alpha > ALPHA.above && alpha < ALPHA.below;
