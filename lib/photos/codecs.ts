import "server-only";
import sharp from "sharp";

/**
 * Whether this server's libvips can decode HEVC-coded HEIF (the usual iPhone HEIC).
 * sharp's prebuilt libvips ships libheif with the AV1 decoder only (HEVC is patent-encumbered),
 * and then lists just ".avif" as a heif input suffix; a build with an HEVC decoder lists ".heic".
 */
export function canDecodeHeic(): boolean {
  return sharp.format.heif?.input.fileSuffix?.includes(".heic") ?? false;
}

export const HEIC_UNSUPPORTED = "HEIC photos cannot be processed on this server yet; please share as JPEG.";
