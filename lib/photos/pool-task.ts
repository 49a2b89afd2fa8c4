// The task the photo pool runs on its threads (loaded through pool-entry.mjs): inspect the
// upload, decode it and write the two renditions. Everything here may take seconds of CPU (a
// 12 MP HEIC through libheif-js), which is why it never runs on a request's event loop.
import { inspectPhoto, type AcceptedPhotoType } from "./inspect";
import { waitAtGate, type HoldGate } from "./pool-hold";
import { processPhoto } from "./process";
import { isPhotoRefusal } from "./refusal";

export type PhotoTask = { bytes: Uint8Array; hold?: HoldGate };

/** One encoded image; its bytes arrive in the calling thread as a plain Uint8Array. */
export type PooledRendition = { bytes: Uint8Array; width: number; height: number; contentType: "image/jpeg" };

/**
 * What the pool found. A refusal comes back as a value, since an Error crossing threads loses its
 * class; anything thrown is a fault of ours and leaves the photo awaiting its retry.
 */
export type Judgement =
  | { kind: "ready"; contentType: AcceptedPhotoType; bytes: number; display: PooledRendition; thumbnail: PooledRendition }
  | { kind: "refused"; reason: string };

export default async function judgePhoto({ bytes, hold }: PhotoTask): Promise<Judgement> {
  if (hold) waitAtGate(hold);
  try {
    const inspected = await inspectPhoto(bytes);
    const { display, thumbnail } = await processPhoto(bytes, inspected);
    return { kind: "ready", contentType: inspected.contentType, bytes: inspected.bytes, display, thumbnail };
  } catch (error) {
    if (isPhotoRefusal(error)) return { kind: "refused", reason: error.message };
    throw error;
  }
}
