import { eq } from "drizzle-orm";
import { beforeAll, describe, expect, it } from "vitest";
import { db } from "@/db/client";
import { emailOutbox } from "@/db/schema";
import { sendQueuedMail } from "@/workers/mail-sender";
import "./support/db";

// A worker that dies between claiming mail and sending it (killed, its machine lost) leaves rows
// marked "sending". A claim lasts ten minutes (workers/mail-sender.ts): after that the next pass
// claims the row again, so nothing waits for ever. A live claim is left to its worker.
describe("claims on queued mail", () => {
  beforeAll(async () => {
    await db().delete(emailOutbox);
  });

  it("a lapsed claim is sent by the next pass; a live one is not touched", async () => {
    const lapsed = `lapsed-${Date.now()}@example.org`;
    const live = `live-${Date.now()}@example.org`;
    await db().insert(emailOutbox).values([
      { toAddress: lapsed, subject: "Lapsed claim", textBody: "Hello", purpose: "test", status: "sending", attempts: 1, sendAfter: new Date(Date.now() - 60_000) },
      { toAddress: live, subject: "Live claim", textBody: "Hello", purpose: "test", status: "sending", attempts: 1, sendAfter: new Date(Date.now() + 9 * 60_000) },
    ]);
    const result = await sendQueuedMail(db());
    expect(result.sent).toBe(1);
    const [sent] = await db().select().from(emailOutbox).where(eq(emailOutbox.toAddress, lapsed));
    expect(sent!.status).toBe("sent");
    expect(sent!.attempts).toBe(2);
    const [untouched] = await db().select().from(emailOutbox).where(eq(emailOutbox.toAddress, live));
    expect(untouched!.status).toBe("sending");
    expect(untouched!.attempts).toBe(1);
  });
});
