import "server-only";
import { eq } from "drizzle-orm";
import { db } from "@/db/client";
import { photos, sightings, visits } from "@/db/schema";
import type { Actor } from "@/lib/auth/guard";
import { AppError, forbidden, invalid, notFound } from "@/lib/errors";
import { photoErrorCodes, type PhotoUploadRequest, type PhotoUploadTicket } from "./contract";
import { photoKeys } from "./keys";
import { UPLOAD_URL_SECONDS, presignUpload } from "./objects";
import { PhotoRefusal } from "./refusal";

export const PHOTO_ALREADY_UPLOADED = photoErrorCodes.alreadyUploaded;

async function assertVisitAndSighting(actor: Actor, request: PhotoUploadRequest): Promise<void> {
  const [visit] = await db().select({ volunteerId: visits.volunteerId }).from(visits).where(eq(visits.id, request.visitId));
  if (!visit) throw notFound("That walk");
  if (visit.volunteerId !== actor.id) throw forbidden("You can only add photos to your own walks.");
  if (!request.sightingId) return;
  const [sighting] = await db().select({ visitId: sightings.visitId }).from(sightings).where(eq(sightings.id, request.sightingId));
  if (!sighting) throw notFound("That sighting");
  if (sighting.visitId !== request.visitId) {
    throw invalid({ sightingId: ["That sighting belongs to another walk."] }, "That sighting belongs to another walk.");
  }
}

/**
 * Step 1 of the upload flow: records the photo (status awaiting_upload) and hands back a
 * presigned PUT. Idempotent on the phone's photo id: asking again while the upload is pending
 * gives a fresh ticket for the same row; once processed, the outcome is final (409 when ready,
 * the stored 400 refusal when refused), since the original has been deleted by then.
 */
export async function requestUploadTicket(actor: Actor, request: PhotoUploadRequest): Promise<PhotoUploadTicket> {
  await assertVisitAndSighting(actor, request);
  const keys = photoKeys(request.visitId, request.id);
  const sightingId = request.sightingId ?? null;

  const inserted = await db()
    .insert(photos)
    .values({ id: request.id, visitId: request.visitId, sightingId, uploadedById: actor.id, uploadKey: keys.original, bytes: request.bytes })
    .onConflictDoNothing({ target: photos.id })
    .returning({ id: photos.id });

  if (inserted.length === 0) {
    // Only "already uploaded" is a 409: the phone's outbox takes a 409 to mean the server has the photo.
    const [existing] = await db().select().from(photos).where(eq(photos.id, request.id));
    if (!existing || existing.uploadedById !== actor.id || existing.visitId !== request.visitId) {
      throw invalid({ id: ["This photo is already on another walk."] }, "This photo is already on another walk.");
    }
    if (existing.status === "ready") throw new AppError(409, PHOTO_ALREADY_UPLOADED, "This photo has already been uploaded.");
    if (existing.status === "refused") throw new PhotoRefusal(existing.refusalReason ?? "This photo was refused.");
    // Still awaiting its upload: the phone's latest word wins (it may have re-encoded the file
    // or moved the photo to another sighting of the same visit).
    await db().update(photos).set({ bytes: request.bytes, sightingId }).where(eq(photos.id, request.id));
  }

  const { url, headers } = await presignUpload(keys.original, request.bytes);
  return { id: request.id, uploadUrl: url, headers, expiresAt: new Date(Date.now() + UPLOAD_URL_SECONDS * 1000).toISOString() };
}
