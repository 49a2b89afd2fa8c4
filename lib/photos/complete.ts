import "server-only";
import { and, eq } from "drizzle-orm";
import { db } from "@/db/client";
import { photos } from "@/db/schema";
import type { Actor } from "@/lib/auth/guard";
import { AppError, forbidden, notFound } from "@/lib/errors";
import { MAX_PHOTO_BYTES, photoErrorCodes, type PhotoReady } from "./contract";
import { photoKeys } from "./keys";
import { deleteObject, objectSize, readObject, writeObject } from "./objects";
import type { Judgement } from "./pool-task";
import { reservePhotoSlot } from "./pool";
import { PhotoRefusal, megabytes } from "./refusal";

export const PHOTO_NOT_UPLOADED = photoErrorCodes.notUploaded;

type PhotoRow = typeof photos.$inferSelect;
/** A judgement with the size to record: the file's own, or the stored object's when it was too big to read. */
type Verdict = Extract<Judgement, { kind: "ready" }> | { kind: "refused"; reason: string; bytes: number };

// Not a 409: the phone's outbox reads 409 as "the server has it" and would drop its copy.
const notUploaded = () => new AppError(400, PHOTO_NOT_UPLOADED, "The photo has not been uploaded yet: send the file to the upload URL first.");

async function photoRow(id: string): Promise<PhotoRow | undefined> {
  const [row] = await db().select().from(photos).where(eq(photos.id, id));
  return row;
}

/** The answer a settled photo gives every time it is asked: ready, or its refusal. */
function answerOf(row: PhotoRow): PhotoReady {
  if (row.status === "ready") return { photo: { id: row.id, status: "ready", width: row.width ?? 0, height: row.height ?? 0 } };
  if (row.status === "refused") throw new PhotoRefusal(row.refusalReason ?? "This photo was refused.");
  throw notUploaded();
}

/**
 * Reads the upload and has the pool judge it, or null when nothing is stored. A slot is taken
 * before reading, so a flood of completions answers 503 busy instead of holding 15 MB each.
 */
async function judgeUpload(key: string): Promise<Verdict | null> {
  const size = await objectSize(key);
  if (size === null) return null;
  if (size > MAX_PHOTO_BYTES) {
    return { kind: "refused", reason: `Photos can be at most ${megabytes(MAX_PHOTO_BYTES)}; this file is ${megabytes(size)}.`, bytes: size };
  }
  const slot = reservePhotoSlot();
  try {
    const bytes = await readObject(key, MAX_PHOTO_BYTES);
    if (bytes === null) return null;
    // Replaced by a bigger object since the size check (the upload URL may still be valid).
    if (bytes.byteLength > MAX_PHOTO_BYTES) return { kind: "refused", reason: `Photos can be at most ${megabytes(MAX_PHOTO_BYTES)}.`, bytes: size };
    const judged = await slot.judge(bytes);
    return judged.kind === "ready" ? judged : { ...judged, bytes: size };
  } finally {
    slot.release();
  }
}

/** The original is deleted once judged: it still carries the phone's EXIF, GPS included. */
async function discardOriginal(key: string): Promise<void> {
  try {
    await deleteObject(key);
  } catch (error) {
    console.error("[turnstone] could not delete an uploaded original", key, error);
  }
}

/**
 * Records the verdict unless another completion of the same photo got there first, and answers
 * with whatever the row then says. The renditions are written before the row points at them; the
 * one UPDATE that settles the row locks it only for that statement, and a completion that finds
 * it settled already (PostgreSQL rechecks the WHERE after waiting for the other) writes nothing.
 */
async function settle(row: PhotoRow, verdict: Verdict): Promise<PhotoRow> {
  const now = new Date();
  let change: Partial<PhotoRow>;
  if (verdict.kind === "ready") {
    // Another completion may have settled it while this one worked: leave its images alone.
    const current = await photoRow(row.id);
    if (current?.status !== "awaiting_upload") return current ?? row;
    const keys = photoKeys(row.visitId, row.id);
    await Promise.all([
      writeObject(keys.display, verdict.display.bytes, verdict.display.contentType),
      writeObject(keys.thumbnail, verdict.thumbnail.bytes, verdict.thumbnail.contentType),
    ]);
    // width and height are those of the display image: the original is not kept.
    change = {
      status: "ready",
      displayKey: keys.display,
      thumbnailKey: keys.thumbnail,
      contentType: verdict.contentType,
      bytes: verdict.bytes,
      width: verdict.display.width,
      height: verdict.display.height,
      refusalReason: null,
      processedAt: now,
    };
  } else {
    change = { status: "refused", refusalReason: verdict.reason, bytes: verdict.bytes, processedAt: now };
  }
  const [won] = await db()
    .update(photos)
    .set(change)
    .where(and(eq(photos.id, row.id), eq(photos.status, "awaiting_upload")))
    .returning();
  if (!won) return (await photoRow(row.id)) ?? row;
  // Only after the row is settled: until then the original stays for a retry.
  await discardOriginal(row.uploadKey);
  return won;
}

/** Completions under way in this process, by photo id. Other processes meet at the final UPDATE. */
const settlingNow = new Map<string, Promise<PhotoRow>>();

async function judgeAndSettle(row: PhotoRow): Promise<PhotoRow> {
  const verdict = await judgeUpload(row.uploadKey);
  if (verdict !== null) return settle(row, verdict);
  // No original: not uploaded yet, or another completion settled the photo and deleted it.
  const now = await photoRow(row.id);
  if (!now) throw notFound("That photo");
  return now;
}

/**
 * Step 3 of the upload flow: checks the uploaded bytes, writes the display and thumbnail images
 * and marks the photo ready, or records why it was refused. The work happens outside any
 * transaction, on the photo pool's threads (pool.ts); only the final write touches the row.
 * Completions of one photo that overlap get the same answer, and a crash before the final write
 * leaves the photo awaiting_upload with its original in place, so the phone simply calls again.
 */
export async function completeUpload(actor: Actor, photoId: string): Promise<PhotoReady> {
  const row = await photoRow(photoId);
  if (!row) throw notFound("That photo");
  if (row.uploadedById !== actor.id) throw forbidden("You can only complete your own uploads.");
  if (row.status !== "awaiting_upload") return answerOf(row);
  // A phone that gave up waiting asks again: in this process, it joins the completion under way.
  let settling = settlingNow.get(photoId);
  if (!settling) {
    settling = judgeAndSettle(row).finally(() => settlingNow.delete(photoId));
    settlingNow.set(photoId, settling);
  }
  return answerOf(await settling);
}

