import { and, eq, inArray, lte, sql } from "drizzle-orm";
import type { Database } from "@/db/client";
import { emailOutbox } from "@/db/schema";
import { env } from "@/lib/env";
import { mailTransport } from "@/lib/mail/transport";

const BATCH = 20;
const MAX_ATTEMPTS = 8;
/**
 * A claim lasts this long: a row still "sending" after it was claimed by a worker that died (or
 * lost its database mid-pass), and the next pass claims it again. SMTP conversations time out
 * within seconds (lib/mail/transport.ts), so a live worker is long done by then.
 */
const CLAIM_LEASE_MS = 10 * 60_000;
/** After a stop is asked for, a conversation with the SMTP server already under way may finish for this long. */
const IN_FLIGHT_GRACE_MS = 2000;

export type SendResult = { sent: number; failed: number; released: number };

/**
 * Sends due e-mails from the queue. Rows are claimed with SKIP LOCKED so several workers can run
 * side by side; a failed send is retried with exponential backoff, then marked failed. When
 * `signal` aborts, no new send starts, and the claimed rows not sent are handed back (a send cut
 * off mid-conversation may then go twice: delivery is at least once, never lost).
 */
export async function sendQueuedMail(database: Database, options: { signal?: AbortSignal } = {}): Promise<SendResult> {
  const { signal } = options;
  const claimed = await database.transaction(async (tx) => {
    const due = await tx
      .select({ id: emailOutbox.id })
      .from(emailOutbox)
      .where(and(inArray(emailOutbox.status, ["queued", "sending"]), lte(emailOutbox.sendAfter, new Date())))
      .orderBy(emailOutbox.sendAfter)
      .limit(BATCH)
      .for("update", { skipLocked: true });
    if (due.length === 0) return [];
    return tx
      .update(emailOutbox)
      .set({ status: "sending", attempts: sql`${emailOutbox.attempts} + 1`, sendAfter: new Date(Date.now() + CLAIM_LEASE_MS) })
      .where(inArray(emailOutbox.id, due.map((d) => d.id)))
      .returning();
  });

  let sent = 0;
  let failed = 0;
  const untried = new Set(claimed.map((m) => m.id));
  let cutOff: string | undefined;
  for (const mail of claimed) {
    if (signal?.aborted) break;
    untried.delete(mail.id);
    const outcome = await unlessStopped(sendOne(database, mail), signal);
    if (outcome === "stopped") {
      cutOff = mail.id;
      break;
    }
    if (outcome) sent++;
    else failed++;
  }
  const released = await release(database, [...untried], cutOff);
  return { sent, failed, released };
}

type Claimed = typeof emailOutbox.$inferSelect;

async function sendOne(database: Database, mail: Claimed): Promise<boolean> {
  try {
    await mailTransport().sendMail({ from: env().MAIL_FROM, to: mail.toAddress, subject: mail.subject, text: mail.textBody, html: mail.htmlBody ?? undefined });
    await database.update(emailOutbox).set({ status: "sent", sentAt: new Date(), lastError: null }).where(eq(emailOutbox.id, mail.id));
    return true;
  } catch (error) {
    const giveUp = mail.attempts >= MAX_ATTEMPTS;
    await database
      .update(emailOutbox)
      .set({
        status: giveUp ? "failed" : "queued",
        lastError: error instanceof Error ? error.message.slice(0, 500) : "send failed",
        sendAfter: new Date(Date.now() + 2 ** mail.attempts * 60_000),
      })
      .where(eq(emailOutbox.id, mail.id));
    return false;
  }
}

/** The send's outcome, or "stopped" when a stop was asked for and the grace ran out first. */
async function unlessStopped<T>(work: Promise<T>, signal: AbortSignal | undefined): Promise<T | "stopped"> {
  if (!signal) return work;
  // A send left behind may still fail later (its database closed): nobody waits for it then.
  work.catch(() => undefined);
  let timer: NodeJS.Timeout | undefined;
  let startGrace = () => {};
  const stopped = new Promise<"stopped">((resolve) => {
    startGrace = () => {
      timer = setTimeout(() => resolve("stopped"), IN_FLIGHT_GRACE_MS);
    };
  });
  if (signal.aborted) startGrace();
  else signal.addEventListener("abort", startGrace, { once: true });
  try {
    return await Promise.race([work, stopped]);
  } finally {
    clearTimeout(timer);
    signal.removeEventListener("abort", startGrace);
  }
}

/**
 * Hands claimed rows back to the queue, due at once: those never tried get their attempt back;
 * the one cut off mid-send keeps it. Rows a send already settled are left as they are.
 */
async function release(database: Database, untried: string[], cutOff: string | undefined): Promise<number> {
  let released = 0;
  const handBack = async (ids: string[], refund: boolean) => {
    if (ids.length === 0) return;
    const rows = await database
      .update(emailOutbox)
      .set({ status: "queued", sendAfter: new Date(), ...(refund ? { attempts: sql`greatest(${emailOutbox.attempts} - 1, 0)` } : {}) })
      .where(and(inArray(emailOutbox.id, ids), eq(emailOutbox.status, "sending")))
      .returning({ id: emailOutbox.id });
    released += rows.length;
  };
  await handBack(untried, true);
  if (cutOff) await handBack([cutOff], false);
  return released;
}
