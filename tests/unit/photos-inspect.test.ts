import exifr from "exifr";
import { fileTypeFromBuffer } from "file-type";
import sharp from "sharp";
import { describe, expect, it } from "vitest";
import { canDecodeHeic } from "@/lib/photos/codecs";
import { MAX_PHOTO_BYTES } from "@/lib/photos/contract";
import { heifImageSizes } from "@/lib/photos/heif-header";
import { inspectPhoto } from "@/lib/photos/inspect";
import { DISPLAY_EDGE, HEIC_UNREADABLE, THUMBNAIL_EDGE, processPhoto } from "@/lib/photos/process";
import { PHOTO_REFUSED, PhotoRefusal } from "@/lib/photos/refusal";
import {
  HEIC_COLOURS,
  colourDistance,
  declaredHugePng,
  exifBlockOf,
  heicClaiming,
  paddedJpeg,
  pdfFile,
  phoneJpeg,
  phoneMirroredHeic,
  phonePortraitHeic,
  pixelAt,
  pixelBombPng,
  solidImage,
  svgDrawing,
  textFile,
  tinyHeic,
  zipFile,
} from "../support/images";

async function refusalOf(promise: Promise<unknown>): Promise<PhotoRefusal> {
  const error = await promise.then(
    () => undefined,
    (e: unknown) => e,
  );
  expect(error).toBeInstanceOf(PhotoRefusal);
  const refusal = error as PhotoRefusal;
  expect(refusal.status).toBe(400);
  expect(refusal.code).toBe(PHOTO_REFUSED);
  return refusal;
}

// File signatures per the JPEG, PNG, RIFF-WebP and ISO-BMFF (HEIF) specifications, as detected by
// file-type; dimensions from the header as sharp (libvips) reports them.
describe("inspectPhoto: what counts as a photo, by content alone", () => {
  it("accepts JPEG, PNG and WebP and reports their header dimensions", async () => {
    for (const [format, mime] of [
      ["jpeg", "image/jpeg"],
      ["png", "image/png"],
      ["webp", "image/webp"],
    ] as const) {
      const bytes = await solidImage(format, 64, 48);
      await expect(inspectPhoto(bytes)).resolves.toMatchObject({ contentType: mime, width: 64, height: 48, bytes: bytes.length });
    }
  });

  it("accepts an HEVC HEIC by its ISO-BMFF 'ftyp heic' box and reads its size without decoding", async () => {
    await expect(inspectPhoto(tinyHeic)).resolves.toMatchObject({ contentType: "image/heic", width: 64, height: 48, compression: "hevc" });
    // A phone photo stored 320 × 240 with irot: sharp (libheif) reports the size as shown.
    await expect(inspectPhoto(phonePortraitHeic)).resolves.toMatchObject({ contentType: "image/heic", width: 240, height: 320, compression: "hevc" });
  });

  it("reads every HEIF 'ispe' box (ISO/IEC 23008-12 image spatial extents), before rotation", () => {
    expect(heifImageSizes(phonePortraitHeic)).toEqual([{ width: 320, height: 240 }]);
    // tinyHeic is a grid: a 64 × 64 coded tile shown through a 64 × 48 grid image.
    expect(heifImageSizes(tinyHeic)).toEqual([
      { width: 64, height: 64 },
      { width: 64, height: 48 },
    ]);
    expect(heifImageSizes(heicClaiming(12_000, 4_000))).toEqual([{ width: 12_000, height: 4_000 }]);
    expect(heifImageSizes(phonePortraitHeic.subarray(0, 40))).toEqual([]);
    expect(heifImageSizes(textFile)).toEqual([]);
  });

  it("refuses a HEIC whose ispe claims more than 40 MP from the header alone, before libheif reads it", async () => {
    // The HEVC data is still 320 × 240: only the declared size is a bomb.
    expect((await refusalOf(inspectPhoto(heicClaiming(10_000, 5_000)))).message).toBe(
      "This image is 10000 × 5000 pixels (50 megapixels); photos can be at most 40 megapixels.",
    );
    // Beyond libheif's own limits, sharp's header read would fail as "damaged": this message
    // shows the ispe check answered first.
    expect((await refusalOf(inspectPhoto(heicClaiming(100_000, 100_000)))).message).toMatch(/^This image is 100000 × 100000 pixels \(10000 megapixels\)/);
    // Under the limit the claim passes inspection (decoding would then find the mismatch).
    await expect(inspectPhoto(heicClaiming(6_000, 6_000))).resolves.toMatchObject({ width: 6_000, height: 6_000 });
  });

  it("refuses a HEIF that declares no size at all as damaged", async () => {
    const noIspe = Buffer.from(phonePortraitHeic);
    noIspe.write("xxxx", noIspe.indexOf("ispe"), "latin1");
    expect((await refusalOf(inspectPhoto(noIspe))).message).toBe("This photo is damaged or incomplete and could not be read.");
  });

  it("refuses a text file whatever it is called", async () => {
    const refusal = await refusalOf(inspectPhoto(textFile));
    expect(refusal.message).toBe("This is a text file, not a photo: please share a JPEG, PNG, WebP or HEIC photo.");
  });

  it("refuses PDF documents and ZIP archives, naming what they are", async () => {
    // Guard the fixtures themselves: file-type must see them as what they claim to be.
    expect((await fileTypeFromBuffer(pdfFile))?.ext).toBe("pdf");
    expect((await fileTypeFromBuffer(zipFile))?.ext).toBe("zip");
    expect((await refusalOf(inspectPhoto(pdfFile))).message).toMatch(/^PDF documents are not accepted/);
    expect((await refusalOf(inspectPhoto(zipFile))).message).toMatch(/^ZIP archives are not accepted/);
  });

  it("refuses SVG (it can carry scripts) with its own message", async () => {
    expect((await refusalOf(inspectPhoto(svgDrawing))).message).toBe("SVG drawings are not accepted: please share a JPEG, PNG, WebP or HEIC photo.");
    const bare = Buffer.from(`<svg xmlns="http://www.w3.org/2000/svg"><circle r="4"/></svg>`);
    expect((await refusalOf(inspectPhoto(bare))).message).toMatch(/^SVG drawings are not accepted/);
  });

  it("refuses GIF, an image type outside the allow-list", async () => {
    expect((await refusalOf(inspectPhoto(await solidImage("gif")))).message).toMatch(/^GIF images are not accepted/);
  });

  it("refuses bytes of no known type, and a JPEG signature with nothing readable after it", async () => {
    const noise = Buffer.from([0x00, 0x01, 0x02, 0x03, 0xfe, 0x00, 0x10, 0x20, 0x00, 0x00, 0x7f, 0x00]);
    expect((await refusalOf(inspectPhoto(noise))).message).toMatch(/^This file is not a photo we recognise/);
    const truncated = (await solidImage("jpeg")).subarray(0, 20);
    expect((await refusalOf(inspectPhoto(truncated))).message).toMatch(/damaged or incomplete/);
  });

  it("refuses an empty file and a 20 MB file (the limit is 15 MB)", async () => {
    expect((await refusalOf(inspectPhoto(Buffer.alloc(0)))).message).toBe("The file is empty.");
    const big = await paddedJpeg(20 * 1024 * 1024);
    expect((await refusalOf(inspectPhoto(big))).message).toBe("Photos can be at most 15.0 MB; this file is 20.0 MB.");
    // Just under the limit passes the size check and is judged on content.
    await expect(inspectPhoto(await paddedJpeg(MAX_PHOTO_BYTES))).resolves.toMatchObject({ contentType: "image/jpeg" });
  });

  it("refuses a 50-megapixel PNG that is only ~150 KB on disk (a decompression bomb)", async () => {
    const bomb = await pixelBombPng();
    expect(bomb.length).toBeLessThan(1024 * 1024);
    expect((await refusalOf(inspectPhoto(bomb))).message).toBe(
      "This image is 10000 × 5000 pixels (50 megapixels); photos can be at most 40 megapixels.",
    );
  });

  it("refuses a hand-built PNG whose IHDR declares 20000 × 20000 from its header alone", async () => {
    const bomb = declaredHugePng();
    expect(bomb.length).toBeLessThan(200);
    expect((await refusalOf(inspectPhoto(bomb))).message).toMatch(/^This image is 20000 × 20000 pixels \(400 megapixels\)/);
  });
});

describe("processPhoto: what we keep", () => {
  it("applies EXIF orientation and drops EXIF, GPS, XMP and ICC (read back with exifr, a well-known EXIF reader)", async () => {
    const input = await phoneJpeg();
    // The fixture really carries what we mean to strip.
    expect(await exifr.gps(input)).toEqual({ latitude: 51.5, longitude: -1.25 });
    expect(await exifr.parse(input, { xmp: true })).toMatchObject({ Make: "FieldCam", Orientation: "Rotate 90 CW" });

    const inspected = await inspectPhoto(input);
    expect([inspected.width, inspected.height]).toEqual([100, 50]); // as stored, before orientation
    const { display, thumbnail } = await processPhoto(input, inspected);

    for (const out of [display, thumbnail]) {
      expect(await exifr.gps(out.bytes)).toBeUndefined();
      expect(await exifr.parse(out.bytes, { tiff: true, xmp: true, iptc: true, icc: true })).toBeUndefined();
      const meta = await sharp(out.bytes).metadata();
      expect(meta.format).toBe("jpeg");
      expect(meta.exif).toBeUndefined();
      expect(meta.xmp).toBeUndefined();
      expect(meta.iptc).toBeUndefined();
      expect(meta.icc).toBeUndefined();
      expect(meta.space).toBe("srgb");
    }
    // Orientation 6 means "rotate 90° clockwise to view": 100 × 50 stored, 50 × 100 seen.
    expect([display.width, display.height]).toEqual([50, 100]);
    expect(display.width).toBeLessThanOrEqual(DISPLAY_EDGE);
  });

  it("scales large photos to a 1600 px display and a 320 px thumbnail, keeping the aspect ratio", async () => {
    const big = await sharp({ create: { width: 4000, height: 3000, channels: 3, background: "#557799" } }).jpeg().toBuffer();
    const { display, thumbnail } = await processPhoto(big, await inspectPhoto(big));
    expect([display.width, display.height]).toEqual([DISPLAY_EDGE, 1200]);
    expect([thumbnail.width, thumbnail.height]).toEqual([THUMBNAIL_EDGE, 240]);
    expect((await sharp(thumbnail.bytes).metadata()).format).toBe("jpeg");
  });

  it("flattens transparent PNG and WebP onto white JPEG", async () => {
    for (const format of ["png", "webp"] as const) {
      const input = await solidImage(format, 64, 48);
      const { display } = await processPhoto(input, await inspectPhoto(input));
      const meta = await sharp(display.bytes).metadata();
      expect(meta.format).toBe("jpeg");
      expect(meta.hasAlpha).toBe(false);
      expect([display.width, display.height]).toEqual([64, 48]); // never enlarged
    }
  });

  it("still refuses a pixel bomb if inspection were skipped (sharp's limitInputPixels)", async () => {
    const bomb = await pixelBombPng();
    const pretend = { contentType: "image/png", width: 10, height: 10, bytes: bomb.length } as const;
    expect((await refusalOf(processPhoto(bomb, pretend))).message).toBe("Photos can be at most 40 megapixels.");
  });

  it("decodes HEVC HEIC with libheif-js where libvips cannot, and says which path it takes", async () => {
    // The capability check must agree with what sharp actually does with a real HEVC HEIC.
    const sharpDecodes = await sharp(tinyHeic).toBuffer().then(
      () => true,
      () => false,
    );
    expect(canDecodeHeic()).toBe(sharpDecodes);
    const { display, thumbnail } = await processPhoto(tinyHeic, await inspectPhoto(tinyHeic));
    expect([display.width, display.height, thumbnail.width, thumbnail.height]).toEqual([64, 48, 64, 48]);
  });

  it("keeps a phone HEIC's pixels as shown (irot applied) and none of its EXIF, GPS included", async () => {
    // The fixture really carries what we mean to strip (its EXIF block read with exifr).
    expect(await exifr.gps(exifBlockOf(phonePortraitHeic))).toEqual({ latitude: 51.5, longitude: -1.25 });
    expect(await exifr.parse(exifBlockOf(phonePortraitHeic))).toMatchObject({ Make: "FieldCam", Orientation: "Rotate 90 CW" });

    const { display, thumbnail } = await processPhoto(phonePortraitHeic, await inspectPhoto(phonePortraitHeic));
    for (const out of [display, thumbnail]) {
      expect(await exifr.gps(out.bytes)).toBeUndefined();
      expect(await exifr.parse(out.bytes, { tiff: true, xmp: true, iptc: true, icc: true })).toBeUndefined();
      const meta = await sharp(out.bytes).metadata();
      expect([meta.format, meta.exif, meta.icc, meta.space]).toEqual(["jpeg", undefined, undefined, "srgb"]);
      // Stored 320 × 240 landscape; irot turns it 90° clockwise once (not twice, though its
      // EXIF Orientation says the same again): 240 × 320 portrait.
      expect([out.width, out.height]).toEqual([240, 320]);
    }
    // The red block stored at the top left is now at the top right, the green one bottom right.
    // HEVC and JPEG are lossy: each channel within 12 of the encoded value.
    expect(colourDistance(await pixelAt(display.bytes, 210, 40), HEIC_COLOURS.red)).toBeLessThanOrEqual(12);
    expect(colourDistance(await pixelAt(display.bytes, 210, 280), HEIC_COLOURS.green)).toBeLessThanOrEqual(12);
    expect(colourDistance(await pixelAt(display.bytes, 30, 40), HEIC_COLOURS.background)).toBeLessThanOrEqual(12);
  });

  it("applies a HEIC's imir (mirror) as well", async () => {
    const { display } = await processPhoto(phoneMirroredHeic, await inspectPhoto(phoneMirroredHeic));
    expect([display.width, display.height]).toEqual([320, 240]);
    expect(colourDistance(await pixelAt(display.bytes, 40, 30), HEIC_COLOURS.green)).toBeLessThanOrEqual(12);
    expect(colourDistance(await pixelAt(display.bytes, 280, 30), HEIC_COLOURS.red)).toBeLessThanOrEqual(12);
  });

  it("refuses a HEIC that cannot be decoded with a clear message, even if inspection were skipped", async () => {
    const pretend = { contentType: "image/heic", width: 240, height: 320, bytes: 1, compression: "hevc" } as const;
    // Cut off inside the HEVC data, and a header that claims 50 MP over 320 × 240 of data.
    expect((await refusalOf(processPhoto(phonePortraitHeic.subarray(0, 700), pretend))).message).toBe(HEIC_UNREADABLE);
    expect((await refusalOf(processPhoto(heicClaiming(10_000, 5_000), pretend))).message).toBe(HEIC_UNREADABLE);
  });
});
