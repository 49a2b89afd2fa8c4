import { describe, expect, it } from "vitest";
import { runTs, shellEnv } from "../support/ops-shell";

// Every entry point refuses a production environment that is not set up, with the one message
// lib/env.ts builds (EnvError: "Invalid configuration:" and one "NAME: why" line per variable),
// no stack trace, and exit status 78 (EX_CONFIG in BSD's sysexits.h; serve.mjs does not restart a
// process that exits with it).
const CONFIG_EXIT_CODE = 78;

// Nothing set but production mode (.env may still add AUTH_SECRET: scripts/load-env.ts).
const run = (script: string, args: string[]) => runTs(script, args, shellEnv({ TURNSTONE_ENV: "production" }));

const named = ["DATABASE_URL", "APP_URL", "S3_ENDPOINT", "S3_ACCESS_KEY_ID", "S3_SECRET_ACCESS_KEY", "SMTP_HOST", "SMTP_SECURE", "MAIL_FROM"];

describe("entry points on a production environment that is not set up", () => {
  for (const [script, args] of [
    ["scripts/migrate.ts", []],
    ["scripts/seed.ts", []],
    ["scripts/setup-organiser.ts", ["--email", "ada@example.org"]],
    ["workers/index.ts", []],
  ] as const) {
    it(`${script} stops with the configuration message and no stack trace`, { timeout: 30_000 }, () => {
      const result = run(script, [...args]);
      expect(result.status).toBe(CONFIG_EXIT_CODE);
      expect(result.stderr).toContain("Invalid configuration:");
      for (const name of named) expect(result.stderr).toMatch(new RegExp(`^\\s+${name}: `, "m"));
      expect(result.stderr).not.toMatch(/^\s+at /m);
      expect(result.stdout).not.toMatch(/migrated|seeded|started|invitation/i);
    });
  }
});
