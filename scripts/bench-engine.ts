// Benchmark of the change engine (npm run bench:engine): a seeded sparse pair of
// 2,000 sites x 300 species, 2,999 permutations, timed with the fast threaded engine, the
// fast engine on one thread, the plain dense JavaScript reference and, when a C compiler
// is present, a plain dense single-threaded C version (scripts/bench/dense-permutation.c).
// Every figure printed is measured in this run.
import { execFileSync, spawnSync } from "node:child_process";
import { mkdtempSync, rmSync, writeFileSync } from "node:fs";
import { availableParallelism, loadavg, tmpdir } from "node:os";
import path from "node:path";
import { type ChangeResult, type SpeciesTable, Xoshiro128, isPresenceAbsence } from "../lib/change";
import { compareSeasons } from "../lib/change/threaded";
import { denseReference } from "../lib/change/dense-reference";
import { STREAM_TEST } from "../lib/change/random";

const SITES = 2000;
const SPECIES = 300;
const PERMUTATIONS = 2999;
const SEED = 20240601;
const INDEX = "percentage-difference" as const;
const MODE = "paired" as const;

/**
 * A resurvey-like pair: species prevalence varies (mean ~12%), most T1 occurrences persist
 * and a few sites are colonised, so each table is ~12% non-zero and their union ~14%.
 */
function generatePair(): { before: SpeciesTable; after: SpeciesTable } {
  const rng = Xoshiro128.stream(SEED, STREAM_TEST, 0);
  const sites = Array.from({ length: SITES }, (_, i) => `S${String(i + 1).padStart(4, "0")}`);
  const species = Array.from({ length: SPECIES }, (_, j) => `species ${j + 1}`);
  const v1 = Array.from({ length: SITES }, () => new Float64Array(SPECIES));
  const v2 = Array.from({ length: SITES }, () => new Float64Array(SPECIES));
  const count = () => 1 + Math.floor(-Math.log(1 - rng.nextFloat()) * 4);
  for (let j = 0; j < SPECIES; j++) {
    const prevalence = 0.24 * rng.nextFloat();
    const colonise = (prevalence * 0.2) / (1 - prevalence);
    for (let i = 0; i < SITES; i++) {
      const present = rng.nextFloat() < prevalence;
      if (present) v1[i]![j] = count();
      if (present ? rng.nextFloat() < 0.8 : rng.nextFloat() < colonise) v2[i]![j] = count();
    }
  }
  return { before: { sites, species, values: v1 }, after: { sites, species, values: v2 } };
}

function nonZeroShare(tables: SpeciesTable[]): number {
  let nz = 0;
  for (let i = 0; i < SITES; i++) for (let j = 0; j < SPECIES; j++) if (tables.some((t) => t.values[i]![j]! > 0)) nz++;
  return nz / (SITES * SPECIES);
}

function seconds(start: bigint): number {
  return Number(process.hrtime.bigint() - start) / 1e9;
}

async function timedCompare(before: SpeciesTable, after: SpeciesTable, threads: number) {
  const start = process.hrtime.bigint();
  const result = await compareSeasons(before, after, { index: INDEX, mode: MODE, permutations: PERMUTATIONS, seed: SEED, threads });
  return { result, seconds: seconds(start) };
}

function runNative(before: SpeciesTable, after: SpeciesTable): { seconds: number; wall: number; p: number[] } | string {
  const compiler = ["cc", "gcc"].find((c) => spawnSync(c, ["--version"], { stdio: "ignore" }).status === 0);
  if (compiler === undefined) return "no C compiler (cc) found: skipped";
  const dir = mkdtempSync(path.join(tmpdir(), "turnstone-bench-"));
  try {
    const binary = path.join(dir, "dense");
    const source = path.join(import.meta.dirname, "bench", "dense-permutation.c");
    execFileSync(compiler, ["-O3", "-march=native", "-o", binary, source], { stdio: "inherit" });
    const presence = isPresenceAbsence(INDEX);
    const cell = (v: number) => (presence ? (v > 0 ? 1 : 0) : v);
    const lines = [`${SITES} ${SPECIES} ${PERMUTATIONS} ${SEED} ${["jaccard", "sorensen", "ruzicka", "percentage-difference"].indexOf(INDEX)} ${MODE === "paired" ? 0 : 1}`];
    for (const t of [before, after]) for (const row of t.values) lines.push(Array.from(row, cell).join(" "));
    const input = path.join(dir, "tables.txt");
    writeFileSync(input, lines.join("\n") + "\n");
    const start = process.hrtime.bigint();
    const out = execFileSync(binary, [input], { encoding: "utf8", maxBuffer: 64 * 1024 * 1024 });
    const wall = seconds(start);
    const [first, ...rest] = out.trim().split("\n");
    return { seconds: Number(first!.split(" ")[1]), wall, p: rest.map(Number) };
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}

async function main() {
  const threads = availableParallelism();
  const { before, after } = generatePair();
  console.log(`data: ${SITES} sites x ${SPECIES} species; non-zero cells: T1 ${(100 * nonZeroShare([before])).toFixed(1)}%, T2 ${(100 * nonZeroShare([after])).toFixed(1)}%, either ${(100 * nonZeroShare([before, after])).toFixed(1)}%`);
  console.log(`index ${INDEX}, mode ${MODE}, ${PERMUTATIONS} permutations, seed ${SEED}`);
  // Other work on the machine slows every figure below; the load average says how busy it was.
  console.log(`load average before the run: ${loadavg().map((l) => l.toFixed(2)).join(", ")} on ${availableParallelism()} cores`);

  const fast = await timedCompare(before, after, threads);
  console.log(`fast engine, ${threads} threads (whole compare run): ${fast.seconds.toFixed(2)} s`);
  const single = await timedCompare(before, after, 1);
  console.log(`fast engine, 1 thread (whole compare run):  ${single.seconds.toFixed(2)} s`);
  const sameAcrossThreads = JSON.stringify(fast.result) === JSON.stringify(single.result);
  console.log(`identical results for ${threads} threads and 1 thread: ${sameAcrossThreads ? "yes" : "NO"}`);

  const start = process.hrtime.bigint();
  const dense = denseReference(before, after, { index: INDEX, mode: MODE, seed: SEED, permutations: PERMUTATIONS });
  const denseSeconds = seconds(start);
  console.log(`dense JavaScript reference, 1 thread: ${denseSeconds.toFixed(2)} s`);
  console.log(`ratio dense JS / fast engine (${threads} threads): ${(denseSeconds / fast.seconds).toFixed(1)}x`);
  const sameAsDense = samePValues(fast.result, dense.counts);
  console.log(`fast and dense reference p-values identical (same random stream): ${sameAsDense ? "yes" : "NO"}`);

  const native = runNative(before, after);
  if (typeof native === "string") {
    console.log(`dense C: ${native}`);
  } else {
    const diff = Math.max(...native.p.map((p, i) => Math.abs(p - fast.result.sites[i]!.p!)));
    console.log(`dense C (-O3, 1 thread, own random stream): permutations ${native.seconds.toFixed(2)} s, whole process ${native.wall.toFixed(2)} s`);
    console.log(`ratio dense C permutation time / fast engine whole run: ${(native.seconds / fast.seconds).toFixed(2)}x (target: >= 1)`);
    console.log(`largest |p(C) - p(fast)| (different streams, Monte Carlo noise only): ${diff.toFixed(4)}`);
  }
  console.log(`threads used: ${threads}; peak RSS: ${(process.resourceUsage().maxRSS / 1024).toFixed(0)} MB; load average after: ${loadavg().map((l) => l.toFixed(2)).join(", ")}`);
  if (!sameAcrossThreads || !sameAsDense) process.exitCode = 1;
}

function samePValues(result: ChangeResult, denseCounts: Int32Array): boolean {
  return result.sites.length === denseCounts.length && result.sites.every((s, i) => s.p === (1 + denseCounts[i]!) / (1 + PERMUTATIONS));
}

main().catch((error: unknown) => {
  console.error(error);
  process.exitCode = 1;
});
