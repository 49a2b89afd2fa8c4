import { beforeAll, describe, expect, it } from "vitest";
import { isSignInBlocked, recordSignInAttempt } from "@/lib/auth/rate-limit";
import { resetToDemo } from "./support/db";

describe("sign-in rate limit", () => {
  beforeAll(async () => {
    await resetToDemo();
  });

  it("blocks an e-mail after five failures in the window, whatever the address", async () => {
    const email = "someone@example.org";
    for (let i = 0; i < 4; i++) await recordSignInAttempt(email, `10.0.0.${i}`, false);
    expect(await isSignInBlocked(email, "192.0.2.1")).toBe(false);
    await recordSignInAttempt(email, "10.0.0.9", false);
    expect(await isSignInBlocked(email, "192.0.2.1")).toBe(true);
    expect(await isSignInBlocked("other@example.org", "192.0.2.1")).toBe(false);
  });

  it("blocks one address trying many e-mails", async () => {
    for (let i = 0; i < 30; i++) await recordSignInAttempt(`guess${i}@example.org`, "198.51.100.7", false);
    expect(await isSignInBlocked("fresh@example.org", "198.51.100.7")).toBe(true);
    expect(await isSignInBlocked("fresh@example.org", "198.51.100.8")).toBe(false);
  });
});
