import { describe, expect, it } from "vitest";
import { compareSeasonsSync, prepareComparison } from "../../../lib/change/compare";
import { chooseThreads, compareSeasons } from "../../../lib/change/threaded";
import { randomPair } from "./support";

describe("worker threads", () => {
  const { before, after } = randomPair(41, 40, 15, 0.25);

  // 1100 permutations = four chunks of 250 and one of 100, spread unevenly over the threads.
  it("thread count does not change the result, and the chunks really ran on workers", { timeout: 60_000 }, async () => {
    for (const [mode, threads] of [["paired", 3], ["independent", 2]] as const) {
      const options = { permutations: 1100, seed: 12, mode };
      const threadIds = new Set<number>();
      const starts: number[] = [];
      const threaded = await compareSeasons(before, after, {
        ...options,
        threads,
        onChunk: (chunk, threadId) => {
          threadIds.add(threadId);
          starts.push(chunk.start);
        },
      });
      expect(threaded).toEqual(compareSeasonsSync(before, after, options));
      expect(await compareSeasons(before, after, { ...options, threads: 1 })).toEqual(threaded);
      // Worker threads have ids above 0 (the calling thread). Which worker takes which chunk
      // depends on timing, so only that workers did all of the work is asserted.
      expect([...threadIds].every((id) => id > 0)).toBe(true);
      expect(starts.sort((a, b) => a - b)).toEqual([0, 250, 500, 750, 1000]);
    }
  });

  it("runs small jobs in the calling thread unless told otherwise", () => {
    const small = prepareComparison(before, after, { permutations: 10 });
    expect(chooseThreads(small)).toBe(1);
    expect(chooseThreads(small, 4)).toBe(4);
    expect(() => chooseThreads(small, 0)).toThrow(RangeError);
  });
});
