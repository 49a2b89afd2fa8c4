import "server-only";
import { and, eq, lt, or, sql, type SQL } from "drizzle-orm";
import { db, type Transaction } from "@/db/client";
import { signInAttempts } from "@/db/schema";
import { UNKNOWN_ADDRESS, addressKey } from "@/lib/http/client-address";

// The sign-in limit: it slows guessing, and no stranger can use it to lock a volunteer out.
//
// - Per e-mail and address (the pair): 3 failures free, then the next try waits 1 s, doubling with
//   each failure up to 15 minutes. A success from that address resets the pair. Only someone at
//   the owner's own address can slow the owner down this way.
// - Per address, across all e-mails: 50 failures in 15 minutes free, then 1 s doubling up to 15
//   minutes, so one machine cannot spray guesses over many accounts. IPv6 counts per /64.
// - Per e-mail, across all addresses: 5 failures in 15 minutes free, then 1 s doubling up to at
//   most 30 s, so a guesser with many addresses gets about two tries a minute, while the owner
//   waits 30 s at most. An address that signed in to that e-mail in the last 30 days is exempt,
//   so the owner on a known connection is never slowed by strangers elsewhere.
// - With no address known (the dev server), everyone shares one bucket, so no wait exceeds 30 s.
// A try that must wait is refused without checking the password and is not counted; each checked
// try is recorded as a failure before its password is checked (under a lock per e-mail and per
// address), so a burst of parallel tries cannot slip past the count. Failures are forgotten after
// a day, successes after 30 days.

const SECOND = 1000;
const MINUTE = 60 * SECOND;
const DAY = 24 * 60 * MINUTE;

type GrowingDelay = { free: number; firstDelayMs: number; maxDelayMs: number };

export const SIGN_IN_POLICY = {
  pair: { free: 3, firstDelayMs: SECOND, maxDelayMs: 15 * MINUTE },
  address: { windowMs: 15 * MINUTE, free: 50, firstDelayMs: SECOND, maxDelayMs: 15 * MINUTE },
  email: { windowMs: 15 * MINUTE, free: 5, firstDelayMs: SECOND, maxDelayMs: 30 * SECOND },
  forgetFailuresAfterMs: DAY,
  knownAddressForMs: 30 * DAY,
} as const;

/** No wait for the first `free` failures, then `firstDelayMs` doubling per failure, capped. */
export function growingDelayMs(failures: number, rule: GrowingDelay): number {
  if (failures < rule.free) return 0;
  return Math.min(rule.firstDelayMs * 2 ** (failures - rule.free), rule.maxDelayMs);
}

export type SignInDecision = { allowed: true; attemptId: string } | { allowed: false; retryAfterMs: number };

// Advisory lock classes (first key of pg_advisory_xact_lock(int, int)): ours alone in this database.
const LOCK_EMAIL = 0x5349_0001;
const LOCK_ADDRESS = 0x5349_0002;

/**
 * Decides whether a sign-in may be checked now. When it may, the try is recorded as a failure at
 * once; call finishSignInAttempt with the outcome. `email` is the trimmed, lower-case address.
 */
export async function startSignInAttempt(email: string, clientAddress: string, now: Date = new Date()): Promise<SignInDecision> {
  const ip = addressKey(clientAddress);
  return db().transaction(async (tx) => {
    // Always e-mail first, then address: one order, so two tries never wait on each other in a cycle.
    await tx.execute(sql`select pg_advisory_xact_lock(${LOCK_EMAIL}, hashtext(${email})), pg_advisory_xact_lock(${LOCK_ADDRESS}, hashtext(${ip}))`);
    const retryAfterMs = await waitBeforeNextTry(tx, email, ip, now);
    if (retryAfterMs > 0) return { allowed: false, retryAfterMs };
    const [row] = await tx.insert(signInAttempts).values({ emailKey: email, ipKey: ip, succeeded: false, attemptedAt: now }).returning({ id: signInAttempts.id });
    return { allowed: true, attemptId: row!.id };
  });
}

/** Records the outcome of a try startSignInAttempt allowed, and forgets what the limits no longer need. */
export async function finishSignInAttempt(attemptId: string, succeeded: boolean, now: Date = new Date()): Promise<void> {
  if (succeeded) await db().update(signInAttempts).set({ succeeded: true }).where(eq(signInAttempts.id, attemptId));
  await db()
    .delete(signInAttempts)
    .where(
      or(
        lt(signInAttempts.attemptedAt, new Date(now.getTime() - SIGN_IN_POLICY.knownAddressForMs)),
        and(eq(signInAttempts.succeeded, false), lt(signInAttempts.attemptedAt, new Date(now.getTime() - SIGN_IN_POLICY.forgetFailuresAfterMs))),
      ),
    );
}

type Counted = { n: number; last: number | null };

/** How many failures match `where`, and the latest as milliseconds since 1970 (`<name>_n`, `<name>_last`). */
const failureStats = (name: string, where: SQL) =>
  sql`count(*) filter (where ${where})::int as ${sql.identifier(`${name}_n`)},
      round(extract(epoch from max(attempted_at) filter (where ${where})) * 1000)::float8 as ${sql.identifier(`${name}_last`)}`;

async function waitBeforeNextTry(tx: Transaction, email: string, ip: string, now: Date): Promise<number> {
  // As text: postgres.js takes no Date in a raw statement's parameters.
  const ago = (ms: number) => new Date(now.getTime() - ms).toISOString();
  const pair = sql`email_key = ${email} and ip_key = ${ip} and attempted_at > coalesce((select at from pair_success), '-infinity')`;
  const byAddress = sql`ip_key = ${ip} and attempted_at > ${ago(SIGN_IN_POLICY.address.windowMs)}`;
  const byEmail = sql`email_key = ${email} and attempted_at > ${ago(SIGN_IN_POLICY.email.windowMs)}`;
  // One round trip: the pair's last success within 30 days, then what each rule counts.
  const [row] = await tx.execute<{ known: boolean } & Record<`${"pair" | "address" | "email"}_${"n" | "last"}`, number | null>>(sql`
    with pair_success as (
      select max(attempted_at) as at from ${signInAttempts}
      where email_key = ${email} and ip_key = ${ip} and succeeded and attempted_at > ${ago(SIGN_IN_POLICY.knownAddressForMs)}
    )
    select (select at from pair_success) is not null as known,
      ${failureStats("pair", pair)}, ${failureStats("address", byAddress)}, ${failureStats("email", byEmail)}
    from ${signInAttempts}
    where not succeeded and attempted_at > ${ago(SIGN_IN_POLICY.forgetFailuresAfterMs)} and (email_key = ${email} or ip_key = ${ip})`);
  const counted = (name: "pair" | "address" | "email"): Counted => ({ n: row?.[`${name}_n`] ?? 0, last: row?.[`${name}_last`] ?? null });
  const waits = [
    waitFrom(counted("pair"), SIGN_IN_POLICY.pair, now),
    waitFrom(counted("address"), SIGN_IN_POLICY.address, now),
    // The owner's own known connection is not slowed by what others try against the same e-mail.
    row?.known ? 0 : waitFrom(counted("email"), SIGN_IN_POLICY.email, now),
  ];
  const wait = Math.max(...waits);
  return ip === UNKNOWN_ADDRESS ? Math.min(wait, SIGN_IN_POLICY.email.maxDelayMs) : wait;
}

function waitFrom(counted: Counted, rule: GrowingDelay, now: Date): number {
  if (!counted.last) return 0;
  return Math.max(0, counted.last + growingDelayMs(counted.n, rule) - now.getTime());
}

/** "Try again in …" words for a wait, rounded up: "30 seconds", "2 minutes". */
export function waitInWords(ms: number): string {
  const seconds = Math.max(1, Math.ceil(ms / SECOND));
  if (seconds < 60) return seconds === 1 ? "1 second" : `${seconds} seconds`;
  const minutes = Math.ceil(seconds / 60);
  return minutes === 1 ? "1 minute" : `${minutes} minutes`;
}
