import { completeUpload } from "@/lib/photos/complete";
import { parsePhotoId } from "@/lib/photos/params";
import { PhotoPoolBusy } from "@/lib/photos/pool";
import { errorResponse, route } from "@/lib/http/route";

// Step 3 of the photo upload flow: check, process and keep the uploaded photo, or refuse it
// (400 photo_refused). When the photo pool is full it answers 503 busy with Retry-After (RFC 9110,
// section 10.2.3), which the phone's outbox retries like any passing fault.
export const POST = route<undefined, undefined, { id: string }>({ roles: ["volunteer"] }, async ({ actor, params }) => {
  try {
    return await completeUpload(actor, parsePhotoId(params.id));
  } catch (error) {
    if (!(error instanceof PhotoPoolBusy)) throw error;
    const busy = errorResponse(error);
    busy.headers.set("Retry-After", String(error.retryAfterSeconds));
    return busy;
  }
});
