// Timing helpers for the benchmarks: warm up, time sequential calls, nearest-rank percentiles.

export type Figures = { n: number; p50: number; p95: number; max: number };

export function percentile(sorted: number[], p: number): number {
  return sorted[Math.min(sorted.length - 1, Math.max(0, Math.ceil((p / 100) * sorted.length) - 1))]!;
}

/** `warmUp` untimed calls, then `n` timed ones, one after another (a page request waits for its queries). */
export async function timeCalls(call: (i: number) => Promise<unknown>, n: number, warmUp: number): Promise<Figures> {
  for (let i = 0; i < warmUp; i++) await call(i);
  const ms: number[] = [];
  for (let i = 0; i < n; i++) {
    const started = performance.now();
    await call(i);
    ms.push(performance.now() - started);
  }
  ms.sort((a, b) => a - b);
  return { n, p50: percentile(ms, 50), p95: percentile(ms, 95), max: ms[ms.length - 1]! };
}

export const fmt = (ms: number) => `${ms.toFixed(1)} ms`;
