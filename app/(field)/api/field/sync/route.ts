import { NextResponse } from "next/server";
import { z } from "zod";
import { route } from "@/lib/http/route";
import { applySyncBatch } from "@/lib/sync/apply-batch";

/**
 * The phone's outbox posts batches here, up to the sync batch's byte cap (lib/limits/request-bodies.ts);
 * the envelope and its items are validated one by one in applySyncBatch (see lib/sync).
 */
export const POST = route({ roles: ["volunteer"], body: z.unknown(), bodyLimit: "syncBatch" }, async ({ actor, body }) => {
  const { status, response } = await applySyncBatch(actor, body);
  // no-transform: the answer is a short list of ids, not worth compressing on every sync.
  return NextResponse.json(response, { status, headers: { "Cache-Control": "no-store, no-transform" } });
});
