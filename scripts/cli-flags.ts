import { parseArgs, type ParseArgsConfig } from "node:util";
import type { z } from "zod";

/** Exit status for a command used wrongly (common practice for command-line tools). */
export const USAGE_EXIT_CODE = 2;

type Options = NonNullable<ParseArgsConfig["options"]>;

/**
 * Reads `--flag value` options strictly (an unknown flag or a stray word is an error) and checks
 * them with zod; on any problem prints each one and the usage line, and exits 2.
 */
export function parseFlags<S extends z.ZodType>(usage: string, options: Options, schema: S, argv = process.argv.slice(2)): z.infer<S> {
  const fail = (lines: string[]): never => {
    for (const line of lines) console.error(`[turnstone] ${line}`);
    console.error(`usage: ${usage}`);
    process.exit(USAGE_EXIT_CODE);
  };
  let values: unknown;
  try {
    values = parseArgs({ args: argv, options, strict: true, allowPositionals: false }).values;
  } catch (error) {
    return fail([error instanceof Error ? error.message : String(error)]);
  }
  const parsed = schema.safeParse(values);
  if (!parsed.success) return fail(parsed.error.issues.map((issue) => `--${issue.path.join(".")}: ${issue.message}`));
  return parsed.data;
}
