import { readFileSync, readdirSync, statSync } from "node:fs";
import path from "node:path";
import { simpleParser } from "mailparser";
import { eq } from "drizzle-orm";
import { beforeAll, describe, expect, it } from "vitest";
import { db } from "@/db/client";
import { emailOutbox } from "@/db/schema";
import { healthReport } from "@/lib/health";
import { flushOutbox } from "@/workers/outbox";
import { resetToDemo } from "./support/db";

const mailDir = path.resolve(import.meta.dirname, "..", "..", ".data", "mail");

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
    const started = Date.now() - 1000;
    const result = await flushOutbox(db());
    expect(result.sent).toBeGreaterThanOrEqual(1);
    const [row] = await db().select().from(emailOutbox).where(eq(emailOutbox.toAddress, to));
    expect(row!.status).toBe("sent");
    // The SMTP fake keeps each message as an .eml file: parse them with mailparser.
    const recent = readdirSync(mailDir).filter((f) => statSync(path.join(mailDir, f)).mtimeMs >= started);
    const parsed = await Promise.all(recent.map((f) => simpleParser(readFileSync(path.join(mailDir, f)))));
    const mine = parsed.find((m) => m.subject === "Outbox check" && JSON.stringify(m.to).includes(to));
    expect(mine?.text?.trim()).toBe("Hello from the outbox test");
  });
});
