import { randomUUID } from "node:crypto";
import { HeadObjectCommand } from "@aws-sdk/client-s3";
import { and, eq, ne } from "drizzle-orm";
import exifr from "exifr";
import { fileTypeFromBuffer } from "file-type";
import sharp from "sharp";
import { beforeAll, describe, expect, it } from "vitest";
import { db } from "@/db/client";
import { photos, sightings, users, visits } from "@/db/schema";
import type { Actor } from "@/lib/auth/guard";
import { env } from "@/lib/env";
import { completeUpload, PHOTO_NOT_UPLOADED } from "@/lib/photos/complete";
import { photoUploadRequest } from "@/lib/photos/contract";
import { photoKeys } from "@/lib/photos/keys";
import { photoViewUrl } from "@/lib/photos/links";
import { PHOTO_REFUSED } from "@/lib/photos/refusal";
import { PHOTO_ALREADY_UPLOADED, requestUploadTicket } from "@/lib/photos/tickets";
import { photoBucket, s3 } from "@/lib/storage/s3";
import {
  HEIC_COLOURS,
  colourDistance,
  declaredHugePng,
  exifBlockOf,
  heicClaiming,
  paddedJpeg,
  phoneJpeg,
  phonePortraitHeic,
  pixelAt,
  pixelBombPng,
  svgDrawing,
  textFile,
} from "../support/images";
import { resetToDemo } from "./support/db";

async function actorFor(email: string): Promise<Actor> {
  const [u] = await db().select().from(users).where(eq(users.email, email));
  return { id: u!.id, roles: u!.roles, name: u!.name, email: u!.email };
}

async function exists(key: string): Promise<boolean> {
  try {
    await s3().send(new HeadObjectCommand({ Bucket: photoBucket(), Key: key }));
    return true;
  } catch (error) {
    if ((error as { $metadata?: { httpStatusCode?: number } }).$metadata?.httpStatusCode === 404) return false;
    throw error;
  }
}

async function rowOf(id: string) {
  const [row] = await db().select().from(photos).where(eq(photos.id, id));
  return row!;
}

describe("field photos against the real database and S3 fake", () => {
  let volunteer: Actor;
  let otherVolunteer: Actor;
  let visitId: string;
  let sightingId: string;
  let otherVisitId: string;

  /** Steps 1 and 2 of the flow: ticket, then a PUT of the bytes straight to the store, as a phone does. */
  async function upload(bytes: Buffer, declared = bytes.length, name = "IMG_0001.jpg") {
    const id = randomUUID();
    const ticket = await requestUploadTicket(volunteer, { id, visitId, sightingId, contentType: "image/jpeg", bytes: declared });
    const put = await fetch(ticket.uploadUrl, { method: "PUT", headers: ticket.headers, body: new Uint8Array(bytes) });
    expect(put.status, `PUT of ${name}`).toBe(200);
    return { id, ticket };
  }

  async function expectRefused(id: string, message: string | RegExp) {
    const error = await completeUpload(volunteer, id).catch((e: unknown) => e);
    expect(error).toMatchObject({ status: 400, code: PHOTO_REFUSED });
    expect((error as Error).message).toMatch(message);
    const row = await rowOf(id);
    expect(row.status).toBe("refused");
    expect(row.refusalReason).toBe((error as Error).message);
    expect(row.displayKey).toBeNull();
    // Refused originals are not kept.
    expect(await exists(row.uploadKey)).toBe(false);
  }

  beforeAll(async () => {
    await resetToDemo();
    volunteer = await actorFor("volunteer01@harrowmere.example");
    otherVolunteer = await actorFor("volunteer02@harrowmere.example");
    const [withSighting] = await db()
      .select({ visitId: visits.id, sightingId: sightings.id })
      .from(visits)
      .innerJoin(sightings, eq(sightings.visitId, visits.id))
      .where(eq(visits.volunteerId, volunteer.id))
      .limit(1);
    visitId = withSighting!.visitId;
    sightingId = withSighting!.sightingId;
    const [other] = await db().select({ id: visits.id }).from(visits).where(eq(visits.volunteerId, otherVolunteer.id)).limit(1);
    otherVisitId = other!.id;
  });

  it("takes a phone JPEG through ticket, PUT and completion, and keeps only stripped, oriented images", async () => {
    const before = Date.now();
    const { id, ticket } = await upload(await phoneJpeg());
    // The URL points at the configured store (browsers upload there directly) and lasts ten minutes.
    expect(ticket.uploadUrl.startsWith(`${env().S3_ENDPOINT}/${photoBucket()}/originals/${visitId}/${id}`)).toBe(true);
    expect(new URL(ticket.uploadUrl).searchParams.get("X-Amz-Expires")).toBe("600");
    expect(Date.parse(ticket.expiresAt) - before).toBeGreaterThanOrEqual(599_000);
    expect((await rowOf(id)).status).toBe("awaiting_upload");

    const done = await completeUpload(volunteer, id);
    expect(done).toEqual({ photo: { id, status: "ready", width: 50, height: 100 } });

    const row = await rowOf(id);
    const keys = photoKeys(visitId, id);
    expect(row).toMatchObject({ status: "ready", contentType: "image/jpeg", displayKey: keys.display, thumbnailKey: keys.thumbnail, sightingId });
    expect(row.processedAt).toBeInstanceOf(Date);
    expect(await exists(keys.display)).toBe(true);
    expect(await exists(keys.thumbnail)).toBe(true);
    // The original carried the phone's GPS position; it is deleted once processed.
    expect(await exists(keys.original)).toBe(false);

    for (const size of ["display", "thumbnail"] as const) {
      const url = await photoViewUrl(volunteer, id, size);
      expect(new URL(url).searchParams.get("X-Amz-Expires")).toBe("300");
      const res = await fetch(url);
      expect(res.status).toBe(200);
      const body = Buffer.from(await res.arrayBuffer());
      expect((await fileTypeFromBuffer(body))?.mime).toBe("image/jpeg");
      // Read back with exifr, a well-known EXIF reader: no GPS, no EXIF, no XMP at all.
      expect(await exifr.gps(body)).toBeUndefined();
      expect(await exifr.parse(body, { tiff: true, xmp: true, iptc: true, icc: true })).toBeUndefined();
      const meta = await sharp(body).metadata();
      expect([meta.width, meta.height]).toEqual([50, 100]);
    }
  });

  it("is idempotent on the photo id: fresh tickets while pending, a fixed answer once processed", async () => {
    const bytes = await phoneJpeg();
    const { id } = await upload(bytes);
    // Asked again while pending, for no sighting this time: the same row, the phone's latest word.
    const again = await requestUploadTicket(volunteer, { id, visitId, sightingId: null, contentType: "image/jpeg", bytes: bytes.length });
    expect(again.id).toBe(id);
    expect((await db().select().from(photos).where(eq(photos.id, id))).map((p) => [p.status, p.sightingId])).toEqual([["awaiting_upload", null]]);

    // Two completions at once (a phone retrying on a flaky signal): the conditional final write makes them agree.
    const [first, second] = await Promise.all([completeUpload(volunteer, id), completeUpload(volunteer, id)]);
    expect(second).toEqual(first);
    await expect(completeUpload(volunteer, id)).resolves.toEqual(first);
    await expect(requestUploadTicket(volunteer, { id, visitId, sightingId, contentType: "image/jpeg", bytes: 10 })).rejects.toMatchObject({
      status: 409,
      code: PHOTO_ALREADY_UPLOADED,
    });
    const [mySecondVisit] = await db()
      .select({ id: visits.id })
      .from(visits)
      .where(and(eq(visits.volunteerId, volunteer.id), ne(visits.id, visitId)))
      .limit(1);
    await expect(requestUploadTicket(volunteer, { id, visitId: mySecondVisit!.id, contentType: "image/jpeg", bytes: 10 })).rejects.toMatchObject({
      status: 400,
      fieldErrors: { id: ["This photo is already on another walk."] },
    });
    await expect(requestUploadTicket(otherVolunteer, { id, visitId: otherVisitId, contentType: "image/jpeg", bytes: 10 })).rejects.toMatchObject({
      status: 400,
    });
  });

  it("refuses a text file named .jpg, an SVG, and pixel bombs at completion, with clear messages", async () => {
    await expectRefused((await upload(textFile, undefined, "notes.jpg")).id, /^This is a text file, not a photo/);
    await expectRefused((await upload(svgDrawing, undefined, "drawing.jpg")).id, /^SVG drawings are not accepted/);
    await expectRefused((await upload(declaredHugePng())).id, /^This image is 20000 × 20000 pixels \(400 megapixels\)/);
    await expectRefused((await upload(await pixelBombPng())).id, "This image is 10000 × 5000 pixels (50 megapixels); photos can be at most 40 megapixels.");
  });

  it("gives the same refusal when asked again, for completion and for a new ticket", async () => {
    const { id } = await upload(textFile);
    await expectRefused(id, /text file/);
    await expect(completeUpload(volunteer, id)).rejects.toMatchObject({ status: 400, code: PHOTO_REFUSED, message: expect.stringMatching(/text file/) });
    await expect(requestUploadTicket(volunteer, { id, visitId, sightingId, contentType: "image/jpeg", bytes: 100 })).rejects.toMatchObject({
      code: PHOTO_REFUSED,
    });
  });

  it("refuses 20 MB at the ticket (zod) and, when 20 MB is PUT anyway, at completion", async () => {
    const asked = photoUploadRequest.safeParse({ id: randomUUID(), visitId, contentType: "image/jpeg", bytes: 20 * 1024 * 1024 });
    expect(asked.success).toBe(false);
    expect(asked.error?.issues.map((i) => [i.path.join("."), i.message])).toEqual([["bytes", "Photos can be at most 15 MB."]]);

    // The local fake does not enforce the signed Content-Length as real S3 does; completion still checks.
    const { id } = await upload(await paddedJpeg(20 * 1024 * 1024), 1000);
    await expectRefused(id, "Photos can be at most 15.0 MB; this file is 20.0 MB.");
    expect((await rowOf(id)).bytes).toBe(20 * 1024 * 1024);
  });

  it("takes a phone's HEVC HEIC: turned as the phone showed it, with its GPS gone", async () => {
    // The upload carries a GPS position in its EXIF (read with exifr, a well-known EXIF reader).
    expect(await exifr.gps(exifBlockOf(phonePortraitHeic))).toEqual({ latitude: 51.5, longitude: -1.25 });
    const { id } = await upload(phonePortraitHeic, undefined, "IMG_0002.HEIC");
    // Stored 320 × 240 with an irot box: shown 240 × 320.
    await expect(completeUpload(volunteer, id)).resolves.toEqual({ photo: { id, status: "ready", width: 240, height: 320 } });
    const row = await rowOf(id);
    expect(row).toMatchObject({ status: "ready", contentType: "image/heic", bytes: phonePortraitHeic.length });
    expect(await exists(photoKeys(visitId, id).original)).toBe(false);

    const res = await fetch(await photoViewUrl(volunteer, id, "display"));
    expect(res.status).toBe(200);
    const display = Buffer.from(await res.arrayBuffer());
    expect((await fileTypeFromBuffer(display))?.mime).toBe("image/jpeg");
    expect(await exifr.gps(display)).toBeUndefined();
    expect(await exifr.parse(display, { tiff: true, xmp: true, iptc: true, icc: true })).toBeUndefined();
    expect((await sharp(display).metadata()).exif).toBeUndefined();
    // The red block stored at the top left now sits at the top right (each channel within 12: lossy).
    expect(colourDistance(await pixelAt(display, 210, 40), HEIC_COLOURS.red)).toBeLessThanOrEqual(12);
    expect(colourDistance(await pixelAt(display, 30, 40), HEIC_COLOURS.background)).toBeLessThanOrEqual(12);
  });

  it("refuses a HEIC whose header claims 50 megapixels, before decoding it", async () => {
    const { id } = await upload(heicClaiming(10_000, 5_000), undefined, "IMG_0003.HEIC");
    await expectRefused(id, "This image is 10000 × 5000 pixels (50 megapixels); photos can be at most 40 megapixels.");
  });

  it("keeps photos to their own visits and people", async () => {
    const ask = (actor: Actor, overrides: Partial<{ visitId: string; sightingId: string | null }>) =>
      requestUploadTicket(actor, { id: randomUUID(), visitId, sightingId: null, contentType: "image/jpeg", bytes: 100, ...overrides });
    await expect(ask(volunteer, { visitId: otherVisitId })).rejects.toMatchObject({ status: 403 });
    await expect(ask(volunteer, { visitId: randomUUID() })).rejects.toMatchObject({ status: 404 });
    await expect(ask(volunteer, { sightingId: randomUUID() })).rejects.toMatchObject({ status: 404 });
    const [foreign] = await db().select({ id: sightings.id }).from(sightings).where(ne(sightings.visitId, visitId)).limit(1);
    await expect(ask(volunteer, { sightingId: foreign!.id })).rejects.toMatchObject({ status: 400, fieldErrors: { sightingId: ["That sighting belongs to another walk."] } });

    const { id } = await upload(await phoneJpeg());
    await expect(completeUpload(otherVolunteer, id)).rejects.toMatchObject({ status: 403 });
    await expect(completeUpload(volunteer, randomUUID())).rejects.toMatchObject({ status: 404 });
  });

  it("answers 400 photo_not_uploaded when completion comes before the upload, and leaves the photo waiting", async () => {
    const id = randomUUID();
    await requestUploadTicket(volunteer, { id, visitId, sightingId: null, contentType: "image/jpeg", bytes: 100 });
    await expect(completeUpload(volunteer, id)).rejects.toMatchObject({ status: 400, code: PHOTO_NOT_UPLOADED });
    expect((await rowOf(id)).status).toBe("awaiting_upload");
  });

  it("shows ready photos to their volunteer, coordinators and organisers only", async () => {
    const { id } = await upload(await phoneJpeg());
    await completeUpload(volunteer, id);
    for (const email of ["checker@harrowmere.example", "organiser@harrowmere.example"]) {
      const res = await fetch(await photoViewUrl(await actorFor(email), id, "thumbnail"));
      expect(res.status).toBe(200);
    }
    await expect(photoViewUrl(otherVolunteer, id, "display")).rejects.toMatchObject({ status: 403 });
    await expect(photoViewUrl(await actorFor("partner@harrowmere.example"), id, "display")).rejects.toMatchObject({ status: 403 });
    await expect(photoViewUrl(volunteer, randomUUID(), "display")).rejects.toMatchObject({ status: 404 });

    const waiting = randomUUID();
    await requestUploadTicket(volunteer, { id: waiting, visitId, sightingId: null, contentType: "image/jpeg", bytes: 100 });
    await expect(photoViewUrl(volunteer, waiting, "display")).rejects.toMatchObject({ status: 404 });
  });
});
