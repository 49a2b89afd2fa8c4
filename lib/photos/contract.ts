import { z } from "zod";
import { MAX_PHOTO_BYTES } from "./protocol";

// The wire format of the photo upload flow, shared by the phone and the server:
// 1. POST /api/field/photos            { id, visitId, sightingId, contentType, bytes } -> { uploadUrl, headers, expiresAt }
// 2. PUT  uploadUrl                     (the file itself, straight to the object store)
// 3. POST /api/field/photos/{id}/complete -> { photo: { id, status: "ready", width, height } } or 400 { error } when refused
// 4. GET  /api/photos/{id}?size=thumbnail|display -> 302 to a short-lived signed URL, for people allowed to see it
// Besides the generic errors (400 invalid, 401, 403, 404), the flow answers with photoErrorCodes:
// 400 photo_refused (final for that id: the file is not kept, the message says why),
// 400 photo_not_uploaded (step 3 before the PUT landed: upload again),
// 409 photo_already_uploaded (step 1 for a photo that is already ready; step 3 then answers 200 again), and
// 503 photo_busy with Retry-After (step 3 while the server's photo pool is full: nothing was judged, send again later).

export * from "./protocol";

export const photoUploadRequest = z.object({
  id: z.uuid({ message: "The photo id must be a UUID." }),
  visitId: z.uuid({ message: "The photo must belong to a walk." }),
  sightingId: z.uuid().nullable().optional(),
  contentType: z.string().max(100),
  bytes: z
    .number()
    .int()
    .min(1, { message: "The file is empty." })
    .max(MAX_PHOTO_BYTES, { message: "Photos can be at most 15 MB." }),
});
export type PhotoUploadRequest = z.infer<typeof photoUploadRequest>;
