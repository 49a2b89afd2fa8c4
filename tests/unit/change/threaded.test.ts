import { describe, expect, it } from "vitest";
import { compareSeasonsSync, comparisonChunks, prepareComparison } from "../../../lib/change/compare";
import { chooseThreads, compareSeasons, runChunksThreaded } from "../../../lib/change/threaded";
import { randomPair } from "./support";

describe("worker threads", () => {
  const { before, after } = randomPair(41, 40, 15, 0.25);

  it("thread count does not change the result", { timeout: 30_000 }, async () => {
    // 1100 permutations = 5 chunks of 250, spread unevenly over 2 or 3 threads.
    for (const [mode, threadCounts] of [["paired", [1, 2, 3]], ["independent", [2]]] as const) {
      const options = { permutations: 1100, seed: 12, mode };
      const reference = compareSeasonsSync(before, after, options);
      const results = await Promise.all(threadCounts.map((threads) => compareSeasons(before, after, { ...options, threads })));
      for (const r of results) expect(r).toEqual(reference);
    }
  });

  it("really runs chunks on worker threads, one result per chunk", { timeout: 30_000 }, async () => {
    const comparison = prepareComparison(before, after, { permutations: 600, seed: 3 });
    const ranges = comparisonChunks(comparison, 100);
    const threadIds = new Set<number>();
    const chunks = await runChunksThreaded(comparison, ranges, 2, (_, threadId) => threadIds.add(threadId));
    expect(chunks.map((c) => c.start).sort((a, b) => a - b)).toEqual(ranges.map((r) => r.start));
    // Worker threads have ids above 0 (the calling thread). Which worker takes which chunk
    // depends on timing, so only that workers did the work is asserted.
    expect(threadIds.size).toBeGreaterThan(0);
    expect([...threadIds].every((id) => id > 0)).toBe(true);
    expect(chunks.every((c) => c.exceed.length === comparison.prepared.sites.length)).toBe(true);
  });

  it("runs small jobs in the calling thread unless told otherwise", () => {
    const small = prepareComparison(before, after, { permutations: 10 });
    expect(chooseThreads(small)).toBe(1);
    expect(chooseThreads(small, 4)).toBe(4);
    expect(() => chooseThreads(small, 0)).toThrow(RangeError);
  });
});
