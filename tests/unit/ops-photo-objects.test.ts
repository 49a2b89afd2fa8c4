import { S3Client, type ListObjectsV2CommandInput, type ListObjectsV2CommandOutput } from "@aws-sdk/client-s3";
import { describe, expect, it, vi } from "vitest";
import { listObjects } from "@/scripts/photo-objects";

// ListObjectsV2 answers at most 1,000 keys a page; while IsTruncated, NextContinuationToken asks
// for the next one (AWS S3 API Reference, "ListObjectsV2"). The local fake cannot page (its
// continuation tokens use DES, which Node 20's OpenSSL 3 refuses), so the pages here are made up.
describe("the photo store's object list", () => {
  it("walks every page and keeps key, size, etag and last modified", async () => {
    const client = new S3Client({ region: "us-east-1", credentials: { accessKeyId: "unused", secretAccessKey: "unused" } });
    const at = new Date("2026-05-01T10:00:00Z");
    const pages: Record<string, Partial<ListObjectsV2CommandOutput>> = {
      first: { IsTruncated: true, NextContinuationToken: "t2", Contents: [{ Key: "display/a.jpg", Size: 10, ETag: '"e1"', LastModified: at }] },
      t2: { IsTruncated: true, NextContinuationToken: "t3", Contents: [{ Key: "display/b.jpg", Size: 20, ETag: '"e2"', LastModified: at }] },
      t3: { IsTruncated: false, Contents: [{ Key: "thumbnails/a.jpg", Size: 3, ETag: '"e3"', LastModified: at }] },
    };
    const asked: ListObjectsV2CommandInput[] = [];
    vi.spyOn(client, "send").mockImplementation((async (command: { input: ListObjectsV2CommandInput }) => {
      asked.push({ ...command.input });
      return pages[command.input.ContinuationToken ?? "first"];
    }) as never);

    const objects = await listObjects(client, { bucket: "photos", pageSize: 1 });

    expect(objects).toEqual([
      { key: "display/a.jpg", size: 10, etag: '"e1"', lastModified: "2026-05-01T10:00:00.000Z" },
      { key: "display/b.jpg", size: 20, etag: '"e2"', lastModified: "2026-05-01T10:00:00.000Z" },
      { key: "thumbnails/a.jpg", size: 3, etag: '"e3"', lastModified: "2026-05-01T10:00:00.000Z" },
    ]);
    expect(asked.map((a) => [a.Bucket, a.ContinuationToken, a.MaxKeys])).toEqual([
      ["photos", undefined, 1],
      ["photos", "t2", 1],
      ["photos", "t3", 1],
    ]);
  });
});
