import "server-only";
import { and, count, eq, gt, lt } from "drizzle-orm";
import { db } from "@/db/client";
import { signInAttempts } from "@/db/schema";

export const SIGN_IN_WINDOW_MINUTES = 15;
const MAX_FAILURES_PER_EMAIL = 5;
const MAX_FAILURES_PER_ADDRESS = 30;

function windowStart(): Date {
  return new Date(Date.now() - SIGN_IN_WINDOW_MINUTES * 60_000);
}

export async function isSignInBlocked(emailKey: string, ipKey: string): Promise<boolean> {
  const since = windowStart();
  const [byEmail] = await db()
    .select({ n: count() })
    .from(signInAttempts)
    .where(and(eq(signInAttempts.emailKey, emailKey), eq(signInAttempts.succeeded, false), gt(signInAttempts.attemptedAt, since)));
  const [byAddress] = await db()
    .select({ n: count() })
    .from(signInAttempts)
    .where(and(eq(signInAttempts.ipKey, ipKey), eq(signInAttempts.succeeded, false), gt(signInAttempts.attemptedAt, since)));
  return (byEmail?.n ?? 0) >= MAX_FAILURES_PER_EMAIL || (byAddress?.n ?? 0) >= MAX_FAILURES_PER_ADDRESS;
}

export async function recordSignInAttempt(emailKey: string, ipKey: string, succeeded: boolean): Promise<void> {
  await db().insert(signInAttempts).values({ emailKey, ipKey, succeeded });
  // Keep the table small: attempts older than a day are of no use to the limiter.
  await db().delete(signInAttempts).where(lt(signInAttempts.attemptedAt, new Date(Date.now() - 86_400_000)));
}
