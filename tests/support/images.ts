// Test images made at run time with sharp (and a few hand-built byte strings), plus the real
// phone HEICs in tests/fixtures, which sharp cannot make (see tests/fixtures/README.md).
import { readFileSync } from "node:fs";
import { crc32, deflateSync } from "node:zlib";
import sharp from "sharp";

export const GPS_EXIF = {
  IFD0: { Make: "FieldCam", Model: "FC-1", Copyright: "Jo Recorder", Artist: "Jo Recorder" },
  // libvips names the GPS directory IFD3; rationals are written as "numerator/denominator".
  IFD3: { GPSLatitudeRef: "N", GPSLatitude: "51/1 30/1 0/1", GPSLongitudeRef: "W", GPSLongitude: "1/1 15/1 0/1" },
};

const XMP = `<x:xmpmeta xmlns:x="adobe:ns:meta/"><rdf:RDF xmlns:rdf="http://www.w3.org/1999/02/22-rdf-syntax-ns#"><rdf:Description rdf:about="" xmlns:dc="http://purl.org/dc/elements/1.1/"><dc:creator><rdf:Seq><rdf:li>Jo Recorder</rdf:li></rdf:Seq></dc:creator></rdf:Description></rdf:RDF></x:xmpmeta>`;

/** A 100 × 50 JPEG as a phone held sideways writes it: EXIF orientation 6, GPS position, XMP creator. */
export async function phoneJpeg(): Promise<Buffer> {
  return sharp({ create: { width: 100, height: 50, channels: 3, background: "#3c7a4a" } })
    .withExif(GPS_EXIF)
    .withMetadata({ orientation: 6 })
    .withXmp(XMP)
    .jpeg({ quality: 90 })
    .toBuffer();
}

export async function solidImage(format: "png" | "webp" | "jpeg" | "gif", width = 64, height = 48): Promise<Buffer> {
  return sharp({ create: { width, height, channels: 4, background: { r: 200, g: 120, b: 40, alpha: 0.5 } } })
    .toFormat(format)
    .toBuffer();
}

/** A real decompression bomb: 10000 × 5000 (50 MP) of one colour compresses to about 150 KB. */
let bomb: Promise<Buffer> | undefined;
export function pixelBombPng(): Promise<Buffer> {
  // Made once per test file: encoding 50 MP takes a couple of seconds.
  bomb ??= sharp({ create: { width: 10_000, height: 5_000, channels: 3, background: "#888888" } })
    .png({ compressionLevel: 9 })
    .toBuffer();
  return bomb;
}

function pngChunk(type: string, data: Buffer): Buffer {
  const typed = Buffer.concat([Buffer.from(type, "latin1"), data]);
  const length = Buffer.alloc(4);
  length.writeUInt32BE(data.length);
  const crc = Buffer.alloc(4);
  crc.writeUInt32BE(crc32(typed));
  return Buffer.concat([length, typed, crc]);
}

/** A hand-built PNG (signature, IHDR, a scrap of IDAT, IEND) that declares huge dimensions. */
export function declaredHugePng(width = 20_000, height = 20_000): Buffer {
  const ihdr = Buffer.alloc(13);
  ihdr.writeUInt32BE(width, 0);
  ihdr.writeUInt32BE(height, 4);
  ihdr.set([8, 2, 0, 0, 0], 8); // 8-bit RGB, deflate, no filter, no interlace
  return Buffer.concat([
    Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]),
    pngChunk("IHDR", ihdr),
    pngChunk("IDAT", deflateSync(Buffer.alloc(3 * 64))),
    pngChunk("IEND", Buffer.alloc(0)),
  ]);
}

/** A real JPEG padded with zeros to the given size (decoders ignore trailing bytes). */
export async function paddedJpeg(totalBytes: number): Promise<Buffer> {
  const jpeg = await solidImage("jpeg");
  return Buffer.concat([jpeg, Buffer.alloc(totalBytes - jpeg.length)]);
}

export const svgDrawing = Buffer.from(
  `<?xml version="1.0"?>\n<svg xmlns="http://www.w3.org/2000/svg" width="10" height="10"><script>alert(1)</script><rect width="10" height="10"/></svg>`,
);
export const textFile = Buffer.from("Transect notes: 3 meadow browns at section 4.\nNot a photo at all.\n");
export const pdfFile = Buffer.from("%PDF-1.4\n1 0 obj << /Type /Catalog >> endobj\ntrailer << /Root 1 0 R >>\n%%EOF\n");
/** An empty ZIP archive: just the end-of-central-directory record after a local file header signature. */
export const zipFile = Buffer.concat([
  Buffer.from([0x50, 0x4b, 0x03, 0x04, 0x14, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 1, 0, 0, 0]),
  Buffer.from("a"),
  Buffer.from([0x50, 0x4b, 0x05, 0x06, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0]),
]);

/**
 * A real 64 × 48 HEVC-coded HEIC (490 bytes), made once with libheif's heif-enc (x265) because
 * sharp's prebuilt libvips cannot encode HEVC.
 */
export const tinyHeic = Buffer.from(
  "AAAAHGZ0eXBoZWljAAAAAG1pZjFoZWljbWlhZgAAAa1tZXRhAAAAAAAAACFoZGxyAAAAAAAAAABwaWN0AAAAAAAAAAAAAAAAAAAAAA5waXRtAAAAAAACAAAAEGlkYXQAAAAAAEAAMAAAADhpbG9jAQAAAERAAAIAAQAAAAAAAAHRAAEAAAAAAAAAGQACAAEAAAAAAAAAAQAAAAAAAAAIAAAAOGlpbmYAAAAAAAIAAAAVaW5mZQIAAAEAAQAAaHZjMQAAAAAVaW5mZQIAAAAAAgAAZ3JpZAAAAADYaXBycAAAALZpcGNvAAAAdmh2Y0MBA3AAAAAAAAAAAAAe8AD8/fj4AAAPAyAAAQAYQAEMAf//A3AAAAMAkAAAAwAAAwAeugJAIQABACpCAQEDcAAAAwCQAAADAAADAB6gIIEFlurkprm4EBAwIAAAAwAgAAADACEiAAEABkQBwXPAiQAAABRpc3BlAAAAAAAAAEAAAABAAAAAFGlzcGUAAAAAAAAAQAAAADAAAAAQcGl4aQAAAAADCAgIAAAAGmlwbWEAAAAAAAAAAgABAoECAAICA4QAAAAaaXJlZgAAAAAAAAAOZGltZwACAAEAAQAAACFtZGF0AAAAFSgBrxmA70mlv/+XLf9mTv5+taY+bg==",
  "base64",
);

function fixture(name: string): Buffer {
  return readFileSync(new URL(`../fixtures/${name}`, import.meta.url));
}

/**
 * Real HEVC HEICs as phones write them (tests/fixtures/README.md): 320 × 240 as stored, blue-grey
 * with a red block at the top left and a green one at the top right, EXIF with GPS 51.5° N 1.25° W.
 * The portrait one carries irot (EXIF orientation 6: seen 240 × 320, red top right, green bottom
 * right); the mirrored one imir (EXIF orientation 2: seen 320 × 240, green top left, red top right).
 */
export const phonePortraitHeic = fixture("phone-portrait.heic");
export const phoneMirroredHeic = fixture("phone-mirrored.heic");
export const HEIC_COLOURS = { red: [220, 30, 30], green: [30, 200, 60], background: [60, 90, 160] } as const;

/**
 * A 12-megapixel (4032 × 3024) HEVC HEIC, the size phone cameras write, for timing the decode
 * (libheif-js takes about 0.4–2 s for it): a gradient with stripes and grain, EXIF with the same
 * GPS position. Made on Debian 12 (libheif-examples 1.15.1, x265) with
 * `node tests/fixtures/make-phone-12mp.mjs 12mp.png && heif-enc -q 50 -o tests/fixtures/phone-12mp.heic 12mp.png`
 * (the same two commands give the same bytes again).
 */
export const phone12mpHeic = fixture("phone-12mp.heic");

/**
 * The EXIF block inside a fixture HEIC, as the TIFF structure it is (big- or little-endian).
 * exifr's HEIF reader ignores the iloc base_offset that libheif 1.15 writes, so it finds no EXIF
 * in the file itself.
 */
export function exifBlockOf(heic: Buffer): Buffer {
  const starts = ["MM\0*", "II*\0"].map((header) => heic.indexOf(Buffer.from(header, "latin1"))).filter((at) => at >= 0);
  if (starts.length === 0) throw new Error("no TIFF header in this HEIC");
  return heic.subarray(Math.min(...starts));
}

/**
 * The portrait HEIC with its one 'ispe' box (ISO/IEC 23008-12 image spatial extents) rewritten
 * to claim width × height: a decompression bomb in header only, since the HEVC data stays 320 × 240.
 */
export function heicClaiming(width: number, height: number): Buffer {
  const bytes = Buffer.from(phonePortraitHeic);
  const ispe = bytes.indexOf(Buffer.from("ispe", "latin1"));
  if (ispe < 0 || bytes.indexOf(Buffer.from("ispe", "latin1"), ispe + 4) >= 0) throw new Error("expected exactly one ispe box");
  // After the type come version and flags (4 bytes), then width and height as 32-bit integers.
  bytes.writeUInt32BE(width, ispe + 8);
  bytes.writeUInt32BE(height, ispe + 12);
  return bytes;
}

/** The RGB of one pixel of an encoded image, after sharp decodes it. */
export async function pixelAt(image: Buffer, x: number, y: number): Promise<[number, number, number]> {
  const { data, info } = await sharp(image).removeAlpha().raw().toBuffer({ resolveWithObject: true });
  const at = (y * info.width + x) * info.channels;
  return [data[at]!, data[at + 1]!, data[at + 2]!];
}

/** The largest difference in any one channel between two RGB colours. */
export function colourDistance(a: readonly number[], b: readonly number[]): number {
  return Math.max(...a.map((value, i) => Math.abs(value - b[i]!)));
}
