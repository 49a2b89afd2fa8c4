import { randomUUID } from "node:crypto";
import postgres from "postgres";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { BrowserContext, Page } from "playwright-core";
import { demoPeople } from "@/db/seed/network";
import { phoneJpeg } from "../support/images";
import { MyRecordsPage } from "./pages/field-pages";
import { SignInPage } from "./pages/sign-in-page";
import { password } from "./support/accounts";
import { openBrowser } from "./support/browser";

// A reviewer's whole round on one sighting, in Chromium against the built app: filter the queue to
// one warning, open a sighting with a photo, ask a question; the volunteer answers on a phone-sized
// page; the reviewer sees the answer, corrects the species to an aggregate, confirms with the
// keyboard, and the history shows the four steps in order.

// A phone-sized screen (390 x 844 CSS px, as on many current phones: common practice for mobile testing).
const phone = { viewport: { width: 390, height: 844 }, isMobile: true, hasTouch: true, deviceScaleFactor: 2 };
const desktop = { viewport: { width: 1440, height: 960 } };

type Target = { id: string; visitId: string; transectId: string; transectCode: string; volunteerEmail: string };

async function signIn(page: Page, email: string, landing: string) {
  const form = new SignInPage(page);
  await form.open();
  await form.signIn(email, password);
  await page.waitForURL((u) => u.pathname === landing, { timeout: 20_000 });
}

/** Sends a photo for the sighting through the app's own upload flow, as the phone does. */
async function uploadPhoto(context: BrowserContext, target: Target) {
  const bytes = await phoneJpeg();
  const id = randomUUID();
  const ticket = await context.request.post("/api/field/photos", {
    data: { id, visitId: target.visitId, sightingId: target.id, contentType: "image/jpeg", bytes: bytes.length },
  });
  expect(ticket.status()).toBe(200);
  const { uploadUrl, headers } = (await ticket.json()) as { uploadUrl: string; headers: Record<string, string> };
  const put = await fetch(uploadUrl, { method: "PUT", headers, body: new Uint8Array(bytes) });
  expect(put.status).toBe(200);
  const done = await context.request.post(`/api/field/photos/${id}/complete`);
  expect(done.status()).toBe(200);
}

describe("reviewing a sighting from the queue to a decision", () => {
  const sql = postgres(process.env.DATABASE_URL!, { max: 2 });
  let reviewer: Awaited<ReturnType<typeof openBrowser>>;
  let volunteer: Awaited<ReturnType<typeof openBrowser>>;
  let target: Target;

  beforeAll(async () => {
    // A waiting Small Skipper of the open season on a transect where last season's checked
    // sightings give it an earlier highest count; its count is raised past three times that, so
    // the queue warns "far above earlier counts" (the rule of lib/review/warnings.ts).
    const emails = demoPeople.volunteers.map((v) => v.email);
    const [row] = await sql<(Target & { earlierMax: number })[]>`
      select s.id, v.id as "visitId", t.id as "transectId", t.code as "transectCode", u.email as "volunteerEmail", x.earlier_max as "earlierMax"
      from sightings s join visits v on v.id = s.visit_id join transects t on t.id = v.transect_id join users u on u.id = v.volunteer_id
      join species sp on sp.id = s.species_id join seasons se on se.id = v.season_id
      cross join lateral (
        select max(m.max_count) as earlier_max from transect_species_seasons m join seasons e on e.id = m.season_id
        where m.transect_id = t.id and m.species_id = sp.id and e.starts_on < se.starts_on) x
      where s.status = 'pending' and se.status = 'open' and sp.scientific_name = 'Thymelicus sylvestris'
        and x.earlier_max is not null and u.email = any(${emails}) and not t.sensitive
      order by s.id limit 1`;
    expect(row, "the demo has a waiting Small Skipper with an earlier count on its transect").toBeDefined();
    target = row!;
    await sql`update sightings set count = ${Math.max(10, 3 * row!.earlierMax + 1)} where id = ${target.id}`;
    const [warned] = await sql<{ warnings: string[] }[]>`select warnings from sightings where id = ${target.id}`;
    expect(warned!.warnings).toContain("count_above_usual");

    volunteer = await openBrowser(phone);
    await signIn(await volunteer.context.newPage(), target.volunteerEmail, "/field");
    await uploadPhoto(volunteer.context, target);

    reviewer = await openBrowser(desktop);
    await signIn(await reviewer.context.newPage(), demoPeople.coordinator.email, "/review");
  }, 120_000);

  afterAll(async () => {
    await reviewer?.close();
    await volunteer?.close();
    await sql.end();
  });

  it("asks, gets the answer, corrects to an aggregate, confirms with the keyboard, and keeps the four steps", async () => {
    const page = reviewer.context.pages()[0]!;
    await page.goto("/review");
    await page.getByLabel("Warning").selectOption({ label: "Far above earlier counts" });
    await page.waitForURL((u) => u.searchParams.get("warning") === "count_above_usual");
    await page.getByLabel("Transect").selectOption(target.transectId);
    await page.waitForURL((u) => u.searchParams.get("transect") === target.transectId);
    const row = page.locator(`[data-row-id="${target.id}"]`);
    await row.waitFor();
    // Every row left shows the warning that was filtered for.
    const rows = page.locator("[data-row-id]");
    for (let i = 0; i < (await rows.count()); i++) await expect.poll(() => rows.nth(i).textContent()).toMatch(/Far above earlier counts/);

    await row.click();
    const detail = page.getByTestId("sighting-detail");
    await expect.poll(() => detail.getAttribute("data-sighting-id")).toBe(target.id);
    await detail.getByRole("img").first().waitFor(); // the photo's thumbnail
    await detail.getByRole("button", { name: "Ask a question" }).click();
    await detail.getByLabel("Your question").fill("Could you see the tips of the antennae from below?");
    await detail.getByRole("button", { name: "Send the question" }).click();
    // The queue moves on to the next sighting; the question is stored.
    await expect.poll(async () => (await sql<{ status: string }[]>`select status from sightings where id = ${target.id}`)[0]!.status).toBe("queried");

    const phonePage = volunteer.context.pages()[0]!;
    await new MyRecordsPage(phonePage).open();
    await phonePage.getByText("Could you see the tips of the antennae from below?").waitFor();
    await phonePage.getByLabel("Your answer").fill("Only from above, it flew off quickly.");
    await phonePage.getByRole("button", { name: "Send answer" }).click();
    await phonePage.getByText("Only from above, it flew off quickly.").waitFor();

    await page.reload();
    await row.waitFor();
    await expect.poll(() => row.textContent()).toMatch(/Answered/);
    await row.click();
    await expect.poll(() => detail.getAttribute("data-sighting-id")).toBe(target.id);
    await detail.getByText("Only from above, it flew off quickly.").first().waitFor();

    await detail.getByRole("button", { name: "Correct", exact: true }).click();
    const correction = detail.getByRole("form", { name: "Correct the species or the count" });
    await correction.getByLabel("Change the species to").fill("Small/Essex");
    await correction.getByRole("button", { name: /Small\/Essex Skipper/ }).click();
    await correction.getByRole("button", { name: "Correct", exact: true }).click();
    // The correction is done when its form has closed and the sighting's heading names the aggregate.
    await correction.waitFor({ state: "detached" });
    await expect.poll(() => detail.getByRole("heading", { level: 2 }).textContent()).toMatch(/Small\/Essex Skipper/);

    // Confirm with the keyboard: focus on the page, not in a text field.
    await detail.getByRole("heading", { level: 2 }).focus();
    await page.keyboard.press("c");
    await expect.poll(async () => (await sql<{ status: string }[]>`select status from sightings where id = ${target.id}`)[0]!.status).toBe("accepted");

    // Decided, and no longer far above earlier counts (an aggregate has none), it has left the
    // filtered list: find it among every status on its transect.
    await page.getByLabel("Warning").selectOption("");
    await page.getByLabel("Status").selectOption("any");
    await page.waitForURL((u) => u.searchParams.get("status") === "any" && !u.searchParams.has("warning"));
    await row.click();
    const history = page.getByTestId("review-history");
    await expect.poll(() => history.locator("li").count()).toBe(4);
    const steps = await history.locator("li").allTextContents();
    expect(steps[0]).toMatch(/question/i);
    expect(steps[1]).toMatch(/answer/i);
    expect(steps[2]).toMatch(/Small Skipper[\s\S]*Small\/Essex Skipper/);
    expect(steps[3]).toMatch(/Confirm/i);
    const [species] = await sql<{ scientific: string }[]>`select sp.scientific_name as scientific from sightings s join species sp on sp.id = s.species_id where s.id = ${target.id}`;
    expect(species!.scientific).toBe("Thymelicus sylvestris/lineola");
  }, 120_000);
});
