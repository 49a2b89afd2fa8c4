import { afterEach, beforeEach, describe, expect, it, vi } from "vitest";
import type { OutboxRun } from "@/lib/offline/outbox";
import { BASE_DELAY_MS, MAX_DELAY_MS, createSyncController, retryDelay, type SyncController, type SyncEnvironment } from "@/lib/offline/sync-controller";

const userId = "3d5e7f90-1a2b-4c3d-8e4f-5a6b7c8d9e0f";
const ok: OutboxRun = { sent: 1, needsAttention: 0, keptOnServer: 0, offline: false, signedOut: false, retryLater: false };
const noSignal: OutboxRun = { ...ok, sent: 0, offline: true, retryLater: true };
const serverFault: OutboxRun = { ...ok, sent: 0, retryLater: true };

/** A browser stand-in: events can be fired, visibility and connectivity set. */
function fakeBrowser() {
  const window = new EventTarget();
  const document = Object.assign(new EventTarget(), { visibilityState: "hidden" as DocumentVisibilityState });
  const env: SyncEnvironment = { window, document, navigator: { onLine: true } };
  return {
    env,
    goOnline: () => window.dispatchEvent(new Event("online")),
    show: () => {
      document.visibilityState = "visible";
      document.dispatchEvent(new Event("visibilitychange"));
    },
    hide: () => {
      document.visibilityState = "hidden";
      document.dispatchEvent(new Event("visibilitychange"));
    },
  };
}

/** A fake outbox: answers each pass with the next scripted run (the last one repeats). */
function fakeOutbox(...script: (OutboxRun | Error)[]) {
  const calls: string[] = [];
  const run = vi.fn(async (id: string) => {
    calls.push(id);
    const next = script.length > 1 ? script.shift()! : script[0]!;
    if (next instanceof Error) throw next;
    return next;
  });
  return { run, calls };
}

// Lets the pass's promise settle (fake timers do not run microtasks by themselves).
const settle = () => vi.advanceTimersByTimeAsync(0);

describe("the sync controller", () => {
  let controller: SyncController;
  beforeEach(() => vi.useFakeTimers());
  afterEach(() => {
    controller?.stop();
    vi.useRealTimers();
  });

  it("backs off from 5 s, doubling, to at most 5 min (as DEVELOPERS.md describes)", () => {
    expect([1, 2, 3, 4, 5, 6, 7, 8, 20].map(retryDelay)).toEqual([5_000, 10_000, 20_000, 40_000, 80_000, 160_000, 300_000, 300_000, 300_000]);
    expect(BASE_DELAY_MS).toBe(5_000);
    expect(MAX_DELAY_MS).toBe(300_000);
  });

  it("runs a pass for the signed-in volunteer when the app starts", async () => {
    const outbox = fakeOutbox(ok);
    controller = createSyncController(outbox.run);
    controller.start(userId, fakeBrowser().env);
    await settle();
    expect(outbox.calls).toEqual([userId]);
  });

  it("runs a pass when the phone comes back online", async () => {
    const outbox = fakeOutbox(ok);
    const browser = fakeBrowser();
    controller = createSyncController(outbox.run);
    controller.start(userId, browser.env);
    await settle();
    browser.goOnline();
    await settle();
    expect(outbox.run).toHaveBeenCalledTimes(2);
  });

  it("runs a pass when the app returns to the foreground with a signal, not when it goes to the background", async () => {
    const outbox = fakeOutbox(ok);
    const browser = fakeBrowser();
    controller = createSyncController(outbox.run);
    controller.start(userId, browser.env);
    await settle();
    browser.hide();
    await settle();
    expect(outbox.run).toHaveBeenCalledTimes(1);
    browser.show();
    await settle();
    expect(outbox.run).toHaveBeenCalledTimes(2);
    browser.env.navigator.onLine = false;
    browser.hide();
    browser.show();
    await settle();
    expect(outbox.run).toHaveBeenCalledTimes(2);
  });

  it("retries after failures at 5 s, 10 s, 20 s ... up to 5 min, and stops retrying after a good pass", async () => {
    const outbox = fakeOutbox(noSignal, serverFault, noSignal, noSignal, noSignal, noSignal, noSignal, noSignal, ok);
    controller = createSyncController(outbox.run);
    controller.start(userId, fakeBrowser().env);
    await settle();
    const waits = [5_000, 10_000, 20_000, 40_000, 80_000, 160_000, 300_000, 300_000];
    for (const [i, wait] of waits.entries()) {
      await vi.advanceTimersByTimeAsync(wait - 1);
      expect(outbox.run).toHaveBeenCalledTimes(i + 1);
      await vi.advanceTimersByTimeAsync(1);
      expect(outbox.run).toHaveBeenCalledTimes(i + 2);
    }
    // The ninth pass succeeded: nothing more is scheduled.
    await vi.advanceTimersByTimeAsync(60 * 60_000);
    expect(outbox.run).toHaveBeenCalledTimes(9);
  });

  it("also retries when a pass throws (the phone's store failed, say)", async () => {
    const outbox = fakeOutbox(new Error("IndexedDB went away"), ok);
    controller = createSyncController(outbox.run);
    controller.start(userId, fakeBrowser().env);
    await settle();
    await vi.advanceTimersByTimeAsync(BASE_DELAY_MS);
    expect(outbox.run).toHaveBeenCalledTimes(2);
  });

  it("does not retry on a timer when signed out: signing in again starts a pass", async () => {
    const outbox = fakeOutbox({ ...noSignal, signedOut: true });
    controller = createSyncController(outbox.run);
    controller.start(userId, fakeBrowser().env);
    await settle();
    await vi.advanceTimersByTimeAsync(MAX_DELAY_MS * 2);
    expect(outbox.run).toHaveBeenCalledTimes(1);
  });

  it("coming back online cuts a long wait short and starts the backoff again from 5 s", async () => {
    const outbox = fakeOutbox(noSignal);
    const browser = fakeBrowser();
    controller = createSyncController(outbox.run);
    const states: (number | null)[] = [];
    controller.onState((s) => states.push(s.nextRetryAt));
    controller.start(userId, browser.env);
    await settle();
    await vi.advanceTimersByTimeAsync(5_000 + 10_000 + 20_000); // four failed passes: next wait 40 s
    expect(outbox.run).toHaveBeenCalledTimes(4);
    expect(states.at(-1)).toBe(Date.now() + 40_000);
    browser.goOnline();
    await settle();
    expect(outbox.run).toHaveBeenCalledTimes(5);
    await vi.advanceTimersByTimeAsync(5_000);
    expect(outbox.run).toHaveBeenCalledTimes(6);
  });

  it("never runs two passes at once: a request during a pass runs one more pass after it", async () => {
    let finish!: (run: OutboxRun) => void;
    const run = vi.fn(() => new Promise<OutboxRun>((resolve) => (finish = resolve)));
    controller = createSyncController(run);
    controller.start(userId, fakeBrowser().env);
    await settle();
    void controller.syncNow();
    void controller.syncNow();
    expect(run).toHaveBeenCalledTimes(1);
    finish(ok);
    await settle();
    expect(run).toHaveBeenCalledTimes(2);
    finish(ok);
    await settle();
    expect(run).toHaveBeenCalledTimes(2);
  });

  it("after stop, listens to nothing and schedules nothing", async () => {
    const outbox = fakeOutbox(noSignal);
    const browser = fakeBrowser();
    controller = createSyncController(outbox.run);
    controller.start(userId, browser.env)();
    await settle();
    browser.goOnline();
    browser.show();
    await vi.advanceTimersByTimeAsync(MAX_DELAY_MS * 2);
    expect(outbox.run).toHaveBeenCalledTimes(1);
  });
});
