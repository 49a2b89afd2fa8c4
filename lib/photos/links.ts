import "server-only";
import { eq } from "drizzle-orm";
import { db } from "@/db/client";
import { photos } from "@/db/schema";
import type { Actor } from "@/lib/auth/guard";
import { hasRole, REVIEWERS } from "@/lib/auth/roles";
import { forbidden, notFound } from "@/lib/errors";
import { presignView } from "./objects";

export type PhotoSize = "thumbnail" | "display";

/**
 * A short-lived signed URL for one processed image. Volunteers see their own photos;
 * coordinators and organisers see all; partners none yet (their route refuses them first).
 */
export async function photoViewUrl(actor: Actor, photoId: string, size: PhotoSize): Promise<string> {
  if (!hasRole(actor, "volunteer", ...REVIEWERS)) throw forbidden();
  const [row] = await db()
    .select({ uploadedById: photos.uploadedById, status: photos.status, displayKey: photos.displayKey, thumbnailKey: photos.thumbnailKey })
    .from(photos)
    .where(eq(photos.id, photoId));
  if (!row) throw notFound("That photo");
  if (!hasRole(actor, ...REVIEWERS) && row.uploadedById !== actor.id) throw forbidden("You can only see your own photos.");
  const key = size === "thumbnail" ? row.thumbnailKey : row.displayKey;
  if (row.status !== "ready" || !key) throw notFound("That photo");
  return presignView(key);
}
