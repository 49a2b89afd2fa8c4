import "server-only";
import sharp, { type Sharp } from "sharp";
import { HEIC_UNSUPPORTED, canDecodeHeic } from "./codecs";
import { MAX_PHOTO_PIXELS } from "./contract";
import type { InspectedPhoto } from "./inspect";
import { PhotoRefusal } from "./refusal";

export const DISPLAY_EDGE = 1600;
export const THUMBNAIL_EDGE = 320;

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
 * Turns an inspected upload into the two images we serve: oriented from EXIF, converted to
 * sRGB, flattened onto white (JPEG has no alpha), and with every piece of metadata dropped
 * (EXIF with GPS, XMP, IPTC, ICC): sharp writes none unless asked to with keep or with methods.
 */
export async function processPhoto(bytes: Uint8Array, inspected: InspectedPhoto): Promise<ProcessedPhoto> {
  const hevc = inspected.compression === "hevc";
  if (hevc && !canDecodeHeic()) throw new PhotoRefusal(HEIC_UNSUPPORTED);
  // The pixel limit again, in case a caller skipped inspectPhoto; failOn "warning" is sharp's
  // advice for untrusted input (truncated or corrupt data is refused rather than half-decoded).
  const base = sharp(bytes, { limitInputPixels: MAX_PHOTO_PIXELS, failOn: "warning" })
    .rotate()
    .flatten({ background: "#ffffff" })
    .toColourspace("srgb");
  try {
    const [display, thumbnail] = await Promise.all([render(base, DISPLAY_EDGE, 82), render(base, THUMBNAIL_EDGE, 75)]);
    return { display, thumbnail };
  } catch (error) {
    if (hevc) throw new PhotoRefusal(HEIC_UNSUPPORTED);
    if (error instanceof Error && /pixel limit/i.test(error.message)) {
      throw new PhotoRefusal(`Photos can be at most ${MAX_PHOTO_PIXELS / 1_000_000} megapixels.`);
    }
    throw new PhotoRefusal("This photo is damaged or incomplete and could not be processed.");
  }
}
