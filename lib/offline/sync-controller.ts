import type { OutboxRun } from "./outbox";
import { hasWorkToSend } from "./pending-work";
import { sendSafetyAcceptance } from "./safety";

// Runs the outbox when the app starts, when the phone comes back online, when the app returns
// to the foreground, and after failures with exponential backoff (5 s doubling to 5 min).
export const BASE_DELAY_MS = 5_000;
export const MAX_DELAY_MS = 300_000;

export type SyncState = { running: boolean; last: OutboxRun | null; nextRetryAt: number | null };
type Listener = (state: SyncState) => void;

type Events = Pick<EventTarget, "addEventListener" | "removeEventListener">;

/** The parts of the browser the controller listens to (tests pass stand-ins). */
export type SyncEnvironment = {
  window: Events;
  document: Events & { visibilityState: DocumentVisibilityState };
  navigator: { onLine: boolean };
};

/** The wait before the next try after `failures` failed passes in a row. */
export function retryDelay(failures: number): number {
  return Math.min(MAX_DELAY_MS, BASE_DELAY_MS * 2 ** Math.max(0, failures - 1));
}

export type SyncController = {
  /** Starts listening for the signed-in volunteer and runs a pass; returns `stop`. */
  start(userId: string, env?: SyncEnvironment): () => void;
  stop(): void;
  /** Starts a pass now (or right after the current one). */
  syncNow(): Promise<void>;
  onState(listener: Listener): () => void;
};

export function createSyncController(runPass: (userId: string) => Promise<OutboxRun>): SyncController {
  let userId: string | null = null;
  let detach: (() => void) | null = null;
  let running = false;
  let again = false;
  let failures = 0;
  let timer: ReturnType<typeof setTimeout> | null = null;
  let last: OutboxRun | null = null;
  let nextRetryAt: number | null = null;
  const listeners = new Set<Listener>();

  const emit = () => {
    for (const l of listeners) l({ running, last, nextRetryAt });
  };
  const cancelRetry = () => {
    if (timer) clearTimeout(timer);
    timer = null;
    nextRetryAt = null;
  };

  async function syncNow(): Promise<void> {
    if (!userId) return;
    if (running) {
      again = true;
      return;
    }
    cancelRetry();
    running = true;
    emit();
    let failed: boolean;
    try {
      last = await runPass(userId);
      // Signed out: retrying cannot help until the volunteer signs in (which starts a pass).
      failed = last.retryLater && !last.signedOut;
    } catch {
      failed = true;
    } finally {
      running = false;
    }
    failures = failed ? failures + 1 : 0;
    if (failed && detach) {
      const delay = retryDelay(failures);
      nextRetryAt = Date.now() + delay;
      timer = setTimeout(() => void syncNow(), delay);
    }
    emit();
    if (again) {
      again = false;
      void syncNow();
    }
  }

  function stop() {
    detach?.();
    detach = null;
    userId = null;
    cancelRetry();
  }

  function start(id: string, env: SyncEnvironment = { window, document, navigator }) {
    userId = id;
    if (!detach) {
      const online = () => {
        failures = 0;
        void syncNow();
      };
      const visible = () => {
        if (env.document.visibilityState === "visible" && env.navigator.onLine) void syncNow();
      };
      env.window.addEventListener("online", online);
      env.document.addEventListener("visibilitychange", visible);
      detach = () => {
        env.window.removeEventListener("online", online);
        env.document.removeEventListener("visibilitychange", visible);
      };
    }
    void syncNow();
    return stop;
  }

  function onState(listener: Listener) {
    listeners.add(listener);
    listener({ running, last, nextRetryAt });
    return () => void listeners.delete(listener);
  }

  return { start, stop, syncNow, onState };
}

const nothingSent: OutboxRun = { sent: 0, needsAttention: 0, keptOnServer: 0, offline: false, signedOut: false, retryLater: false };

/**
 * One pass for the signed-in volunteer: their safety acknowledgement if it waits on the phone,
 * then their records. The records' sending code loads only when there is something to send (the
 * service worker has it precached for offline use); a failed load counts as a failed pass and is
 * retried with backoff.
 */
export async function fieldPass(userId: string, fetcher: typeof fetch = fetch): Promise<OutboxRun> {
  const safety = await sendSafetyAcceptance(userId, fetcher);
  const run = (await hasWorkToSend(userId)) ? await (await import("./outbox")).runOutbox(userId, fetcher) : nothingSent;
  return safety === "retry" ? { ...run, retryLater: true } : run;
}

const controller = createSyncController((userId) => fieldPass(userId));

export const startSyncController = controller.start;
export const syncNow = controller.syncNow;
export const onSyncState = controller.onState;
