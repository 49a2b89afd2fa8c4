import { completeUpload } from "@/lib/photos/complete";
import { parsePhotoId } from "@/lib/photos/params";
import { route } from "@/lib/http/route";

// Step 3 of the photo upload flow: check, process and keep the uploaded photo, or refuse it (400 photo_refused).
export const POST = route<undefined, undefined, { id: string }>({ roles: ["volunteer"] }, async ({ actor, params }) =>
  completeUpload(actor, parsePhotoId(params.id)),
);
