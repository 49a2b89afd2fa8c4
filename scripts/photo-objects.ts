import { paginateListObjectsV2, type S3Client } from "@aws-sdk/client-s3";

export type ListedObject = { key: string; size: number; etag: string; lastModified: string };

/** Every object in the bucket (or under `prefix`), through the SDK's paginator (a page holds 1,000 at most). */
export async function listObjects(client: S3Client, input: { bucket: string; prefix?: string; pageSize?: number }): Promise<ListedObject[]> {
  const objects: ListedObject[] = [];
  for await (const page of paginateListObjectsV2({ client, pageSize: input.pageSize }, { Bucket: input.bucket, Prefix: input.prefix })) {
    for (const o of page.Contents ?? []) {
      objects.push({ key: o.Key ?? "", size: o.Size ?? 0, etag: o.ETag ?? "", lastModified: o.LastModified?.toISOString() ?? "" });
    }
  }
  return objects;
}
