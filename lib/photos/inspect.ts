import "server-only";
import { fileTypeFromBuffer } from "file-type";
import sharp, { type Metadata } from "sharp";
import { MAX_PHOTO_BYTES, MAX_PHOTO_PIXELS, acceptedPhotoTypes } from "./contract";
import { heifImageSizes } from "./heif-header";
import { PhotoRefusal, megabytes } from "./refusal";

export type AcceptedPhotoType = (typeof acceptedPhotoTypes)[number];

export type InspectedPhoto = {
  contentType: AcceptedPhotoType;
  width: number;
  height: number;
  bytes: number;
  /** "hevc" or "av1" for HEIF files, so HEVC can go to a decoder that reads it (process.ts). */
  compression?: string;
};

const ACCEPT_HINT = "please share a JPEG, PNG, WebP or HEIC photo";

// The libvips loader each sniffed type must agree with; a mismatch means a disguised or broken file.
const loaderFor: Record<AcceptedPhotoType, string> = {
  "image/jpeg": "jpeg",
  "image/png": "png",
  "image/webp": "webp",
  "image/heic": "heif",
  "image/heif": "heif",
};

const describedTypes: Record<string, string> = {
  gif: "GIF images",
  pdf: "PDF documents",
  zip: "ZIP archives",
  avif: "AVIF images",
  tif: "TIFF images",
  bmp: "BMP images",
  xml: "XML documents",
};

function isAccepted(mime: string): mime is AcceptedPhotoType {
  return (acceptedPhotoTypes as readonly string[]).includes(mime);
}

function head(bytes: Uint8Array, length = 4096): string {
  return Buffer.from(bytes.buffer, bytes.byteOffset, Math.min(bytes.byteLength, length)).toString("utf8");
}

function looksLikeSvg(bytes: Uint8Array): boolean {
  return /<svg[\s>]/i.test(head(bytes));
}

// No NUL bytes and no other control characters but tab, CR, LF: treat as text.
function looksLikeText(bytes: Uint8Array): boolean {
  const sample = bytes.subarray(0, 4096);
  return sample.every((b) => b === 9 || b === 10 || b === 13 || b >= 32);
}

async function sniffType(bytes: Uint8Array): Promise<AcceptedPhotoType> {
  // By content only: the file name and the type the phone claims are never trusted.
  const detected = await fileTypeFromBuffer(bytes);
  if (detected && isAccepted(detected.mime)) return detected.mime;
  if ((!detected || detected.ext === "xml") && looksLikeSvg(bytes)) {
    throw new PhotoRefusal(`SVG drawings are not accepted: ${ACCEPT_HINT}.`);
  }
  if (detected) {
    const what = describedTypes[detected.ext] ?? `${detected.ext.toUpperCase()} files`;
    throw new PhotoRefusal(`${what} are not accepted: ${ACCEPT_HINT}.`);
  }
  if (looksLikeText(bytes)) throw new PhotoRefusal(`This is a text file, not a photo: ${ACCEPT_HINT}.`);
  throw new PhotoRefusal(`This file is not a photo we recognise: ${ACCEPT_HINT}.`);
}

const DAMAGED = "This photo is damaged or incomplete and could not be read.";

function refuseIfTooManyPixels(width: number, height: number): void {
  if (width * height > MAX_PHOTO_PIXELS) {
    const megapixels = Math.round((width * height) / 1_000_000);
    throw new PhotoRefusal(
      `This image is ${width} × ${height} pixels (${megapixels} megapixels); photos can be at most ${MAX_PHOTO_PIXELS / 1_000_000} megapixels.`,
    );
  }
}

/**
 * HEIF declares a size for every coded image (the photo, its grid tiles, thumbnails, depth maps)
 * in 'ispe' boxes, before any crop or rotation. The largest must fit, whatever size libheif
 * would report for the cropped primary, and a file that declares none is not valid HEIF.
 */
function refuseOversizedHeif(bytes: Uint8Array): void {
  const sizes = heifImageSizes(bytes);
  if (sizes.length === 0) throw new PhotoRefusal(DAMAGED);
  const largest = sizes.reduce((a, b) => (b.width * b.height > a.width * a.height ? b : a));
  refuseIfTooManyPixels(largest.width, largest.height);
}

/**
 * Decides whether bytes are a photo we accept, without decoding any pixels: type by file
 * signature, then size and dimensions from the header, so decompression bombs never get decoded.
 * Throws PhotoRefusal with a message for the volunteer.
 */
export async function inspectPhoto(bytes: Uint8Array): Promise<InspectedPhoto> {
  if (bytes.byteLength === 0) throw new PhotoRefusal("The file is empty.");
  if (bytes.byteLength > MAX_PHOTO_BYTES) {
    throw new PhotoRefusal(`Photos can be at most ${megabytes(MAX_PHOTO_BYTES)}; this file is ${megabytes(bytes.byteLength)}.`);
  }
  const contentType = await sniffType(bytes);
  if (loaderFor[contentType] === "heif") refuseOversizedHeif(bytes);

  let meta: Metadata;
  try {
    // metadata() reads the header only, so sharp's own pixel limit can be lifted here: we
    // compare the declared size with ours below and report it instead of a generic failure.
    meta = await sharp(bytes, { limitInputPixels: false }).metadata();
  } catch {
    throw new PhotoRefusal(DAMAGED);
  }
  const { width, height } = meta;
  if (meta.format !== loaderFor[contentType] || !width || !height) throw new PhotoRefusal(DAMAGED);
  refuseIfTooManyPixels(width, height);
  return { contentType, width, height, bytes: bytes.byteLength, ...(meta.compression ? { compression: meta.compression } : {}) };
}
