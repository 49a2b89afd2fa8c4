import { EnvError, env, type Env } from "@/lib/env";

/**
 * Exit status for a configuration error: EX_CONFIG from BSD's sysexits.h. scripts/serve.mjs does
 * not restart an app process that exits with it, and the start scripts stop on it.
 */
export const CONFIG_EXIT_CODE = 78;

/** The validated environment, or lib/env.ts's one message on stderr (no stack trace) and exit 78. */
export function requireEnv(): Env {
  try {
    return env();
  } catch (error) {
    if (!(error instanceof EnvError)) throw error;
    console.error(`[turnstone] ${error.message}`);
    process.exit(CONFIG_EXIT_CODE);
  }
}
