import { sql } from "drizzle-orm";
import { beforeEach, describe, expect, it } from "vitest";
import { db } from "@/db/client";
import { SIGN_IN_POLICY, finishSignInAttempt, startSignInAttempt, waitInWords, type SignInDecision } from "@/lib/auth/rate-limit";
import { UNKNOWN_ADDRESS } from "@/lib/http/client-address";
import "./support/db"; // refuses to run against anything but a test database

// The policy is ours (stated at the top of lib/auth/rate-limit.ts). Growing delays instead of a
// hard lock follow the OWASP Authentication Cheat Sheet's advice that a lockout must not let an
// attacker deny a user service, with exponentially growing delays as its example (from memory of
// that page, section "Account Lockout"). Every test passes its own clock: no sleeps.

const SECOND = 1000;
const MINUTE = 60 * SECOND;
const OWNER = "volunteer.owner@example.org";
const OWNER_ADDRESS = "203.0.113.10";
const STRANGER_ADDRESS = "198.51.100.66";

const at = (base: Date, ms: number) => new Date(base.getTime() + ms);

/** One sign-in try at `now`: when allowed, it is checked and ends as `succeeds` says. */
async function attempt(email: string, address: string, now: Date, succeeds = false): Promise<SignInDecision> {
  const decision = await startSignInAttempt(email, address, now);
  if (decision.allowed) await finishSignInAttempt(decision.attemptId, succeeds, now);
  return decision;
}

const waitOf = (d: SignInDecision) => (d.allowed ? 0 : d.retryAfterMs);

/** Fails `times` times, each as soon as the limit allows. Returns the clock after the last failure. */
async function failRepeatedly(email: string, address: (i: number) => string, from: Date, times: number): Promise<Date> {
  let now = from;
  for (let i = 0; i < times; ) {
    const d = await attempt(email, address(i), now);
    if (d.allowed) i++;
    else now = at(now, d.retryAfterMs);
  }
  return now;
}

describe("the sign-in limit", () => {
  beforeEach(async () => {
    await db().execute(sql`delete from sign_in_attempts`);
  });

  it("per e-mail and address: 3 failures free, then 1 s doubling per failure; a success resets the pair", async () => {
    const t0 = new Date();
    for (let i = 0; i < 3; i++) expect((await attempt(OWNER, OWNER_ADDRESS, t0)).allowed).toBe(true);
    expect(waitOf(await attempt(OWNER, OWNER_ADDRESS, t0))).toBe(1 * SECOND);
    expect(waitOf(await attempt(OWNER, OWNER_ADDRESS, at(t0, 999)))).toBe(1);
    expect((await attempt(OWNER, OWNER_ADDRESS, at(t0, 1 * SECOND))).allowed).toBe(true);
    expect(waitOf(await attempt(OWNER, OWNER_ADDRESS, at(t0, 1 * SECOND)))).toBe(2 * SECOND);
    expect((await attempt(OWNER, OWNER_ADDRESS, at(t0, 3 * SECOND))).allowed).toBe(true);
    expect(waitOf(await attempt(OWNER, OWNER_ADDRESS, at(t0, 3 * SECOND)))).toBe(4 * SECOND);

    // The right password after the wait: the pair starts again with 3 free failures.
    expect((await attempt(OWNER, OWNER_ADDRESS, at(t0, 7 * SECOND), true)).allowed).toBe(true);
    for (let i = 0; i < 3; i++) expect((await attempt(OWNER, OWNER_ADDRESS, at(t0, 8 * SECOND))).allowed).toBe(true);
    expect(waitOf(await attempt(OWNER, OWNER_ADDRESS, at(t0, 8 * SECOND)))).toBe(1 * SECOND);
  });

  it("the pair's delay stops growing at 15 minutes", async () => {
    let now = new Date();
    const waits: number[] = [];
    for (let failures = 0; failures < 16; ) {
      const d = await attempt(OWNER, STRANGER_ADDRESS, now);
      if (d.allowed) failures++;
      else {
        waits.push(d.retryAfterMs);
        now = at(now, d.retryAfterMs);
      }
    }
    expect(waits).toEqual([1, 2, 4, 8, 16, 32, 64, 128, 256, 512, 900, 900, 900].map((s) => s * SECOND));
  });

  it("a refused try is not counted, so knocking while waiting does not make the wait longer", async () => {
    const t0 = new Date();
    for (let i = 0; i < 3; i++) await attempt(OWNER, OWNER_ADDRESS, t0);
    for (let i = 0; i < 40; i++) expect((await attempt(OWNER, OWNER_ADDRESS, at(t0, 20 * i))).allowed).toBe(false);
    expect((await attempt(OWNER, OWNER_ADDRESS, at(t0, 1 * SECOND))).allowed).toBe(true);
    expect(waitOf(await attempt(OWNER, OWNER_ADDRESS, at(t0, 1 * SECOND)))).toBe(2 * SECOND);
  });

  it("a stranger failing 100 times from another address does not stop the owner signing in from theirs within 30 s", async () => {
    const after = await failRepeatedly(OWNER, () => STRANGER_ADDRESS, new Date(Date.now() - 23 * 60 * MINUTE), 100);
    // The stranger's own pair now waits 15 minutes between tries ...
    expect(waitOf(await attempt(OWNER, STRANGER_ADDRESS, after))).toBe(15 * MINUTE);
    // ... while the owner, from a connection never used before, waits 30 s at most.
    const first = await attempt(OWNER, OWNER_ADDRESS, after, true);
    expect(waitOf(first)).toBeLessThanOrEqual(SIGN_IN_POLICY.email.maxDelayMs);
    const later = first.allowed ? first : await attempt(OWNER, OWNER_ADDRESS, at(after, first.retryAfterMs), true);
    expect(later.allowed).toBe(true);
  });

  it("many addresses guessing one e-mail get about two tries a minute; the owner's known connection is not slowed", async () => {
    const t0 = new Date(Date.now() - 2 * 60 * MINUTE);
    expect((await attempt(OWNER, OWNER_ADDRESS, t0, true)).allowed).toBe(true); // signed in here before
    const start = at(t0, MINUTE);
    const after = await failRepeatedly(OWNER, (i) => `192.0.2.${i + 1}`, start, 100);
    // 5 free, then 1 + 2 + 4 + 8 + 16 s, then 90 waits of 30 s.
    expect(after.getTime() - start.getTime()).toBe((1 + 2 + 4 + 8 + 16 + 90 * 30) * SECOND);
    expect(waitOf(await attempt(OWNER, "192.0.2.250", after))).toBe(30 * SECOND);
    expect((await attempt(OWNER, OWNER_ADDRESS, after, true)).allowed).toBe(true);
  });

  it("one address failing for 50 e-mails in 15 minutes is then slowed for every e-mail; other addresses are not", async () => {
    const t0 = new Date();
    for (let i = 0; i < 50; i++) expect((await attempt(`guess${i}@example.org`, STRANGER_ADDRESS, t0)).allowed).toBe(true);
    expect(waitOf(await attempt("fresh@example.org", STRANGER_ADDRESS, t0))).toBe(1 * SECOND);
    expect((await attempt("fresh@example.org", OWNER_ADDRESS, t0)).allowed).toBe(true);
    expect((await attempt("fresh2@example.org", STRANGER_ADDRESS, at(t0, 1 * SECOND))).allowed).toBe(true);
    expect(waitOf(await attempt("fresh3@example.org", STRANGER_ADDRESS, at(t0, 1 * SECOND)))).toBe(2 * SECOND);
    // The budget is per 15 minutes: once those failures are older, the address is free again.
    expect((await attempt("fresh4@example.org", STRANGER_ADDRESS, at(t0, 15 * MINUTE + 2 * SECOND))).allowed).toBe(true);
  });

  it("all addresses of one IPv6 /64 share one budget", async () => {
    const t0 = new Date();
    for (let i = 0; i < 50; i++) await attempt(`guess${i}@example.org`, `2001:db8:1:2::${(i + 1).toString(16)}`, t0);
    expect(waitOf(await attempt("fresh@example.org", "2001:db8:1:2:ffff::1", t0))).toBe(1 * SECOND);
    expect((await attempt("fresh@example.org", "2001:db8:1:3::1", t0)).allowed).toBe(true);
  });

  it("with no address known (dev server), nobody waits more than 30 s, however many failures the shared bucket has", async () => {
    const t0 = new Date(Date.now() - 60 * MINUTE);
    // 20 failures: the pair alone would now ask for 15 minutes.
    const after = await failRepeatedly(OWNER, () => UNKNOWN_ADDRESS, t0, 20);
    expect(waitOf(await attempt(OWNER, UNKNOWN_ADDRESS, after))).toBeLessThanOrEqual(30 * SECOND);
    for (let i = 0; i < 60; i++) await attempt(`guess${i}@example.org`, UNKNOWN_ADDRESS, after);
    const d = await attempt("someone.else@example.org", UNKNOWN_ADDRESS, after);
    expect(waitOf(d)).toBeGreaterThan(0);
    expect(waitOf(d)).toBeLessThanOrEqual(30 * SECOND);
  });

  it("parallel tries cannot slip past the count: of 10 at once on a fresh pair, exactly 3 are checked", async () => {
    const now = new Date();
    const decisions = await Promise.all(Array.from({ length: 10 }, () => startSignInAttempt(OWNER, STRANGER_ADDRESS, now)));
    expect(decisions.filter((d) => d.allowed)).toHaveLength(3);
  });

  it("forgets failures after a day and successes after 30 days", async () => {
    const now = new Date();
    const old = at(now, -25 * 60 * MINUTE);
    await failRepeatedly(OWNER, () => STRANGER_ADDRESS, old, 5);
    await attempt("known@example.org", OWNER_ADDRESS, at(now, -31 * 24 * 60 * MINUTE), true);
    await attempt("recent@example.org", OWNER_ADDRESS, at(now, -29 * 24 * 60 * MINUTE), true);
    expect((await attempt(OWNER, STRANGER_ADDRESS, now)).allowed).toBe(true);
    const left = await db().execute<{ email_key: string; succeeded: boolean }>(sql`select email_key, succeeded from sign_in_attempts order by attempted_at`);
    expect(left.map((r) => [r.email_key, r.succeeded])).toEqual([
      ["recent@example.org", true],
      [OWNER, false],
    ]);
  });

  it("tells the person how long to wait, rounded up", () => {
    expect(waitInWords(1)).toBe("1 second");
    expect(waitInWords(1500)).toBe("2 seconds");
    expect(waitInWords(30 * SECOND)).toBe("30 seconds");
    expect(waitInWords(60 * SECOND)).toBe("1 minute");
    expect(waitInWords(90 * SECOND)).toBe("2 minutes");
    expect(waitInWords(15 * MINUTE)).toBe("15 minutes");
  });
});
