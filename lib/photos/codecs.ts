import "server-only";
import sharp from "sharp";

/**
 * Whether this server's libvips can decode HEVC-coded HEIF (the usual phone HEIC) itself.
 * sharp's prebuilt libvips ships libheif with the AV1 decoder only (HEVC is patent-encumbered),
 * and then lists just ".avif" as a heif input suffix; a build with an HEVC decoder lists ".heic".
 * When it cannot, process.ts decodes HEVC with libheif-js (heic.ts) instead.
 */
export function canDecodeHeic(): boolean {
  return sharp.format.heif?.input.fileSuffix?.includes(".heic") ?? false;
}
