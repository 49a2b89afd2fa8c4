import "server-only";
import { eq } from "drizzle-orm";
import { db } from "@/db/client";
import { photos } from "@/db/schema";
import type { Actor } from "@/lib/auth/guard";
import { AppError, forbidden, notFound } from "@/lib/errors";
import { MAX_PHOTO_BYTES, photoErrorCodes, type PhotoReady } from "./contract";
import { inspectPhoto } from "./inspect";
import { photoKeys } from "./keys";
import { deleteObject, objectSize, readObject, writeObject } from "./objects";
import { processPhoto } from "./process";
import { PhotoRefusal, isPhotoRefusal, megabytes } from "./refusal";

export const PHOTO_NOT_UPLOADED = photoErrorCodes.notUploaded;

type Outcome =
  | { kind: "ready"; width: number; height: number; originalKey?: string }
  | { kind: "refused"; reason: string; originalKey?: string };

async function readUpload(key: string, size: number): Promise<Uint8Array> {
  if (size > MAX_PHOTO_BYTES) {
    throw new PhotoRefusal(`Photos can be at most ${megabytes(MAX_PHOTO_BYTES)}; this file is ${megabytes(size)}.`);
  }
  const bytes = await readObject(key, MAX_PHOTO_BYTES);
  // Replaced by a bigger object since the size check (the upload URL may still be valid).
  if (bytes.byteLength > MAX_PHOTO_BYTES) throw new PhotoRefusal(`Photos can be at most ${megabytes(MAX_PHOTO_BYTES)}.`);
  return bytes;
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
 * Step 3 of the upload flow: checks the uploaded bytes, writes the display and thumbnail
 * images and marks the photo ready, or records why it was refused. The row is locked for the
 * whole step, so a repeated call waits and then gets the same answer; a crash rolls back to
 * awaiting_upload with the original still in place, so the phone can simply call again.
 */
export async function completeUpload(actor: Actor, photoId: string): Promise<PhotoReady> {
  const outcome = await db().transaction(async (tx): Promise<Outcome> => {
    const [row] = await tx.select().from(photos).where(eq(photos.id, photoId)).for("update");
    if (!row) throw notFound("That photo");
    if (row.uploadedById !== actor.id) throw forbidden("You can only complete your own uploads.");
    if (row.status === "ready") return { kind: "ready", width: row.width ?? 0, height: row.height ?? 0 };
    if (row.status === "refused") return { kind: "refused", reason: row.refusalReason ?? "This photo was refused." };

    const size = await objectSize(row.uploadKey);
    if (size === null) {
      // Not a 409: the phone's outbox reads 409 as "the server has it" and would drop its copy.
      throw new AppError(400, PHOTO_NOT_UPLOADED, "The photo has not been uploaded yet: send the file to the upload URL first.");
    }
    try {
      const bytes = await readUpload(row.uploadKey, size);
      const inspected = await inspectPhoto(bytes);
      const { display, thumbnail } = await processPhoto(bytes, inspected);
      const keys = photoKeys(row.visitId, row.id);
      await Promise.all([
        writeObject(keys.display, display.bytes, display.contentType),
        writeObject(keys.thumbnail, thumbnail.bytes, thumbnail.contentType),
      ]);
      // width and height are those of the display image: the original is not kept.
      await tx
        .update(photos)
        .set({
          status: "ready",
          displayKey: keys.display,
          thumbnailKey: keys.thumbnail,
          contentType: inspected.contentType,
          bytes: inspected.bytes,
          width: display.width,
          height: display.height,
          refusalReason: null,
          processedAt: new Date(),
        })
        .where(eq(photos.id, row.id));
      return { kind: "ready", width: display.width, height: display.height, originalKey: row.uploadKey };
    } catch (error) {
      if (!isPhotoRefusal(error)) throw error;
      await tx
        .update(photos)
        .set({ status: "refused", refusalReason: error.message, bytes: size, processedAt: new Date() })
        .where(eq(photos.id, row.id));
      return { kind: "refused", reason: error.message, originalKey: row.uploadKey };
    }
  });

  // Only after the commit: a rolled-back attempt keeps its original for the retry.
  if (outcome.originalKey) await discardOriginal(outcome.originalKey);
  if (outcome.kind === "refused") throw new PhotoRefusal(outcome.reason);
  return { photo: { id: photoId, status: "ready", width: outcome.width, height: outcome.height } };
}
