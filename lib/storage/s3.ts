import "server-only";
import { S3Client } from "@aws-sdk/client-s3";
import { env } from "@/lib/env";

const globalForS3 = globalThis as unknown as { turnstoneS3?: S3Client };

export function s3(): S3Client {
  const e = env();
  globalForS3.turnstoneS3 ??= new S3Client({
    endpoint: e.S3_ENDPOINT,
    region: e.S3_REGION,
    forcePathStyle: e.S3_FORCE_PATH_STYLE,
    credentials: { accessKeyId: e.S3_ACCESS_KEY_ID, secretAccessKey: e.S3_SECRET_ACCESS_KEY },
    // Without these, presigned PUT URLs carry a checksum of an empty body and uploads fail.
    requestChecksumCalculation: "WHEN_REQUIRED",
    responseChecksumValidation: "WHEN_REQUIRED",
  });
  return globalForS3.turnstoneS3;
}

export function photoBucket(): string {
  return env().S3_BUCKET;
}
