// The photo upload flow's constants and shapes without zod, for the phone's bundle: the field
// pages have a JavaScript budget, and a validator there would spend a sixth of it.
// The flow itself is described in ./contract.ts, which adds the server's zod schema.

export const MAX_PHOTO_BYTES = 15 * 1024 * 1024;
export const MAX_PHOTO_PIXELS = 40_000_000;
export const acceptedPhotoTypes = ["image/jpeg", "image/png", "image/webp", "image/heic", "image/heif"] as const;

export type PhotoUploadTicket = { id: string; uploadUrl: string; headers: Record<string, string>; expiresAt: string };
export type PhotoReady = { photo: { id: string; status: "ready"; width: number; height: number } };

export const photoErrorCodes = {
  refused: "photo_refused",
  notUploaded: "photo_not_uploaded",
  alreadyUploaded: "photo_already_uploaded",
  busy: "photo_busy",
} as const;
