import { NextResponse } from "next/server";
import { invalid } from "@/lib/errors";
import { route } from "@/lib/http/route";
import { applySyncBatch } from "@/lib/sync/apply-batch";
import { MAX_SYNC_BODY_BYTES } from "@/lib/sync/protocol";

async function readBatch(request: Request): Promise<unknown | NextResponse> {
  const text = await request.text();
  if (text.length > MAX_SYNC_BODY_BYTES) {
    return NextResponse.json({ error: { code: "too_large", message: "The sync batch is too large: send fewer items at a time." } }, { status: 413 });
  }
  try {
    return JSON.parse(text);
  } catch {
    throw invalid({ _: ["The request body is not valid JSON."] }, "The request body is not valid JSON.");
  }
}

/** The phone's outbox posts batches here; items are validated one by one (see lib/sync). */
export const POST = route({ roles: ["volunteer"] }, async ({ actor, request }) => {
  const body = await readBatch(request);
  if (body instanceof NextResponse) return body;
  const { status, response } = await applySyncBatch(actor, body);
  // no-transform: the answer is a short list of ids, not worth compressing on every sync.
  return NextResponse.json(response, { status, headers: { "Cache-Control": "no-store, no-transform" } });
});
