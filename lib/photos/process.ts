import "server-only";
import sharp, { type Sharp, type SharpOptions } from "sharp";
import { canDecodeHeic } from "./codecs";
import { MAX_PHOTO_PIXELS } from "./contract";
import { decodeHeic } from "./heic";
import type { InspectedPhoto } from "./inspect";
import { PhotoRefusal } from "./refusal";

export const DISPLAY_EDGE = 1600;
export const THUMBNAIL_EDGE = 320;
export const HEIC_UNREADABLE = "This HEIC photo is damaged or in a form we cannot read; please share it as JPEG.";

export type Rendition = { bytes: Buffer; width: number; height: number; contentType: "image/jpeg" };
export type ProcessedPhoto = { display: Rendition; thumbnail: Rendition };

async function render(base: Sharp, edge: number, quality: number): Promise<Rendition> {
  const { data, info } = await base
    .clone()
    .resize({ width: edge, height: edge, fit: "inside", withoutEnlargement: true })
    .jpeg({ quality, mozjpeg: true })
    .toBuffer({ resolveWithObject: true });
  return { bytes: data, width: info.width, height: info.height, contentType: "image/jpeg" };
}

/**
 * The upload as sharp input. HEVC HEIC that this server's libvips cannot decode is decoded by
 * libheif-js to raw RGBA, already turned by its irot/imir boxes; only those pixels reach sharp,
 * so none of the file's metadata can travel with them.
 */
async function source(bytes: Uint8Array, inspected: InspectedPhoto): Promise<Sharp> {
  // The pixel limit again, in case a caller skipped inspectPhoto; failOn "warning" is sharp's
  // advice for untrusted input (truncated or corrupt data is refused rather than half-decoded).
  const options: SharpOptions = { limitInputPixels: MAX_PHOTO_PIXELS, failOn: "warning" };
  if (inspected.compression !== "hevc" || canDecodeHeic()) return sharp(bytes, options);
  const decoded = await decodeHeic(bytes).catch((error: unknown) => {
    console.error("[turnstone] HEIC decode failed", error instanceof Error ? error.message : error);
    throw new PhotoRefusal(HEIC_UNREADABLE);
  });
  return sharp(decoded.data, { ...options, raw: { width: decoded.width, height: decoded.height, channels: decoded.channels } });
}

/**
 * Turns an inspected upload into the two images we serve: oriented (EXIF orientation, or HEIF's
 * irot/imir), converted to sRGB, flattened onto white (JPEG has no alpha), and with every piece
 * of metadata dropped (EXIF with GPS, XMP, IPTC, ICC): sharp writes none unless asked to.
 */
export async function processPhoto(bytes: Uint8Array, inspected: InspectedPhoto): Promise<ProcessedPhoto> {
  const base = (await source(bytes, inspected)).rotate().flatten({ background: "#ffffff" }).toColourspace("srgb");
  try {
    const [display, thumbnail] = await Promise.all([render(base, DISPLAY_EDGE, 82), render(base, THUMBNAIL_EDGE, 75)]);
    return { display, thumbnail };
  } catch (error) {
    if (error instanceof Error && /pixel limit/i.test(error.message)) {
      throw new PhotoRefusal(`Photos can be at most ${MAX_PHOTO_PIXELS / 1_000_000} megapixels.`);
    }
    throw new PhotoRefusal("This photo is damaged or incomplete and could not be processed.");
  }
}
