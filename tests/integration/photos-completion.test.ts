import { eq } from "drizzle-orm";
import exifr from "exifr";
import sharp from "sharp";
import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";
import { db, sqlClient } from "@/db/client";
import { photos, visits } from "@/db/schema";
import type { Actor } from "@/lib/auth/guard";
import { completeUpload } from "@/lib/photos/complete";
import { decodeHeic } from "@/lib/photos/heic";
import { photoKeys } from "@/lib/photos/keys";
import { photoViewUrl } from "@/lib/photos/links";
import { PHOTO_BUSY, PHOTO_SLOTS, PHOTO_THREADS, closePhotoPool, holdPhotoTasks, photoSlotsInUse } from "@/lib/photos/pool";
import { PHOTO_REFUSED } from "@/lib/photos/refusal";
import { phone12mpHeic, phonePortraitHeic, textFile } from "../support/images";
import { resetToDemo } from "./support/db";
import { actorFor, keysUnder, objectExists, photoRow, uploadPhoto } from "./support/photo-uploads";

// Completing a photo under load: the decode must not stop this process answering others, nor
// hold a row lock or a pooled connection; completions of one photo that overlap must agree and
// leave one result; a flood is told to come back later; a crash leaves the photo to be retried.

// The route handler reads the session through Auth.js; here the test decides who is signed in.
const session = vi.hoisted(() => ({ userId: null as string | null }));
vi.mock("@/lib/auth/session", () => ({ sessionUserId: async () => session.userId }));
const { POST: completeRoute } = await import("@/app/(field)/api/field/photos/[id]/complete/route");

async function until(condition: () => boolean): Promise<void> {
  while (!condition()) await new Promise((resolve) => setTimeout(resolve, 10));
}

/** Milliseconds a warm libheif-js decode of the 12 MP fixture takes in this thread, on this machine now. */
async function decodeTimeHere(): Promise<number> {
  await decodeHeic(phone12mpHeic); // the first call also compiles the WebAssembly module
  const start = performance.now();
  await decodeHeic(phone12mpHeic);
  return performance.now() - start;
}

/** Runs work while a 10 ms timer ticks, and gives the longest gap seen between two ticks. */
async function longestTimerGap<T>(work: () => Promise<T>): Promise<{ result: T; longestGap: number }> {
  let last = performance.now();
  let longestGap = 0;
  const ticker = setInterval(() => {
    const now = performance.now();
    longestGap = Math.max(longestGap, now - last);
    last = now;
  }, 10);
  try {
    const result = await work();
    longestGap = Math.max(longestGap, performance.now() - last);
    return { result, longestGap };
  } finally {
    clearInterval(ticker);
  }
}

describe("photo completion under load", () => {
  let volunteer: Actor;
  let visitId: string;

  beforeAll(async () => {
    await resetToDemo();
    volunteer = await actorFor("volunteer01@harrowmere.example");
    const [visit] = await db().select({ id: visits.id }).from(visits).where(eq(visits.volunteerId, volunteer.id)).limit(1);
    visitId = visit!.id;
    session.userId = volunteer.id;
  });

  afterAll(async () => {
    await closePhotoPool();
  });

  it("completes a 12 MP HEIC while this process's timers keep firing: the decode runs on another thread", { timeout: 60_000 }, async () => {
    const decodeMs = await decodeTimeHere();
    const id = await uploadPhoto(volunteer, visitId, phone12mpHeic);
    const { result, longestGap } = await longestTimerGap(() => completeUpload(volunteer, id));
    // 4032 × 3024 scaled to the 1600 px display edge.
    expect(result).toEqual({ photo: { id, status: "ready", width: 1600, height: 1200 } });
    // Run in this thread, the decode alone would stop the timer for decodeMs. Half of it leaves room
    // for a slow, shared machine and still fails whenever the decode blocks the event loop.
    console.info(`12 MP HEIC: decode here ${decodeMs.toFixed(0)} ms, longest timer gap during completion ${longestGap.toFixed(0)} ms`);
    expect(longestGap).toBeLessThan(decodeMs / 2);
  });

  it("answers two overlapping completions of one HEIC alike, with one set of renditions and no GPS", { timeout: 60_000 }, async () => {
    const id = await uploadPhoto(volunteer, visitId, phone12mpHeic);
    const [first, second] = await Promise.all([completeUpload(volunteer, id), completeUpload(volunteer, id)]);
    expect(first).toEqual({ photo: { id, status: "ready", width: 1600, height: 1200 } });
    expect(second).toEqual(first);

    const keys = photoKeys(visitId, id);
    expect(await keysUnder(`display/${visitId}/${id}`)).toEqual([keys.display]);
    expect(await keysUnder(`thumbnails/${visitId}/${id}`)).toEqual([keys.thumbnail]);
    expect(await keysUnder(`originals/${visitId}/${id}`)).toEqual([]);
    const row = await photoRow(id);
    expect(row).toMatchObject({ status: "ready", displayKey: keys.display, thumbnailKey: keys.thumbnail, width: 1600, height: 1200 });
    // The row describes the image it points at; exifr (a well-known EXIF reader) finds no GPS in it.
    const display = Buffer.from(await (await fetch(await photoViewUrl(volunteer, id, "display"))).arrayBuffer());
    const meta = await sharp(display).metadata();
    expect([meta.width, meta.height]).toEqual([1600, 1200]);
    expect(await exifr.gps(display)).toBeUndefined();
  });

  it("judges a photo once when the phone asks again while its completion is under way", { timeout: 60_000 }, async () => {
    const id = await uploadPhoto(volunteer, visitId, phonePortraitHeic);
    const hold = holdPhotoTasks();
    let answers: Promise<unknown[]> | undefined;
    try {
      const first = completeUpload(volunteer, id);
      await hold.held(1);
      const again = completeUpload(volunteer, id);
      answers = Promise.all([first, again]);
      // Time for the second call to read the row (still awaiting: the first cannot settle yet).
      await new Promise((resolve) => setTimeout(resolve, 500));
    } finally {
      hold.release();
    }
    const ready = { photo: { id, status: "ready", width: 240, height: 320 } };
    expect(await answers).toEqual([ready, ready]);
    expect(hold.started()).toBe(1);
  });

  it("answers as another app process did when that one settles the photo first, and writes no images of its own", { timeout: 60_000 }, async () => {
    const id = await uploadPhoto(volunteer, visitId, phonePortraitHeic);
    const hold = holdPhotoTasks();
    let answer: Promise<unknown> | undefined;
    try {
      answer = completeUpload(volunteer, id).then(
        (ready) => ready,
        (error: unknown) => error,
      );
      await hold.held(1);
      // Another process (the cluster runs one per core) finished the same photo meanwhile.
      await db().update(photos).set({ status: "refused", refusalReason: "Refused by the other process.", processedAt: new Date() }).where(eq(photos.id, id));
    } finally {
      hold.release();
    }
    expect(await answer).toMatchObject({ status: 400, code: PHOTO_REFUSED, message: "Refused by the other process." });
    expect(await photoRow(id)).toMatchObject({ status: "refused", refusalReason: "Refused by the other process.", displayKey: null });
    expect(await keysUnder(`display/${visitId}/${id}`)).toEqual([]);
    expect(await keysUnder(`thumbnails/${visitId}/${id}`)).toEqual([]);
  });

  it("refuses a file once: overlapping completions get the same refusal, and it is recorded once", async () => {
    const id = await uploadPhoto(volunteer, visitId, textFile);
    const answers = await Promise.allSettled([completeUpload(volunteer, id), completeUpload(volunteer, id)]);
    const reasons = answers.map((a) => (a.status === "rejected" ? (a.reason as { status: number; code: string; message: string }) : undefined));
    expect(reasons.map((r) => [r?.status, r?.code])).toEqual([
      [400, PHOTO_REFUSED],
      [400, PHOTO_REFUSED],
    ]);
    expect(reasons[1]!.message).toBe(reasons[0]!.message);
    expect(reasons[0]!.message).toMatch(/^This is a text file, not a photo/);

    const row = await photoRow(id);
    expect(row).toMatchObject({ status: "refused", refusalReason: reasons[0]!.message, displayKey: null });
    expect(await objectExists(row.uploadKey)).toBe(false);
    // Asked again later: the same refusal, and the row is not written again.
    await expect(completeUpload(volunteer, id)).rejects.toMatchObject({ code: PHOTO_REFUSED, message: reasons[0]!.message });
    expect((await photoRow(id)).processedAt).toEqual(row.processedAt);
  });

  it("holds no row lock and no database connection while the pool works on the photo", { timeout: 60_000 }, async () => {
    const id = await uploadPhoto(volunteer, visitId, phone12mpHeic);
    const hold = holdPhotoTasks();
    let done: Promise<unknown> | undefined;
    try {
      done = completeUpload(volunteer, id).then(
        (answer) => answer,
        (error: unknown) => error,
      );
      await hold.held(1);
      // Another transaction locks the row at once: NOWAIT raises lock_not_available (55P03)
      // instead of waiting if anyone holds it (PostgreSQL manual, SELECT, "The Locking Clause").
      const locked = await sqlClient().begin((tx) => tx`select id from photos where id = ${id} for update nowait`);
      expect(locked.map((r) => r.id)).toEqual([id]);
      // And no connection of this database sits in an open transaction meanwhile.
      const [open] = await sqlClient()<{ n: number }[]>`
        select count(*)::int as n from pg_stat_activity where datname = current_database() and state like 'idle in transaction%'`;
      expect(open!.n).toBe(0);
      expect((await photoRow(id)).status).toBe("awaiting_upload");
    } finally {
      hold.release();
    }
    expect(await done).toEqual({ photo: { id, status: "ready", width: 1600, height: 1200 } });
  });

  it("answers 503 busy with Retry-After once every pool slot is taken, and the photo completes when sent again", { timeout: 120_000 }, async () => {
    const queued = await Promise.all(Array.from({ length: PHOTO_SLOTS }, () => uploadPhoto(volunteer, visitId, phonePortraitHeic)));
    const extra = await uploadPhoto(volunteer, visitId, phonePortraitHeic);
    const hold = holdPhotoTasks();
    let pending: Promise<unknown>[] = [];
    try {
      pending = queued.map((id) =>
        completeUpload(volunteer, id).then(
          (answer) => answer,
          (error: unknown) => error,
        ),
      );
      await hold.held(PHOTO_THREADS);
      await until(() => photoSlotsInUse() === PHOTO_SLOTS);

      const busy = await completeRoute(new Request(`http://localhost/api/field/photos/${extra}/complete`, { method: "POST" }), {
        params: Promise.resolve({ id: extra }),
      });
      expect(busy.status).toBe(503);
      // Retry-After as delay-seconds (RFC 9110, section 10.2.3).
      expect(busy.headers.get("retry-after")).toMatch(/^[1-9][0-9]*$/);
      expect(await busy.json()).toMatchObject({ error: { code: PHOTO_BUSY } });
      // Nothing was judged: the photo still awaits, its original in place for the retry.
      const waiting = await photoRow(extra);
      expect(waiting.status).toBe("awaiting_upload");
      expect(await objectExists(waiting.uploadKey)).toBe(true);
    } finally {
      hold.release();
    }
    for (const [i, answer] of (await Promise.all(pending)).entries()) expect(answer).toEqual({ photo: { id: queued[i], status: "ready", width: 240, height: 320 } });
    expect(photoSlotsInUse()).toBe(0);
    await expect(completeUpload(volunteer, extra)).resolves.toEqual({ photo: { id: extra, status: "ready", width: 240, height: 320 } });
  });

  it("leaves the photo awaiting with its original when the work dies before the final write, so a retry completes it", { timeout: 60_000 }, async () => {
    const id = await uploadPhoto(volunteer, visitId, phonePortraitHeic);
    const hold = holdPhotoTasks();
    const lost = completeUpload(volunteer, id).then(
      () => undefined,
      (error: unknown) => error,
    );
    await hold.held(1);
    await closePhotoPool(); // the thread ends mid-task, as in a crash
    hold.release();
    const failure = await lost;
    expect(failure).toBeInstanceOf(Error);
    expect(failure).not.toMatchObject({ code: PHOTO_REFUSED });
    const row = await photoRow(id);
    expect(row).toMatchObject({ status: "awaiting_upload", displayKey: null, processedAt: null });
    expect(await objectExists(row.uploadKey)).toBe(true);
    expect(await keysUnder(`display/${visitId}/${id}`)).toEqual([]);

    await expect(completeUpload(volunteer, id)).resolves.toEqual({ photo: { id, status: "ready", width: 240, height: 320 } });
    expect(await objectExists(row.uploadKey)).toBe(false);
  });
});
