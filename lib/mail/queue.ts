import "server-only";
import { emailOutbox } from "@/db/schema";
import type { Database, Transaction } from "@/db/client";

export type OutgoingEmail = { to: string; subject: string; text: string; html?: string; purpose: string; newsletterId?: string };

/** Queues e-mails in the caller's transaction; the worker sends them and retries failures. */
export async function enqueueEmails(tx: Database | Transaction, emails: OutgoingEmail[]): Promise<void> {
  if (emails.length === 0) return;
  await tx.insert(emailOutbox).values(
    emails.map((e) => ({ toAddress: e.to, subject: e.subject, textBody: e.text, htmlBody: e.html, purpose: e.purpose, newsletterId: e.newsletterId })),
  );
}
