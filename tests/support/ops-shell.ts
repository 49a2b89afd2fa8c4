import { spawnSync } from "node:child_process";
import path from "node:path";

/** The repository's root, where every script runs. */
export const repoRoot = path.resolve(import.meta.dirname, "../..");

/** Only what a login shell would have, plus `extra`: no settings leak in from the test run. */
export function shellEnv(extra: Record<string, string> = {}): NodeJS.ProcessEnv {
  const env: Record<string, string> = { PATH: process.env.PATH ?? "/usr/bin:/bin", HOME: process.env.HOME ?? "/tmp", ...extra };
  // Next's types declare NODE_ENV always present; a child process may well have none.
  return env as unknown as NodeJS.ProcessEnv;
}

/** Runs a TypeScript entry point the way the package scripts do (tsx, server-only allowed). */
export function runTs(script: string, args: string[], env: NodeJS.ProcessEnv, timeout = 20_000) {
  return spawnSync(process.execPath, ["--import", "tsx", "--conditions=react-server", script, ...args], {
    cwd: repoRoot,
    env,
    encoding: "utf8",
    timeout,
    killSignal: "SIGKILL",
  });
}
