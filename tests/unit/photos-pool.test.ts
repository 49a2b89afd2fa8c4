import exifr from "exifr";
import sharp from "sharp";
import { afterAll, describe, expect, it } from "vitest";
import { inspectPhoto } from "@/lib/photos/inspect";
import { PHOTO_BUSY, PHOTO_SLOTS, PhotoPoolBusy, closePhotoPool, holdPhotoTasks, photoSlotsInUse, reservePhotoSlot } from "@/lib/photos/pool";
import { HEIC_COLOURS, colourDistance, phonePortraitHeic, pixelAt, textFile } from "../support/images";

// The photo pool (piscina worker threads): the same judgement as in this thread, bytes moved
// rather than copied, a bounded number of slots, and a pool that recovers from losing its threads.

async function judgeOnce(bytes: Uint8Array) {
  const slot = reservePhotoSlot();
  try {
    return await slot.judge(bytes);
  } finally {
    slot.release();
  }
}

afterAll(async () => {
  await closePhotoPool();
});

describe("photo pool", () => {
  it("decodes a phone HEIC on a pool thread: turned as the phone showed it, with no EXIF or GPS", { timeout: 60_000 }, async () => {
    const judged = await judgeOnce(new Uint8Array(phonePortraitHeic));
    if (judged.kind !== "ready") throw new Error(`expected ready, got ${judged.reason}`);
    expect(judged).toMatchObject({ contentType: "image/heic", bytes: phonePortraitHeic.length });
    expect([judged.display.width, judged.display.height, judged.thumbnail.width, judged.thumbnail.height]).toEqual([240, 320, 240, 320]);
    const display = Buffer.from(judged.display.bytes);
    // Read back with exifr (a well-known EXIF reader) and sharp: a JPEG with nothing of the phone's.
    expect(await exifr.gps(display)).toBeUndefined();
    expect(await exifr.parse(display, { tiff: true, xmp: true, iptc: true, icc: true })).toBeUndefined();
    expect((await sharp(display).metadata()).format).toBe("jpeg");
    // irot turned it 90° clockwise: the red block stored top left is now top right (lossy: within 12).
    expect(colourDistance(await pixelAt(display, 210, 40), HEIC_COLOURS.red)).toBeLessThanOrEqual(12);
  });

  it("hands a refusal back as a value with inspectPhoto's own message", async () => {
    const here = await inspectPhoto(textFile).then(
      () => "accepted",
      (error: Error) => error.message,
    );
    expect(here).toMatch(/^This is a text file, not a photo/);
    await expect(judgeOnce(new Uint8Array(textFile))).resolves.toEqual({ kind: "refused", reason: here });
  });

  it("moves an upload that owns its memory to the thread instead of copying it, and copies a view into a larger buffer", async () => {
    const owned = new Uint8Array(phonePortraitHeic);
    expect((await judgeOnce(owned)).kind).toBe("ready");
    // A transferred ArrayBuffer is detached in the sender (HTML structured clone, as Node implements it).
    expect(owned.byteLength).toBe(0);

    const larger = new Uint8Array(phonePortraitHeic.length + 16);
    larger.set(phonePortraitHeic, 8);
    const view = larger.subarray(8, 8 + phonePortraitHeic.length);
    expect((await judgeOnce(view)).kind).toBe("ready");
    expect(view.byteLength).toBe(phonePortraitHeic.length);
  });

  it("answers 503 busy once every slot is taken, and takes work again as slots free up", () => {
    const slots = Array.from({ length: PHOTO_SLOTS }, () => reservePhotoSlot());
    expect(photoSlotsInUse()).toBe(PHOTO_SLOTS);
    let refusal: unknown;
    try {
      reservePhotoSlot();
    } catch (error) {
      refusal = error;
    }
    expect(refusal).toBeInstanceOf(PhotoPoolBusy);
    expect(refusal).toMatchObject({ status: 503, code: PHOTO_BUSY, retryAfterSeconds: expect.any(Number) });
    slots[0]!.release();
    slots[0]!.release(); // releasing twice frees one slot, not two
    expect(photoSlotsInUse()).toBe(PHOTO_SLOTS - 1);
    const again = reservePhotoSlot();
    expect(photoSlotsInUse()).toBe(PHOTO_SLOTS);
    for (const slot of [again, ...slots]) slot.release();
    expect(photoSlotsInUse()).toBe(0);
  });

  it("rejects a task whose pool is closed under it, then starts a fresh pool for the next", { timeout: 60_000 }, async () => {
    const hold = holdPhotoTasks();
    const slot = reservePhotoSlot();
    const lost = slot
      .judge(new Uint8Array(phonePortraitHeic))
      .then(
        () => undefined,
        (error: unknown) => error,
      )
      .finally(() => slot.release());
    await hold.held(1);
    await closePhotoPool();
    hold.release();
    expect(await lost).toBeInstanceOf(Error);
    expect(photoSlotsInUse()).toBe(0);
    expect((await judgeOnce(new Uint8Array(phonePortraitHeic))).kind).toBe("ready");
  });
});
