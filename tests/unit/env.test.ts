import { describe, expect, it } from "vitest";
import { EnvError, parseEnv } from "@/lib/env";

describe("configuration", () => {
  it("works with no settings at all, pointing at the local services", () => {
    const env = parseEnv({});
    expect(env.DATABASE_URL).toMatch(/^postgres:\/\/.+@127\.0\.0\.1:54329\//);
    expect(env.S3_ENDPOINT).toBe("http://127.0.0.1:54330");
    expect(env.SMTP_PORT).toBe(54331);
    expect(env.S3_FORCE_PATH_STYLE).toBe(true);
  });

  it("names the variable that is wrong", () => {
    expect(() => parseEnv({ DATABASE_URL: "mysql://x" })).toThrow(/DATABASE_URL: must be a postgres/);
    expect(() => parseEnv({ SMTP_PORT: "seventy" })).toThrow(/SMTP_PORT/);
    expect(() => parseEnv({ S3_ENDPOINT: "not a url" })).toThrow(/S3_ENDPOINT/);
    expect(() => parseEnv({ AUTH_SECRET: "short" })).toThrow(EnvError);
  });

  it("treats an empty value as unset", () => {
    expect(parseEnv({ S3_BUCKET: "" }).S3_BUCKET).toBe("turnstone-photos");
  });
});
