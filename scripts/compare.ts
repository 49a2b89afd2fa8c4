// Command-line comparison of two season tables (see lib/change/README.md):
//   npm run --silent compare -- --before T1.csv --after T2.csv [--format json|csv] ...
// stdout carries only the result (one JSON document, or the per-site CSV table); every
// problem goes to stderr with exit code 2 (bad arguments or input) or 1 (internal error).
import { readFileSync } from "node:fs";
import { parseArgs } from "node:util";
import { z } from "zod";
import {
  ADJUST_METHODS,
  CsvError,
  type ChangeResult,
  INDICES,
  MAX_PERMUTATIONS,
  PERMUTATION_MODES,
  TableError,
  csvField,
  parseSpeciesTableCsv,
} from "../lib/change";
import { compareSeasons } from "../lib/change/threaded";
import { ALPHA, PERMUTATIONS } from "../lib/limits/analysis";

const USAGE = `usage: npm run compare -- --before T1.csv --after T2.csv
  [--index ${INDICES.join("|")}] (default percentage-difference)
  [--permutations N] (default ${PERMUTATIONS.default}; 0 = no test; at most ${MAX_PERMUTATIONS.toLocaleString("en-GB")})   [--seed N] (default 1)
  [--mode ${PERMUTATION_MODES.join("|")}] (default paired)
  [--adjust ${ADJUST_METHODS.join("|")}] (default holm)   [--alpha A] (default ${ALPHA.default}, above ${ALPHA.above} and below ${ALPHA.below})
  [--format json|csv] (default json)   [--threads N] (default: all cores for large jobs)`;

class UsageError extends Error {}

const integer = (name: string, min: number, max: number) =>
  z
    .string()
    .regex(/^\d+$/, `--${name} must be a whole number`)
    .transform(Number)
    .pipe(z.number().int().min(min, `--${name} must be at least ${min}`).max(max, `--${name} must be at most ${max}`));

const ArgsSchema = z.object({
  before: z.string({ error: "--before T1.csv is required" }).min(1, "--before needs a file name"),
  after: z.string({ error: "--after T2.csv is required" }).min(1, "--after needs a file name"),
  index: z.enum(INDICES, { error: `--index must be one of ${INDICES.join(", ")}` }).default("percentage-difference"),
  // Offline work may run far more permutations than the app allows (99,999): the engine's own cap,
  // OFFLINE_MAX_PERMUTATIONS in lib/limits/analysis.ts, which says why.
  permutations: integer("permutations", PERMUTATIONS.min, MAX_PERMUTATIONS).default(PERMUTATIONS.default),
  seed: integer("seed", 0, Number.MAX_SAFE_INTEGER).default(1),
  mode: z.enum(PERMUTATION_MODES, { error: `--mode must be one of ${PERMUTATION_MODES.join(", ")}` }).default("paired"),
  adjust: z.enum(ADJUST_METHODS, { error: `--adjust must be one of ${ADJUST_METHODS.join(", ")}` }).default("holm"),
  alpha: z
    .string()
    .regex(/^(?:\d+(?:\.\d*)?|\.\d+)(?:[eE][+-]?\d+)?$/, "--alpha must be a number")
    .transform(Number)
    .pipe(z.number().gt(ALPHA.above, `--alpha must be above ${ALPHA.above}`).lt(ALPHA.below, `--alpha must be below ${ALPHA.below}`))
    .default(ALPHA.default),
  format: z.enum(["json", "csv"], { error: "--format must be json or csv" }).default("json"),
  threads: integer("threads", 1, 1024).optional(),
});

function parseArguments(argv: string[]) {
  let values: Record<string, string | boolean | undefined>;
  try {
    const names = ["before", "after", "index", "permutations", "seed", "mode", "adjust", "alpha", "format", "threads"] as const;
    ({ values } = parseArgs({
      args: argv,
      options: { ...Object.fromEntries(names.map((n) => [n, { type: "string" as const }])), help: { type: "boolean" } },
      strict: true,
      allowPositionals: false,
    }));
  } catch (error) {
    throw new UsageError(error instanceof Error ? error.message : String(error));
  }
  if (values.help) return null;
  const parsed = ArgsSchema.safeParse(values);
  if (!parsed.success) throw new UsageError(parsed.error.issues.map((i) => i.message).join("; "));
  return parsed.data;
}

function readTable(path: string) {
  let bytes: Buffer;
  try {
    bytes = readFileSync(path);
  } catch (error) {
    const code = (error as NodeJS.ErrnoException).code;
    throw new CsvError(path, null, null, `cannot read the file${code ? ` (${code})` : ""}`);
  }
  let text: string;
  try {
    text = new TextDecoder("utf-8", { fatal: true }).decode(bytes);
  } catch {
    throw new CsvError(path, null, null, "the file is not UTF-8 text");
  }
  return parseSpeciesTableCsv(text, path);
}

function toCsv(result: ChangeResult): string {
  const columns = ["site", "shared", "lost", "gained", "losses", "gains", "dissimilarity", "direction", "p", "pAdjusted", "exceptional"] as const;
  const lines = [columns.join(",")];
  for (const s of result.sites) lines.push(columns.map((c) => csvField(s[c] === null ? "" : String(s[c]))).join(","));
  return lines.join("\n") + "\n";
}

async function main(): Promise<number> {
  let args: ReturnType<typeof parseArguments>;
  try {
    args = parseArguments(process.argv.slice(2));
  } catch (error) {
    if (!(error instanceof UsageError)) throw error;
    process.stderr.write(`compare: ${error.message}\n${USAGE}\n`);
    return 2;
  }
  if (args === null) {
    process.stderr.write(`${USAGE}\n`);
    return 0;
  }
  let result: ChangeResult;
  try {
    const before = readTable(args.before);
    const after = readTable(args.after);
    const { index, permutations, seed, mode, adjust, alpha, threads } = args;
    result = await compareSeasons(before, after, { index, permutations, seed, mode, adjust, alpha, threads });
  } catch (error) {
    if (error instanceof CsvError || error instanceof TableError) {
      process.stderr.write(`compare: ${error.message}\n`);
      return 2;
    }
    throw error;
  }
  if (args.format === "json") {
    process.stdout.write(JSON.stringify(result, null, 2) + "\n");
  } else {
    process.stdout.write(toCsv(result));
    for (const e of result.excluded) process.stderr.write(`compare: note: site "${e.site}" left out: ${e.reason}\n`);
  }
  return 0;
}

main().then(
  (code) => {
    process.exitCode = code;
  },
  (error: unknown) => {
    process.stderr.write(`compare: internal error: ${error instanceof Error ? (error.stack ?? error.message) : String(error)}\n`);
    process.exitCode = 1;
  },
);
