import { and, eq, inArray, lte, sql } from "drizzle-orm";
import type { Database } from "@/db/client";
import { emailOutbox } from "@/db/schema";
import { env } from "@/lib/env";
import { mailTransport } from "@/lib/mail/transport";

const BATCH = 20;
const MAX_ATTEMPTS = 8;

/**
 * Sends due e-mails from the outbox. Rows are claimed with SKIP LOCKED so several workers can
 * run side by side; a failed send is retried with exponential backoff, then marked failed.
 */
export async function sendQueuedMail(database: Database): Promise<{ sent: number; failed: number }> {
  const claimed = await database.transaction(async (tx) => {
    const due = await tx
      .select({ id: emailOutbox.id })
      .from(emailOutbox)
      .where(and(eq(emailOutbox.status, "queued"), lte(emailOutbox.sendAfter, new Date())))
      .orderBy(emailOutbox.sendAfter)
      .limit(BATCH)
      .for("update", { skipLocked: true });
    if (due.length === 0) return [];
    return tx
      .update(emailOutbox)
      .set({ status: "sending", attempts: sql`${emailOutbox.attempts} + 1` })
      .where(inArray(emailOutbox.id, due.map((d) => d.id)))
      .returning();
  });

  let sent = 0;
  let failed = 0;
  for (const mail of claimed) {
    try {
      await mailTransport().sendMail({ from: env().MAIL_FROM, to: mail.toAddress, subject: mail.subject, text: mail.textBody, html: mail.htmlBody ?? undefined });
      await database.update(emailOutbox).set({ status: "sent", sentAt: new Date(), lastError: null }).where(eq(emailOutbox.id, mail.id));
      sent++;
    } catch (error) {
      failed++;
      const giveUp = mail.attempts >= MAX_ATTEMPTS;
      await database
        .update(emailOutbox)
        .set({
          status: giveUp ? "failed" : "queued",
          lastError: error instanceof Error ? error.message.slice(0, 500) : "send failed",
          sendAfter: new Date(Date.now() + 2 ** mail.attempts * 60_000),
        })
        .where(eq(emailOutbox.id, mail.id));
    }
  }
  return { sent, failed };
}
