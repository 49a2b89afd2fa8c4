import { GetObjectCommand, HeadObjectCommand, S3Client } from "@aws-sdk/client-s3";
import exifr from "exifr";
import postgres from "postgres";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { BrowserContext, Page } from "playwright-core";
import { demoPeople } from "@/db/seed/network";
import { phoneJpeg } from "../support/images";
import { FieldHomePage, VisitPage } from "./pages/field-pages";
import { SignInPage } from "./pages/sign-in-page";
import { password } from "./support/accounts";
import { openBrowser } from "./support/browser";

// A phone-sized screen (390 x 844 CSS px, as on many current phones: common practice for mobile testing).
const phone = { viewport: { width: 390, height: 844 }, isMobile: true, hasTouch: true, deviceScaleFactor: 2 };
const volunteer = demoPeople.volunteers[2]!;

describe("recording a visit with no signal", () => {
  let context: BrowserContext;
  let close: () => Promise<void>;
  let page: Page;
  const sql = postgres(process.env.DATABASE_URL!, { max: 2 });

  beforeAll(async () => {
    ({ context, close } = await openBrowser(phone));
    page = await context.newPage();
    const signIn = new SignInPage(page);
    await signIn.open();
    await signIn.signIn(volunteer.email, password);
    await page.waitForURL((u) => u.pathname === "/field", { timeout: 20_000 });
  });
  afterAll(async () => {
    await close();
    await sql.end();
  });

  it("keeps a visit with five sightings and a photo through an offline reload, then sends each row exactly once", async () => {
    const home = new FieldHomePage(page);
    await home.open();
    await home.waitUntilReadyOffline();
    await page.reload();
    await home.open();

    await context.setOffline(true);
    await home.startVisitOnFirstTransect();
    const visit = new VisitPage(page);
    await visit.acknowledgeSafetyIfAsked();
    // Times are set, not taken from the clock, so a run near midnight cannot end before it starts.
    await visit.start({ startTime: "10:30", temperature: "18", wind: "2" });

    // A photo with GPS in its EXIF, to prove the server strips it (exifr, a well-known EXIF reader, sees it first).
    const photo = await phoneJpeg();
    expect((await exifr.gps(photo))?.latitude).toBeCloseTo(51.5, 3);
    const searches = ["Meadow Brown", "Small White", "Peacock", "Common Blue", "Speckled Wood"];
    for (const [i, search] of searches.entries()) {
      await visit.addSighting({ search, count: i + 1, section: 1, photo: i === 0 ? { name: "meadow-brown.jpg", mimeType: "image/jpeg", buffer: photo } : undefined });
    }
    expect(await visit.sightingRows().count()).toBe(5);
    const visitId = new URL(page.url()).searchParams.get("id");
    expect(visitId).toMatch(/^[0-9a-f-]{36}$/);

    await page.reload(); // still offline: the service worker answers, IndexedDB still has it all
    await visit.sightingRows().first().waitFor();
    expect(await visit.sightingRows().count()).toBe(5);
    await expect.poll(() => page.getByText("1 photo").count()).toBe(1);

    await visit.finishAndSubmit("11:45");
    await page.goto("/field");
    await page.getByTestId("outbox").waitFor();
    await expect.poll(() => home.outboxCount("on-phone")).toBe(7); // visit + 5 sightings + 1 photo
    const before = await sql`select count(*)::int as n from visits where id = ${visitId!}`;
    expect(before[0]!.n).toBe(0);

    await context.setOffline(false);
    await expect.poll(() => home.outboxSummary(), { timeout: 30_000 }).toMatch(/Everything is sent/);
    expect(await home.outboxCount("sent")).toBe(7);
    // The safety acknowledgement made with no signal is the volunteer's, and reached the server too.
    await expect
      .poll(async () => (await sql`select accepted_safety_at from users where email = ${volunteer.email}`)[0]!.accepted_safety_at, { timeout: 10_000 })
      .not.toBeNull();

    const visits = await sql`select count(*)::int as n from visits where id = ${visitId!}`;
    expect(visits[0]!.n).toBe(1);
    const sightings = await sql`select s.count, sp.vernacular_name from sightings s join species sp on sp.id = s.species_id where s.visit_id = ${visitId!} order by s.count`;
    expect(sightings.map((s) => s.vernacular_name)).toEqual(searches);
    const photos = await sql`select status, display_key, thumbnail_key from photos where visit_id = ${visitId!}`;
    expect(photos).toHaveLength(1);
    expect(photos[0]!.status).toBe("ready");

    const s3 = new S3Client({
      endpoint: process.env.S3_ENDPOINT ?? "http://127.0.0.1:54330",
      region: "us-east-1",
      forcePathStyle: true,
      credentials: { accessKeyId: "S3RVER", secretAccessKey: "S3RVER" },
    });
    const bucket = process.env.S3_BUCKET ?? "turnstone-test-photos";
    const head = await s3.send(new HeadObjectCommand({ Bucket: bucket, Key: photos[0]!.display_key }));
    expect(head.ContentLength).toBeGreaterThan(0);
    const stored = await s3.send(new GetObjectCommand({ Bucket: bucket, Key: photos[0]!.display_key }));
    const bytes = Buffer.from(await stored.Body!.transformToByteArray());
    // exifr, a well-known EXIF reader, finds no GPS in what the server stored.
    expect(await exifr.gps(bytes).catch(() => undefined)).toBeUndefined();
  });
});
