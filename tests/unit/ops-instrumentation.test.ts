import { afterEach, describe, expect, it, vi } from "vitest";

// Next calls register() from instrumentation.ts once when a server process starts (Next.js docs,
// "instrumentation.js": "called once when a new Next.js server instance is initiated"). It must
// stop the process on a bad environment, with lib/env.ts's one message, before any request.
const settings = ["DATABASE_URL", "AUTH_SECRET", "APP_URL", "S3_ENDPOINT", "S3_ACCESS_KEY_ID", "S3_SECRET_ACCESS_KEY", "SMTP_HOST", "SMTP_SECURE", "SMTP_REQUIRE_TLS", "MAIL_FROM"];

async function registerWith(env: Record<string, string>) {
  vi.resetModules();
  for (const name of settings) vi.stubEnv(name, "");
  for (const [name, value] of Object.entries(env)) vi.stubEnv(name, value);
  const exit = vi.spyOn(process, "exit").mockImplementation(((code: number) => {
    throw new Error(`exit ${code}`);
  }) as never);
  const printed = vi.spyOn(console, "error").mockImplementation(() => undefined);
  const { register } = await import("@/instrumentation");
  const outcome = await register().then(
    () => "returned",
    (error: Error) => error.message,
  );
  return { outcome, exit, printed: printed.mock.calls.map((c) => c.join(" ")).join("\n") };
}

afterEach(() => {
  vi.unstubAllEnvs();
  vi.restoreAllMocks();
});

describe("instrumentation register()", () => {
  it("stops a server process on a production environment that is not set up", async () => {
    const { outcome, exit, printed } = await registerWith({ NEXT_RUNTIME: "nodejs", TURNSTONE_ENV: "production" });
    expect(outcome).toBe("exit 78");
    expect(exit).toHaveBeenCalledWith(78);
    expect(printed).toContain("Invalid configuration:");
    for (const name of ["DATABASE_URL", "AUTH_SECRET", "APP_URL", "S3_ENDPOINT", "SMTP_HOST", "MAIL_FROM"]) expect(printed).toMatch(new RegExp(`^\\s+${name}: `, "m"));
    expect(printed).not.toMatch(/^\s+at /m);
  });

  it("lets a development server start with the local defaults", async () => {
    const { outcome, exit } = await registerWith({ NEXT_RUNTIME: "nodejs", TURNSTONE_ENV: "development" });
    expect(outcome).toBe("returned");
    expect(exit).not.toHaveBeenCalled();
  });

  it("stops a development server with a value that cannot be read", async () => {
    const { outcome, printed } = await registerWith({ NEXT_RUNTIME: "nodejs", DATABASE_POOL_SIZE: "lots" });
    expect(outcome).toBe("exit 78");
    expect(printed).toMatch(/DATABASE_POOL_SIZE: must be a whole number/);
  });
});
