// Background worker started beside the app by `npm start`: sends queued e-mail. Later jobs
// (nightly comparisons, photo processing retries) are added here.
import "../scripts/load-env";
import { closeDb, db } from "@/db/client";
import { sendQueuedMail } from "./mail-sender";

const INTERVAL_MS = Number(process.env.WORKER_INTERVAL_MS ?? 5000);
let stopping = false;

async function loop() {
  while (!stopping) {
    try {
      const { sent, failed } = await sendQueuedMail(db());
      if (sent || failed) console.log(`[worker] outbox: ${sent} sent, ${failed} failed`);
    } catch (error) {
      console.error("[worker] outbox pass failed:", error instanceof Error ? error.message : error);
    }
    await new Promise((r) => setTimeout(r, INTERVAL_MS));
  }
  await closeDb();
}

for (const signal of ["SIGINT", "SIGTERM"] as const) {
  process.on(signal, () => {
    stopping = true;
  });
}

console.log("[worker] started");
void loop();
