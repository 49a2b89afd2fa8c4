import "server-only";
import { and, desc, eq, gt, lt, sql } from "drizzle-orm";
import { db } from "@/db/client";
import { invitationTokenFailures } from "@/db/schema";
import { tooManyRequests, type AppError } from "@/lib/errors";
import { addressKey } from "@/lib/http/client-address";
import { waitInWords } from "./rate-limit";

// The invitation limit: an address may try at most 10 invitation tokens that match no open
// invitation in 15 minutes (opening the page and accepting both count); then it waits until the
// oldest of those is 15 minutes old. Tokens are 256 random bits, so this only stops a machine
// from hammering the lookup. A token that works costs nothing. Each check is recorded as a failure
// before the lookup, under a lock per address, so parallel guesses cannot slip past the count.

export const INVITATION_POLICY = { windowMs: 15 * 60_000, maxFailures: 10 } as const;

// Advisory lock class (first key of pg_advisory_xact_lock(int, int)), beside rate-limit.ts's.
const LOCK_INVITATION_ADDRESS = 0x5349_0003;

/** The limit's answer as the error pages and actions show it. */
export function tooManyTokenTries(retryAfterMs: number): AppError {
  return tooManyRequests(`Too many invitation links were tried from your connection. Try again in ${waitInWords(retryAfterMs)}.`);
}

/**
 * Runs `lookup` (a token check) if this address may try another token now, else throws a 429
 * AppError. `lookup` answers whether the token matched; a mismatch counts against the address.
 */
export async function limitTokenCheck<T>(clientAddress: string, lookup: () => Promise<T | null>, now: Date = new Date()): Promise<T | null> {
  const ip = addressKey(clientAddress);
  const failureId = await db().transaction(async (tx) => {
    await tx.execute(sql`select pg_advisory_xact_lock(${LOCK_INVITATION_ADDRESS}, hashtext(${ip}))`);
    const recent = await tx
      .select({ at: invitationTokenFailures.attemptedAt })
      .from(invitationTokenFailures)
      .where(and(eq(invitationTokenFailures.ipKey, ip), gt(invitationTokenFailures.attemptedAt, new Date(now.getTime() - INVITATION_POLICY.windowMs))))
      .orderBy(desc(invitationTokenFailures.attemptedAt))
      .limit(INVITATION_POLICY.maxFailures);
    const oldestCounted = recent[INVITATION_POLICY.maxFailures - 1];
    if (oldestCounted) throw tooManyTokenTries(oldestCounted.at.getTime() + INVITATION_POLICY.windowMs - now.getTime());
    const [row] = await tx.insert(invitationTokenFailures).values({ ipKey: ip, attemptedAt: now }).returning({ id: invitationTokenFailures.id });
    return row!.id;
  });
  const found = await lookup();
  if (found !== null) await db().delete(invitationTokenFailures).where(eq(invitationTokenFailures.id, failureId));
  await db().delete(invitationTokenFailures).where(lt(invitationTokenFailures.attemptedAt, new Date(now.getTime() - INVITATION_POLICY.windowMs)));
  return found;
}
