import "server-only";
import { DeleteObjectCommand, GetObjectCommand, HeadObjectCommand, PutObjectCommand } from "@aws-sdk/client-s3";
import { getSignedUrl } from "@aws-sdk/s3-request-presigner";
import { photoBucket, s3 } from "@/lib/storage/s3";

export const UPLOAD_URL_SECONDS = 10 * 60;
export const VIEW_URL_SECONDS = 5 * 60;
// The original's stored type is never trusted or served, so uploads are stored as opaque bytes.
export const UPLOAD_CONTENT_TYPE = "application/octet-stream";

/**
 * A presigned PUT for exactly `bytes` bytes: Content-Length is a signed header, so a real S3
 * refuses any other size (the local fake does not check, hence the size check on completion).
 */
export async function presignUpload(key: string, bytes: number): Promise<{ url: string; headers: Record<string, string> }> {
  const command = new PutObjectCommand({ Bucket: photoBucket(), Key: key, ContentType: UPLOAD_CONTENT_TYPE, ContentLength: bytes });
  const url = await getSignedUrl(s3(), command, { expiresIn: UPLOAD_URL_SECONDS });
  return { url, headers: { "Content-Type": UPLOAD_CONTENT_TYPE } };
}

export async function presignView(key: string): Promise<string> {
  const command = new GetObjectCommand({
    Bucket: photoBucket(),
    Key: key,
    ResponseContentType: "image/jpeg",
    ResponseCacheControl: `private, max-age=${VIEW_URL_SECONDS}`,
  });
  return getSignedUrl(s3(), command, { expiresIn: VIEW_URL_SECONDS });
}

function isMissing(error: unknown): boolean {
  const e = error as { name?: string; $metadata?: { httpStatusCode?: number } };
  return e?.name === "NotFound" || e?.name === "NoSuchKey" || e?.$metadata?.httpStatusCode === 404;
}

/** The stored size in bytes, or null when nothing was uploaded under that key. */
export async function objectSize(key: string): Promise<number | null> {
  try {
    const head = await s3().send(new HeadObjectCommand({ Bucket: photoBucket(), Key: key }));
    return head.ContentLength ?? 0;
  } catch (error) {
    if (isMissing(error)) return null;
    throw error;
  }
}

/**
 * Reads at most `limit + 1` bytes, so an object swapped for a bigger one after a size check cannot
 * flood memory; null when nothing is stored under that key (any more).
 */
export async function readObject(key: string, limit: number): Promise<Uint8Array | null> {
  try {
    const object = await s3().send(new GetObjectCommand({ Bucket: photoBucket(), Key: key, Range: `bytes=0-${limit}` }));
    if (!object.Body) return new Uint8Array();
    return await object.Body.transformToByteArray();
  } catch (error) {
    if (isMissing(error)) return null;
    throw error;
  }
}

export async function writeObject(key: string, bytes: Uint8Array, contentType: string): Promise<void> {
  await s3().send(
    new PutObjectCommand({ Bucket: photoBucket(), Key: key, Body: bytes, ContentType: contentType, CacheControl: "private, max-age=300" }),
  );
}

export async function deleteObject(key: string): Promise<void> {
  await s3().send(new DeleteObjectCommand({ Bucket: photoBucket(), Key: key }));
}
