import { runOutbox, type OutboxRun } from "./outbox";

// Runs the outbox when the app starts, when the phone comes back online, when the app returns
// to the foreground, and after failures with exponential backoff (5 s doubling to 5 min).
const BASE_DELAY_MS = 5_000;
const MAX_DELAY_MS = 300_000;

type Listener = (state: { running: boolean; last: OutboxRun | null; nextRetryAt: number | null }) => void;

let running = false;
let again = false;
let failures = 0;
let timer: ReturnType<typeof setTimeout> | null = null;
let last: OutboxRun | null = null;
let nextRetryAt: number | null = null;
const listeners = new Set<Listener>();

function emit() {
  for (const l of listeners) l({ running, last, nextRetryAt });
}

export function onSyncState(listener: Listener): () => void {
  listeners.add(listener);
  listener({ running, last, nextRetryAt });
  return () => listeners.delete(listener);
}

/** Starts a pass now (or right after the current one). */
export async function syncNow(): Promise<void> {
  if (running) {
    again = true;
    return;
  }
  if (timer) clearTimeout(timer);
  timer = null;
  nextRetryAt = null;
  running = true;
  emit();
  try {
    last = await runOutbox();
    failures = last.offline || last.signedOut ? failures + 1 : 0;
  } catch {
    failures += 1;
  } finally {
    running = false;
  }
  if (failures > 0 && !last?.signedOut) {
    const delay = Math.min(MAX_DELAY_MS, BASE_DELAY_MS * 2 ** (failures - 1));
    nextRetryAt = Date.now() + delay;
    timer = setTimeout(() => void syncNow(), delay);
  }
  emit();
  if (again) {
    again = false;
    void syncNow();
  }
}

let started = false;

export function startSyncController(): void {
  if (started || typeof window === "undefined") return;
  started = true;
  window.addEventListener("online", () => {
    failures = 0;
    void syncNow();
  });
  document.addEventListener("visibilitychange", () => {
    if (document.visibilityState === "visible" && navigator.onLine) void syncNow();
  });
  void syncNow();
}
