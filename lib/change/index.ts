// Public API of the season-to-season change engine (see README.md). Pure and free of Node
// built-ins, so the UI may import it; worker threads live in "./threaded" (Node only).
export * from "./types";
export { TableError, preparePair, restrictToSpecies, tableFromRecords, validateTable, REASON_EMPTY, REASON_ONLY_AFTER, REASON_ONLY_BEFORE } from "./tables";
export { TOLERANCE, denominator, directionOf, isPresenceAbsence, partsFromSums, rawParts, siteParts, type SiteParts } from "./indices";
export { Xoshiro128 } from "./random";
export {
  DEFAULT_CHUNK_SIZE,
  addChunkCounts,
  observedSums,
  permutationPValues,
  planChunks,
  runPermutationChunk,
  type ChunkRequest,
  type ObservedSums,
} from "./permutation";
export { adjustPValues, isExceptional } from "./adjust";
export { fingerprintComparison } from "./fingerprint";
export { pairedTTest, type PairedTestOptions } from "./paired-test";
export { summarise } from "./summary";
export { lossGainPlot, lossGainPlots, type LossGainPlot, type LossGainPlots, type PlotPoint, type Segment } from "./plot";
export { CsvError, csvField, parseCsvRows, parseSpeciesTableCsv } from "./csv";
export {
  DEFAULT_OPTIONS,
  MAX_PERMUTATIONS,
  comparisonChunks,
  compareSeasonsSync,
  finishComparison,
  prepareComparison,
  resolveOptions,
  runComparisonChunk,
  type PreparedComparison,
} from "./compare";
