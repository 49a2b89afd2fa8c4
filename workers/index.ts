// Background worker started beside the app by `npm start`: sends queued e-mail. Later jobs
// (nightly comparisons, photo processing retries) are added here.
import "../scripts/load-env";
import { setTimeout as sleep } from "node:timers/promises";
import { closeDb, db } from "@/db/client";
import { requireEnv } from "../scripts/require-env";
import { sendQueuedMail } from "./mail-sender";

const config = requireEnv();

// A stop (SIGTERM, SIGINT) ends the pause at once, lets a pass in flight hand back what it claimed
// for up to PASS_GRACE_MS, closes the pool for up to CLOSE_GRACE_MS and exits; whatever still
// hangs then (a database that never answers) cannot hold the process past STOP_DEADLINE_MS.
const PASS_GRACE_MS = 3000;
const CLOSE_GRACE_MS = 1000;
const STOP_DEADLINE_MS = 5000;

const stopping = new AbortController();
let pass: Promise<unknown> = Promise.resolve();

async function runPass() {
  try {
    const { sent, failed, released } = await sendQueuedMail(db(), { signal: stopping.signal });
    if (sent || failed) console.log(`[worker] mail queue: ${sent} sent, ${failed} failed`);
    if (released) console.log(`[worker] mail queue: ${released} handed back for the next worker`);
  } catch (error) {
    console.error("[worker] mail queue pass failed:", error instanceof Error ? error.message : error);
  }
}

async function loop() {
  while (!stopping.signal.aborted) {
    pass = runPass();
    await pass;
    await sleep(config.WORKER_INTERVAL_MS, undefined, { signal: stopping.signal }).catch(() => undefined);
  }
}

const within = (work: Promise<unknown>, ms: number) => Promise.race([work.catch(() => undefined), sleep(ms)]);

async function stop(signal: NodeJS.Signals) {
  if (stopping.signal.aborted) {
    console.error(`[worker] ${signal} again: exiting now`);
    process.exit(1);
  }
  console.log(`[worker] ${signal}: stopping`);
  stopping.abort();
  setTimeout(() => {
    console.error(`[worker] still busy after ${STOP_DEADLINE_MS} ms: exiting anyway`);
    process.exit(1);
  }, STOP_DEADLINE_MS).unref();
  await within(pass, PASS_GRACE_MS);
  await within(closeDb(), CLOSE_GRACE_MS);
  console.log("[worker] stopped");
  process.exit(0);
}

for (const signal of ["SIGINT", "SIGTERM"] as const) process.on(signal, (s) => void stop(s));

console.log("[worker] started");
void loop();
