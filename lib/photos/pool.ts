import "server-only";
import { existsSync } from "node:fs";
import { availableParallelism } from "node:os";
import path from "node:path";
import { Piscina } from "piscina";
// sharp's advice for worker threads: load it in the main thread as well, so that its shared
// libraries stay loaded while the pool's threads come and go.
import sharp from "sharp";
import { AppError } from "@/lib/errors";
import { photoErrorCodes } from "./contract";
import { countAtGate, heldAtGate, newHoldGate, openGate, type HoldGate } from "./pool-hold";
import type { Judgement, PhotoTask } from "./pool-task";

// Photos are inspected, decoded and scaled on a small pool of worker threads (piscina), never on
// the event loop that answers requests: one 12 MP HEIC keeps a thread busy for 0.4–2 s.

/**
 * Threads per app process: the cores but one, which is left for answering requests, and at most
 * two, because a HEIC decode needs about 300 MB more at its peak and scripts/serve.mjs runs one
 * app process per core, each with its own pool.
 */
export const PHOTO_THREADS = Math.max(1, Math.min(2, availableParallelism() - 1));
/** Completions that may wait for a thread. Past threads + queue, completion answers 503 busy. */
export const PHOTO_QUEUE = 4 * PHOTO_THREADS;
export const PHOTO_SLOTS = PHOTO_THREADS + PHOTO_QUEUE;
/** What a busy answer asks the phone to wait (its outbox retries 5xx with backoff anyway). */
export const PHOTO_BUSY_RETRY_SECONDS = 15;
/**
 * An idle thread ends after this, handing back the memory its last decode grew (a new thread
 * compiles libheif-js again on its first HEIC: about 2 s of CPU).
 */
const IDLE_THREAD_MS = 5 * 60_000;
/**
 * The pool's threads run at a lower CPU priority (nice(2), per thread on Linux, through piscina's
 * optional @napi-rs/nice): on a busy machine a photo waits a little longer, a sync batch does not.
 */
const NICE_INCREMENT = 10;

/**
 * sharp's resizing and encoding run on libuv's threads, which the pool's lower priority does not
 * reach; one libvips thread per image (instead of one per core) keeps a 12 MP photo from taking
 * every core at once while sync batches wait. The setting is libvips's, for the whole process.
 */
sharp.concurrency(1);

export const PHOTO_BUSY = photoErrorCodes.busy;

/** Every slot is taken: nothing was read or written, and the phone sends the photo again later. */
export class PhotoPoolBusy extends AppError {
  readonly retryAfterSeconds = PHOTO_BUSY_RETRY_SECONDS;
  constructor() {
    super(503, PHOTO_BUSY, "The server is busy with other photos; this one will be sent again shortly.");
    this.name = "PhotoPoolBusy";
  }
}

type PoolState = { pool?: Piscina<PhotoTask, Judgement>; slotsInUse: number; hold?: HoldGate };
// On globalThis, like the database client, so that dev reloads reuse one pool.
const globalForPool = globalThis as unknown as { turnstonePhotoPool?: PoolState };
const state: PoolState = (globalForPool.turnstonePhotoPool ??= { slotsInUse: 0 });

/**
 * Resolved from the working directory at run time (the app, its scripts and the tests all run
 * from the checkout): a path relative to this module would point into Next's bundle instead.
 */
function entryFile(): string {
  const file = path.join(process.cwd(), "lib", "photos", "pool-entry.mjs");
  if (!existsSync(file)) throw new Error(`the photo pool's entry ${file} is missing: run the app from the checkout's folder`);
  return file;
}

function pool(): Piscina<PhotoTask, Judgement> {
  state.pool ??= new Piscina<PhotoTask, Judgement>({
    filename: entryFile(),
    minThreads: 0,
    maxThreads: PHOTO_THREADS,
    maxQueue: PHOTO_QUEUE,
    idleTimeout: IDLE_THREAD_MS,
    niceIncrement: NICE_INCREMENT,
    // The photo modules import "server-only", which resolves to its empty module under the
    // react-server condition, as it does in Next's server bundle.
    execArgv: ["--conditions=react-server"],
  });
  return state.pool;
}

/** A view that owns its whole ArrayBuffer can move to the thread; any other is copied once first. */
function transferable(bytes: Uint8Array): Uint8Array {
  const whole = bytes.byteOffset === 0 && bytes.byteLength === bytes.buffer.byteLength && bytes.buffer instanceof ArrayBuffer;
  return whole ? bytes : bytes.slice();
}

export type PhotoSlot = {
  /** Judges the bytes on a pool thread; they are moved there, so the caller's view is emptied. */
  judge(bytes: Uint8Array): Promise<Judgement>;
  release(): void;
};

/**
 * Takes one of the pool's slots before the upload is read, so that neither the bytes read nor
 * the tasks queued can pile up past PHOTO_SLOTS; throws PhotoPoolBusy when none is free.
 * Release it in a finally.
 */
export function reservePhotoSlot(): PhotoSlot {
  if (state.slotsInUse >= PHOTO_SLOTS) throw new PhotoPoolBusy();
  state.slotsInUse++;
  let released = false;
  return {
    judge(bytes) {
      const moved = transferable(bytes);
      return pool().run({ bytes: moved, ...(state.hold ? { hold: state.hold } : {}) }, { transferList: [moved.buffer as ArrayBuffer] });
    },
    release() {
      if (released) return;
      released = true;
      state.slotsInUse--;
    },
  };
}

export function photoSlotsInUse(): number {
  return state.slotsInUse;
}

/** Ends the pool's threads (tasks still running are rejected); the next photo starts a new pool. */
export async function closePhotoPool(): Promise<void> {
  const running = state.pool;
  state.pool = undefined;
  await running?.destroy();
}

/**
 * Test seam: tasks started from now on wait in their thread until release(). held(n) resolves
 * once n of them are waiting, so a test can look at the database while the pool is working;
 * started() counts the tasks that reached the gate.
 */
export function holdPhotoTasks(): { held(count: number): Promise<void>; started(): number; release(): void } {
  const gate = newHoldGate();
  state.hold = gate;
  return {
    held: (count) => heldAtGate(gate, count),
    started: () => countAtGate(gate),
    release() {
      if (state.hold === gate) state.hold = undefined;
      openGate(gate);
    },
  };
}
