// Runs the permutation chunks of a comparison on worker threads. Chunks are fixed
// permutation ranges handed to whichever thread is free, and every permutation has its own
// random stream, so the result is the same for any number of threads.
import { availableParallelism } from "node:os";
import { Worker } from "node:worker_threads";
import { type PreparedComparison, comparisonChunks, finishComparison, prepareComparison, runComparisonChunk } from "./compare";
import type { ChangeResult, ChunkCounts, CompareOptions, PermutationMode, PreparedPair, SpeciesTable } from "./types";

export interface WorkerData {
  readonly prepared: PreparedPair;
  readonly mode: PermutationMode;
  readonly seed: number;
  readonly observed: Float64Array;
}
export type WorkerTask = { type: "run"; start: number; count: number } | { type: "stop" };
export type WorkerReply = { type: "ready" } | { type: "counts"; counts: ChunkCounts; threadId: number } | { type: "error"; message: string };

/** Called as each chunk finishes (progress); threadId 0 is the calling thread. */
export type ChunkListener = (counts: ChunkCounts, threadId: number) => void;

export interface ThreadOptions {
  /** Worker threads; 1 runs in the calling thread. Default: all cores, except for small jobs. */
  readonly threads?: number;
}

/** Below this many cell placements, starting threads costs more than it saves. */
const SMALL_JOB = 20_000_000;

export function defaultThreads(): number {
  return availableParallelism();
}

/** Threads to use for a comparison: explicit count, else all cores unless the job is small. */
export function chooseThreads(comparison: PreparedComparison, threads?: number): number {
  if (threads !== undefined) {
    if (!Number.isSafeInteger(threads) || threads < 1) throw new RangeError(`threads must be a positive integer, got ${threads}`);
    return threads;
  }
  const work = comparison.options.permutations * Math.max(1, comparison.prepared.cellSite.length);
  return work < SMALL_JOB ? 1 : defaultThreads();
}

/** Runs the given ranges on `threads` worker threads (in this thread when threads is 1). */
export async function runChunksThreaded(
  comparison: PreparedComparison,
  ranges: ReadonlyArray<{ start: number; count: number }>,
  threads: number,
  onChunk?: ChunkListener,
): Promise<ChunkCounts[]> {
  const used = Math.min(threads, ranges.length);
  if (used <= 1) {
    return ranges.map((range) => {
      const counts = runComparisonChunk(comparison, range);
      onChunk?.(counts, 0);
      return counts;
    });
  }
  const data: WorkerData = {
    prepared: comparison.prepared,
    mode: comparison.options.mode,
    seed: comparison.options.seed,
    observed: comparison.observed.dissimilarity,
  };
  const results: ChunkCounts[] = [];
  let next = 0;
  const workers: Worker[] = [];
  try {
    await new Promise<void>((resolve, reject) => {
      let finished = 0;
      const fail = (error: Error) => reject(error);
      for (let w = 0; w < used; w++) {
        const worker = new Worker(new URL("./worker-entry.mjs", import.meta.url), { workerData: data, execArgv: [] });
        workers.push(worker);
        const feed = () => {
          const range = ranges[next++];
          if (range === undefined) {
            worker.postMessage({ type: "stop" } satisfies WorkerTask);
            if (++finished === used) resolve();
          } else {
            worker.postMessage({ type: "run", ...range } satisfies WorkerTask);
          }
        };
        worker.on("message", (reply: WorkerReply) => {
          if (reply.type === "error") return fail(new Error(`permutation worker failed: ${reply.message}`));
          if (reply.type === "counts") {
            const counts = { ...reply.counts, fingerprint: comparison.fingerprint };
            results.push(counts);
            onChunk?.(counts, reply.threadId);
          }
          feed();
        });
        worker.on("error", fail);
        worker.on("exit", (code) => {
          if (code !== 0) fail(new Error(`permutation worker exited with code ${code}`));
        });
      }
    });
  } finally {
    await Promise.all(workers.map((w) => w.terminate()));
  }
  return results;
}

/** The whole comparison, permutations spread over worker threads. */
export async function compareSeasons(
  before: SpeciesTable,
  after: SpeciesTable,
  options: CompareOptions & ThreadOptions & { onChunk?: ChunkListener } = {},
): Promise<ChangeResult> {
  const comparison = prepareComparison(before, after, options);
  const threads = chooseThreads(comparison, options.threads);
  const chunks = await runChunksThreaded(comparison, comparisonChunks(comparison), threads, options.onChunk);
  return finishComparison(comparison, chunks);
}
