// Shared generators for the change-engine tests.
import fc from "fast-check";
import { Xoshiro128 } from "../../../lib/change/random";
import type { SpeciesTable } from "../../../lib/change/types";

export const siteNames = (n: number) => Array.from({ length: n }, (_, i) => `S${i + 1}`);
export const speciesNames = (p: number) => Array.from({ length: p }, (_, j) => `sp${j + 1}`);

export function table(values: number[][], sites = siteNames(values.length), species = speciesNames(values[0]?.length ?? 0)): SpeciesTable {
  return { sites, species, values };
}

/** Non-negative vectors of one length: integer counts, with zeros common. */
export const countVector = (length: number) => fc.array(fc.oneof(fc.constant(0), fc.integer({ min: 1, max: 9 })), { minLength: length, maxLength: length });

/** A pair of site-by-species tables of the same shape, with non-negative counts or decimals. */
export const tablePair = (opts: { maxSites?: number; maxSpecies?: number; decimals?: boolean } = {}) =>
  fc
    .record({ n: fc.integer({ min: 1, max: opts.maxSites ?? 8 }), p: fc.integer({ min: 1, max: opts.maxSpecies ?? 6 }) })
    .chain(({ n, p }) => {
      const cell = opts.decimals
        ? fc.oneof(fc.constant(0), fc.double({ min: 0.01, max: 50, noNaN: true, noDefaultInfinity: true }))
        : fc.oneof(fc.constant(0), fc.constant(0), fc.integer({ min: 1, max: 6 }));
      const grid = fc.array(fc.array(cell, { minLength: p, maxLength: p }), { minLength: n, maxLength: n });
      return fc.record({ before: grid, after: grid }).map(({ before, after }) => ({ before: table(before), after: table(after) }));
    });

/** Seeded random table pair, for larger cases than fast-check should shrink. */
export function randomPair(seed: number, n: number, p: number, density: number): { before: SpeciesTable; after: SpeciesTable } {
  const rng = Xoshiro128.stream(seed, 99, 0);
  const grid = () => Array.from({ length: n }, () => Array.from({ length: p }, () => (rng.nextFloat() < density ? 1 + rng.below(6) : 0)));
  return { before: table(grid()), after: table(grid()) };
}
