import "server-only";
import { HeadBucketCommand } from "@aws-sdk/client-s3";
import { sql } from "drizzle-orm";
import { db } from "@/db/client";
import { mailTransport } from "@/lib/mail/transport";
import { photoBucket, s3 } from "@/lib/storage/s3";

export type CheckState = { status: "ok" | "down"; latencyMs: number; detail?: string };

async function timed(check: () => Promise<unknown>, timeoutMs = 3000): Promise<CheckState> {
  const started = performance.now();
  try {
    await Promise.race([check(), new Promise((_, reject) => setTimeout(() => reject(new Error("timed out")), timeoutMs))]);
    return { status: "ok", latencyMs: Math.round(performance.now() - started) };
  } catch (error) {
    // Only a short, generic reason: health output is public.
    const detail = error instanceof Error && error.message === "timed out" ? "timed out" : "unreachable";
    return { status: "down", latencyMs: Math.round(performance.now() - started), detail };
  }
}

export async function healthReport() {
  const [database, objectStore, mail] = await Promise.all([
    timed(() => db().execute(sql`select 1`)),
    timed(() => s3().send(new HeadBucketCommand({ Bucket: photoBucket() }))),
    timed(() => mailTransport().verify()),
  ]);
  const ok = [database, objectStore, mail].every((c) => c.status === "ok");
  return { status: ok ? ("ok" as const) : ("degraded" as const), checks: { database, objectStore, mail }, time: new Date().toISOString() };
}
