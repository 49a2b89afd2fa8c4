import { eq } from "drizzle-orm";
import { beforeAll, describe, expect, it } from "vitest";
import { db } from "@/db/client";
import { emailOutbox } from "@/db/schema";
import { healthReport } from "@/lib/health";
import { sendQueuedMail } from "@/workers/mail-sender";
import { resetToDemo } from "./support/db";

const inboxUrl = `http://127.0.0.1:${process.env.TURNSTONE_MAIL_API_PORT ?? 54332}/messages`;
type Received = { to: string[]; subject: string; text: string };

describe("the local services", () => {
  beforeAll(async () => {
    await resetToDemo();
  });

  it("health reports the database, object store and mail server as ok", async () => {
    const report = await healthReport();
    expect(report.status).toBe("ok");
    expect(report.checks.database.status).toBe("ok");
    expect(report.checks.objectStore.status).toBe("ok");
    expect(report.checks.mail.status).toBe("ok");
  });

  it("the worker sends a queued e-mail through SMTP and marks it sent", async () => {
    const to = `outbox-${Date.now()}@example.org`;
    await db().insert(emailOutbox).values({ toAddress: to, subject: "Outbox check", textBody: "Hello from the outbox test", purpose: "test" });
    const result = await sendQueuedMail(db());
    expect(result.sent).toBeGreaterThanOrEqual(1);
    const [row] = await db().select().from(emailOutbox).where(eq(emailOutbox.toAddress, to));
    expect(row!.status).toBe("sent");
    // The SMTP fake parses what it received with mailparser and lists it as JSON.
    const received = (await (await fetch(inboxUrl)).json()) as Received[];
    const mine = received.find((m) => m.subject === "Outbox check" && m.to.includes(to));
    expect(mine?.text.trim()).toBe("Hello from the outbox test");
  });
});
