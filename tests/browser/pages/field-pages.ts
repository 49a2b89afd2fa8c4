import type { Page } from "playwright-core";

/** Page object for the volunteer's field home. */
export class FieldHomePage {
  constructor(private readonly page: Page) {}

  async open() {
    await this.page.goto("/field");
    await this.page.getByTestId("assigned-transect").first().waitFor();
  }

  /** Waits until the service worker controls the page and the field pages are cached. */
  async waitUntilReadyOffline() {
    // waitForFunction does not await an async predicate, so poll an evaluate instead.
    const deadline = Date.now() + 45_000;
    while (Date.now() < deadline) {
      const ready = await this.page.evaluate(async () => {
        if (!navigator.serviceWorker.controller) return false;
        const cache = await caches.open("turnstone-field-pages");
        const keys = (await cache.keys()).map((r) => new URL(r.url).pathname);
        return ["/field", "/field/visit"].every((p) => keys.includes(p));
      });
      if (ready) {
        // The volunteer is told too, from the same facts.
        await this.page.getByTestId("offline-readiness").filter({ hasText: "ready to record with no signal" }).waitFor({ timeout: 10_000 });
        return;
      }
      await this.page.waitForTimeout(250);
    }
    throw new Error("The service worker did not take control and cache the field pages in time.");
  }

  async startVisitOnFirstTransect() {
    await this.page.getByRole("link", { name: "Start a walk" }).first().click();
  }

  outboxCount(state: "on-phone" | "sending" | "sent" | "needs-attention") {
    return this.page.getByTestId(`outbox-${state}`).textContent().then(Number);
  }

  outboxSummary() {
    return this.page.getByTestId("outbox-summary").textContent();
  }
}

/** Page object for starting and recording a visit. */
export class VisitPage {
  constructor(private readonly page: Page) {}

  /** The first visit on a phone shows the safety notice first; later ones go straight to the form. */
  async acknowledgeSafetyIfAsked() {
    const button = this.page.getByRole("button", { name: "I have read this and will take care" });
    const form = this.page.getByLabel("Temperature (°C)");
    await button.or(form).first().waitFor({ timeout: 30_000 });
    if (await button.isVisible()) await button.click();
    await form.waitFor();
  }

  async start(conditions: { startTime: string; temperature: string; wind: string }) {
    await this.page.getByLabel("Start time").fill(conditions.startTime);
    await this.page.getByLabel("Temperature (°C)").fill(conditions.temperature);
    await this.page.getByLabel("Wind (Beaufort force)").selectOption(conditions.wind);
    await this.page.getByRole("button", { name: "Start recording" }).click();
    await this.page.getByRole("button", { name: "+ Add a sighting" }).waitFor();
  }

  async addSighting(s: { search: string; count: number; section?: number; photo?: { name: string; mimeType: string; buffer: Buffer } }) {
    await this.page.getByRole("button", { name: "+ Add a sighting" }).click();
    await this.page.getByRole("searchbox", { name: "Species" }).fill(s.search);
    await this.page.getByRole("list", { name: "Matching species" }).getByRole("button").first().click();
    for (let i = 1; i < s.count; i++) await this.page.getByRole("button", { name: "More (Count)" }).click();
    if (s.section) await this.page.getByLabel("Section").selectOption(String(s.section));
    if (s.photo) await this.page.getByLabel("Photos (optional)").setInputFiles(s.photo);
    await this.page.getByRole("button", { name: "Save sighting" }).click();
    await this.page.getByRole("button", { name: "+ Add a sighting" }).waitFor();
  }

  sightingRows() {
    return this.page.getByTestId("sighting-row");
  }

  async finishAndSubmit(endTime: string) {
    await this.page.getByRole("button", { name: "Finish the walk" }).click();
    await this.page.getByLabel("End time").fill(endTime);
    await this.page.getByRole("radio", { name: "Yes, every species I could identify" }).check();
    await this.page.getByRole("button", { name: "Submit walk" }).click();
    await this.page.getByTestId("visit-submitted").waitFor();
  }
}

/** Opens the add-sighting form on the recording screen and types a search, so the matching species show. */
export async function openSightingForm(page: Page, search: string) {
  await page.getByRole("button", { name: "+ Add a sighting" }).click();
  await page.getByRole("searchbox", { name: "Species" }).fill(search);
  await page.getByRole("list", { name: "Matching species" }).getByRole("button").first().waitFor();
}

/** Page object for My walks (/field/records). */
export class MyRecordsPage {
  constructor(private readonly page: Page) {}

  /** Opens the page and waits until the volunteer's sent walks have loaded. */
  async open() {
    await this.page.goto("/field/records");
    await this.page.getByRole("heading", { name: "My walks" }).waitFor();
    await this.page.getByText("Loading…").waitFor({ state: "detached" });
  }
}
