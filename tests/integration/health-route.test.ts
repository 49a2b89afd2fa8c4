import { S3Client } from "@aws-sdk/client-s3";
import { describe, expect, it, vi } from "vitest";

// The object store is pointed at a closed port (nothing listens on 127.0.0.1:9), so the health
// route must report it down and answer 503 while the database stays ok.
vi.mock("@/lib/storage/s3", () => ({
  s3: () => new S3Client({ endpoint: "http://127.0.0.1:9", region: "us-east-1", forcePathStyle: true, credentials: { accessKeyId: "x", secretAccessKey: "x" }, maxAttempts: 1 }),
  photoBucket: () => "turnstone-test-photos",
}));

describe("GET /api/health", () => {
  it("answers 503 naming the part that is down", async () => {
    const { GET } = await import("@/app/api/health/route");
    const res = await GET();
    expect(res.status).toBe(503);
    const body = await res.json();
    expect(body.status).toBe("degraded");
    expect(body.checks.objectStore.status).toBe("down");
    expect(body.checks.database.status).toBe("ok");
    expect(JSON.stringify(body)).not.toMatch(/ECONNREFUSED|stack/);
  });
});
