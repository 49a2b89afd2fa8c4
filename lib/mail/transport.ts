import nodemailer, { type Transporter } from "nodemailer";
import { env } from "@/lib/env";

const globalForMail = globalThis as unknown as { turnstoneMail?: Transporter };

export function mailTransport(): Transporter {
  const e = env();
  globalForMail.turnstoneMail ??= nodemailer.createTransport({
    host: e.SMTP_HOST,
    port: e.SMTP_PORT,
    secure: e.SMTP_SECURE,
    // The local fake speaks plain SMTP; real servers set SMTP_SECURE or offer STARTTLS.
    ignoreTLS: !e.SMTP_SECURE && e.SMTP_HOST === "127.0.0.1",
    auth: e.SMTP_USER ? { user: e.SMTP_USER, pass: e.SMTP_PASSWORD ?? "" } : undefined,
    connectionTimeout: 5000,
    greetingTimeout: 5000,
  });
  return globalForMail.turnstoneMail;
}
