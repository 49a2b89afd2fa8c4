import { fileURLToPath } from "node:url";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { Page } from "playwright-core";
import { SignInPage } from "./pages/sign-in-page";
import { accounts, password } from "./support/accounts";
import { seriousViolations } from "./support/axe";
import { openBrowser } from "./support/browser";

const fixture = (name: string) => fileURLToPath(new URL(`../fixtures/routes/${name}`, import.meta.url));

describe("an organiser's transects", () => {
  let session: Awaited<ReturnType<typeof openBrowser>>;
  let page: Page;

  beforeAll(async () => {
    session = await openBrowser();
    page = await session.context.newPage();
    const signIn = new SignInPage(page);
    await signIn.open();
    await signIn.signIn(accounts.organiser.email, password);
    await page.waitForURL((url) => url.pathname === accounts.organiser.home, { timeout: 20_000 });
  });
  afterAll(async () => {
    await session?.close();
  });

  it("lists every transect and draws each route on a plain background (no tiles configured, no broken images)", async () => {
    await page.goto("/network/transects");
    await page.getByRole("cell", { name: "CHK-01" }).waitFor();
    const map = page.getByRole("region", { name: "Map of the transects, coloured by habitat group" });
    await map.locator("path.leaflet-interactive").first().waitFor();
    expect(await map.locator("path.leaflet-interactive").count()).toBe(24);
    expect(await map.getAttribute("data-tiles")).toBe("off");
    expect(await page.locator("img.leaflet-tile").count()).toBe(0);
    expect(await page.getByRole("row").count()).toBe(25);
    // A route is drawn in its habitat group's colour (Chalk downland: downland green).
    expect(await map.locator('path[stroke="#3d7a1e"]').count()).toBe(6);
    expect(await seriousViolations(page)).toEqual([]);
  });

  it("creates a transect from a GeoJSON file, shows its measured length and sections, and opens it", async () => {
    await page.goto("/network/transects/new");
    await page.getByLabel("Code").fill("geo-07");
    await page.getByLabel("Name").fill("Flint Bank");
    await page.getByLabel("Habitat group").selectOption({ label: "Chalk downland" });
    await page.getByLabel(/Import a route file/).setInputFiles(fixture("three-sections.geojson"));
    await page.getByRole("cell", { name: "3", exact: true }).waitFor();
    await expect.poll(() => page.getByText(/in 3 sections, 6 points/).textContent()).toMatch(/^\d+ m in 3 sections/);
    expect(await page.getByLabel("Habitat of section 1").inputValue()).toBe("grazed chalk grassland");
    expect(await seriousViolations(page)).toEqual([]);
    await page.getByRole("button", { name: "Create transect" }).click();
    await page.waitForURL(/\/network\/transects\/[0-9a-f-]{36}$/);
    await page.getByRole("heading", { name: "GEO-07 Flint Bank" }).waitFor();
    expect(await page.getByText(/ m in 3 sections · 0 walks recorded/).count()).toBe(1);
    // The details form shows the saved habitat group (its options load after the page).
    await expect.poll(() => page.getByLabel("Habitat group").evaluate((s) => (s as HTMLSelectElement).selectedOptions[0]?.textContent)).toBe("Chalk downland");
  });

  it("refuses a GPX file that is really GeoJSON, with the reason, and keeps the form", async () => {
    await page.goto("/network/transects/new");
    await page.getByLabel(/Import a route file/).setInputFiles(fixture("route-is-json.gpx"));
    const alert = page.getByRole("alert").filter({ hasText: "The file was not used" });
    await alert.waitFor();
    expect(await alert.textContent()).toMatch(/named as GPX but is not XML: is it a GeoJSON file/);
  });

  it("changes the sections of a route, retires the transect and brings it back", async () => {
    await page.goto("/network/transects");
    await page.getByRole("link", { name: "GEO-07" }).click();
    await page.getByRole("heading", { name: "GEO-07 Flint Bank" }).waitFor();
    await page.getByRole("button", { name: "Change the route or its sections" }).click();
    await page.getByRole("button", { name: "Join with 2" }).click();
    await page.getByRole("button", { name: "Save the new route" }).click();
    await page.getByText(/Saved as route version 1/).waitFor();
    await page.getByText(/ m in 2 sections/).first().waitFor();
    await page.getByRole("button", { name: "Retire GEO-07…" }).click();
    await page.getByRole("button", { name: "Yes, retire GEO-07" }).click();
    await page.getByText(/This transect is retired/).waitFor();
    await page.getByRole("button", { name: "Bring GEO-07 back into use" }).click();
    await page.getByRole("button", { name: "Retire GEO-07…" }).waitFor();
  });

  it("adds a habitat group with a colour from the palette", async () => {
    await page.goto("/network/habitats");
    await page.getByLabel("Code").fill("hdg");
    await page.getByLabel("Name").fill("Hedgerows");
    await page.getByRole("radio", { name: "Foxglove pink" }).check();
    await page.getByRole("button", { name: "Add habitat group" }).click();
    await page.getByRole("button", { name: "Edit Hedgerows" }).waitFor();
    expect(await seriousViolations(page)).toEqual([]);
  });
});
