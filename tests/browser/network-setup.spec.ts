import { fileURLToPath } from "node:url";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { Page } from "playwright-core";
import { demoPeople } from "@/db/seed/network";
import { SignInPage } from "./pages/sign-in-page";
import { accounts, password } from "./support/accounts";
import { seriousViolations } from "./support/axe";
import { openBrowser } from "./support/browser";

// An organiser sets up the network end to end in the browser, and a volunteer on a phone-sized
// page meets the result. It publishes the network's first recorder agreement, which every
// volunteer must then accept, so vitest.browser.config.ts runs this file after the others.

const fixture = (path: string) => fileURLToPath(new URL(`../fixtures/${path}`, import.meta.url));
const volunteer = demoPeople.volunteers[10]!; // Carys Wendover: not used by the other browser suites
const dayAfter = (day: string, n: number) => new Date(Date.parse(`${day}T00:00:00Z`) + n * 86_400_000).toISOString().slice(0, 10);

describe("setting up the network, then recording on it", () => {
  let organiser: Awaited<ReturnType<typeof openBrowser>>;
  let page: Page;

  beforeAll(async () => {
    organiser = await openBrowser();
    page = await organiser.context.newPage();
    const signIn = new SignInPage(page);
    await signIn.open();
    await signIn.signIn(accounts.organiser.email, password);
    await page.waitForURL((url) => url.pathname === accounts.organiser.home, { timeout: 20_000 });
  });
  afterAll(async () => {
    await organiser?.close();
  });

  it("creates a season after the last one ends, and sees it being planned", async () => {
    const { seasons } = (await (await page.request.get("/api/network/seasons")).json()) as { seasons: { endsOn: string }[] };
    const lastDay = seasons.map((s) => s.endsOn).sort().at(-1)!;
    const startsOn = dayAfter(lastDay, 1);
    const endsOn = dayAfter(lastDay, 150);
    await page.goto("/network/seasons");
    const form = page.getByRole("region", { name: "New season" });
    await form.getByLabel("Name").fill("Trial season");
    await form.getByLabel("First day").fill(startsOn);
    await form.getByLabel("Last day").fill(endsOn);
    await form.getByLabel("Target walks per transect").fill("6");
    await form.getByLabel("Fewest walks for a transect to be compared").fill("3");
    await form.getByRole("button", { name: "Create season" }).click();
    const card = page.getByRole("listitem").filter({ has: page.getByRole("heading", { name: "Trial season" }) });
    await card.waitFor();
    expect(await card.textContent()).toContain("Being planned");
    expect(await card.textContent()).toContain(`${startsOn} to ${endsOn}`);
    expect(await seriousViolations(page)).toEqual([]);
  });

  it("imports a checklist from CSV after its preview", async () => {
    await page.goto("/network/checklist/import");
    await page.getByLabel(/Checklist file/).setInputFiles(fixture("checklist/checklist-good.csv"));
    const importButton = page.getByRole("button", { name: /^Import \d+ new and \d+ changed$/ });
    await importButton.waitFor();
    const [, added, changed] = /^Import (\d+) new and (\d+) changed$/.exec((await importButton.textContent())!)!;
    expect(Number(added) + Number(changed)).toBeGreaterThan(0);
    await importButton.click();
    await page.getByText(`Imported: ${added} new and ${changed} changed entries`).waitFor();
  });

  it("creates a transect from a GeoJSON file and sees its measured length", async () => {
    await page.goto("/network/transects/new");
    await page.getByLabel("Code").fill("new-01");
    await page.getByLabel("Name").fill("Saltings Path");
    await page.getByLabel("Habitat group").selectOption({ label: "Coastal dunes" });
    await page.getByLabel(/Import a route file/).setInputFiles(fixture("routes/three-sections.geojson"));
    await expect.poll(() => page.getByText(/in 3 sections, 6 points/).textContent()).toMatch(/^\d+ m in 3 sections/);
    await page.getByRole("button", { name: "Create transect" }).click();
    await page.waitForURL(/\/network\/transects\/[0-9a-f-]{36}$/);
    await page.getByRole("heading", { name: "NEW-01 Saltings Path" }).waitFor();
    expect(await page.getByText(/\d+ m in 3 sections · 0 walks recorded/).count()).toBe(1);
  });

  it("publishes the recorder agreement and assigns a volunteer to the new transect", async () => {
    await page.goto("/network/agreement");
    await page.getByLabel("How the network uses sightings").fill("Your records go to the county records centre and into our season reports. You can download or erase your data at any time.");
    await page.getByRole("group", { name: "Licence sightings are published under" }).getByRole("radio").first().check();
    await page.getByRole("button", { name: "Publish the agreement" }).click();
    await page.getByText(/Version 1 published/).waitFor();

    await page.goto("/network/people");
    await page.getByRole("link", { name: volunteer.name }).click();
    await page.getByRole("heading", { name: `Transects ${volunteer.name} walks` }).waitFor();
    await page.getByRole("checkbox", { name: /NEW-01 Saltings Path/ }).check();
    await page.getByRole("button", { name: "Save transects" }).click();
    await page.getByText(/Saved \(1 added, 0 taken off\)/).waitFor();
  });

  it("the volunteer, on a phone, accepts the agreement at first sign-in and finds the new transect on the field home", async () => {
    const phone = await openBrowser({ viewport: { width: 390, height: 844 }, isMobile: true, hasTouch: true });
    try {
      const p = await phone.context.newPage();
      const signIn = new SignInPage(p);
      await signIn.open();
      await signIn.signIn(volunteer.email, password);
      await p.waitForURL((url) => url.pathname === "/agreement", { timeout: 20_000 });
      await p.getByRole("heading", { name: "Version 1" }).waitFor();
      await p.getByRole("radio", { name: "under my pseudonym, without my name" }).check();
      await p.getByRole("radio", { name: "No, thank you" }).check();
      await p.getByRole("button", { name: "I accept the agreement" }).click();
      await p.waitForURL((url) => url.pathname === "/field", { timeout: 20_000 });
      const card = p.getByTestId("assigned-transect").filter({ hasText: "NEW-01" });
      await card.waitFor({ timeout: 20_000 });
      expect(await card.textContent()).toContain("Saltings Path");
      expect(await card.textContent()).toMatch(/3 sections/);
      // A second visit to the field home no longer asks: the answer is kept.
      await p.goto("/field");
      await p.getByTestId("assigned-transect").filter({ hasText: "NEW-01" }).waitFor();
      expect(new URL(p.url()).pathname).toBe("/field");
    } finally {
      await phone.close();
    }
  });
});
