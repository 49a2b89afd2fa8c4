import { randomUUID } from "node:crypto";
import { HeadObjectCommand, ListObjectsV2Command } from "@aws-sdk/client-s3";
import { eq } from "drizzle-orm";
import { db } from "@/db/client";
import { photos } from "@/db/schema";
import type { Actor } from "@/lib/auth/guard";
import { requestUploadTicket } from "@/lib/photos/tickets";
import { photoBucket, s3 } from "@/lib/storage/s3";

export { actorFor } from "./actors";

// Steps 1 and 2 of the photo flow as a phone takes them, and what the store and the row hold.

export async function objectExists(key: string): Promise<boolean> {
  try {
    await s3().send(new HeadObjectCommand({ Bucket: photoBucket(), Key: key }));
    return true;
  } catch (error) {
    if ((error as { $metadata?: { httpStatusCode?: number } }).$metadata?.httpStatusCode === 404) return false;
    throw error;
  }
}

/** Every key in the photo bucket that starts with prefix. */
export async function keysUnder(prefix: string): Promise<string[]> {
  const listed = await s3().send(new ListObjectsV2Command({ Bucket: photoBucket(), Prefix: prefix }));
  return (listed.Contents ?? []).map((o) => o.Key!).sort();
}

export async function photoRow(id: string) {
  const [row] = await db().select().from(photos).where(eq(photos.id, id));
  return row!;
}

/** A ticket, then a PUT of the bytes straight to the store; answers the new photo's id. */
export async function uploadPhoto(actor: Actor, visitId: string, bytes: Buffer): Promise<string> {
  const id = randomUUID();
  const ticket = await requestUploadTicket(actor, { id, visitId, sightingId: null, contentType: "image/heic", bytes: bytes.length });
  const put = await fetch(ticket.uploadUrl, { method: "PUT", headers: ticket.headers, body: new Uint8Array(bytes) });
  if (put.status !== 200) throw new Error(`PUT to the store answered ${put.status}`);
  return id;
}
