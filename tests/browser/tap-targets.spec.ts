import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { BrowserContext, Page } from "playwright-core";
import { phoneJpeg } from "../support/images";
import { FieldHomePage, MyRecordsPage, VisitPage, openSightingForm } from "./pages/field-pages";
import { SignInPage } from "./pages/sign-in-page";
import { accounts, password } from "./support/accounts";
import { openBrowser } from "./support/browser";

/*
 * Every control a volunteer taps on the field screens is at least 44 x 44 CSS px, measured in the
 * browser with getBoundingClientRect: WCAG 2.2 success criterion 2.5.5 Target Size (Enhanced)
 * (https://www.w3.org/WAI/WCAG22/Understanding/target-size-enhanced), common practice for
 * one-thumb use outdoors. Measured: every visible button, link, input, select, textarea and
 * [role=button].
 * Exempt, and why:
 *  - a link inside a sentence: displayed inline, in a block whose other text runs around it.
 *    WCAG's inline exception (2.5.8 Target Size (Minimum) and 2.5.5 alike): its size is set by
 *    the line height of the text it sits in;
 *  - a checkbox or radio button inside its label: the label is the target (tapping it toggles
 *    the box), so the label is measured instead;
 *  - what is not shown (display: none, visibility: hidden) or shown only on keyboard focus
 *    (the "Skip to content" link, a 1 x 1 px clipped box until focused, then measured focused).
 */
const MIN_TARGET_PX = 44;

// A phone-sized screen (390 x 844 CSS px, as on many current phones: common practice for mobile testing).
// The position is granted so that the sighting form shows its position controls too.
const phone = {
  viewport: { width: 390, height: 844 }, isMobile: true, hasTouch: true, deviceScaleFactor: 2,
  geolocation: { latitude: 51.5, longitude: -1.3, accuracy: 8 }, permissions: ["geolocation"],
};

type Measured = { what: string; width: number; height: number };

/** The controls on the page smaller than the minimum, with their measured size. */
async function undersizedTargets(page: Page): Promise<Measured[]> {
  const { measured, undersized } = await measureTargets(page);
  expect(measured).toBeGreaterThan(0); // a page that showed nothing would pass vacuously
  return undersized;
}

function measureTargets(page: Page): Promise<{ measured: number; undersized: Measured[] }> {
  return page.evaluate((min) => {
    const describe = (el: Element) => `${el.tagName.toLowerCase()} "${(el.textContent ?? "").trim().slice(0, 40) || el.getAttribute("aria-label") || el.id}"`;
    const isInlineInSentence = (el: Element) => {
      if (el.tagName !== "A" || getComputedStyle(el).display !== "inline") return false;
      let block = el.parentElement;
      while (block && getComputedStyle(block).display === "inline") block = block.parentElement;
      const around = (block?.textContent ?? "").replace(el.textContent ?? "", "");
      return around.trim().length > 0;
    };
    const found: Measured[] = [];
    let measured = 0;
    for (const el of document.querySelectorAll("button, a[href], input:not([type=hidden]), select, textarea, [role=button]")) {
      if (!el.checkVisibility({ checkVisibilityCSS: true })) continue;
      if (isInlineInSentence(el)) continue;
      const target = el.matches("input[type=checkbox], input[type=radio]") ? (el.closest("label") ?? el) : el;
      const box = target.getBoundingClientRect();
      const visuallyHidden = box.width <= 1 && box.height <= 1 && getComputedStyle(target).position === "absolute";
      if (visuallyHidden) continue;
      measured++;
      if (box.width < min || box.height < min) found.push({ what: describe(target), width: Math.round(box.width * 10) / 10, height: Math.round(box.height * 10) / 10 });
    }
    return { measured, undersized: found };
  }, MIN_TARGET_PX);
}

/** The frame's skip link, measured while it has keyboard focus (the only time it shows). */
async function skipLinkWhenFocused(page: Page): Promise<Measured> {
  const link = page.getByRole("link", { name: "Skip to content" });
  await link.focus();
  const box = (await link.boundingBox())!;
  await link.blur();
  return { what: "skip link (focused)", width: box.width, height: box.height };
}

async function expectSafetyInMenu(page: Page) {
  const menu = page.getByRole("navigation", { name: "Main" });
  expect(await menu.getByRole("link", { name: "Safety" }).getAttribute("href")).toBe("/safety");
}

describe("tap targets on a volunteer's field screens (at least 44 x 44 CSS px, measured)", () => {
  let context: BrowserContext;
  let close: () => Promise<void>;
  let page: Page;

  beforeAll(async () => {
    ({ context, close } = await openBrowser(phone));
    page = await context.newPage();
    const signIn = new SignInPage(page);
    await signIn.open();
    await signIn.signIn(accounts.volunteer.email, password);
    await page.waitForURL((u) => u.pathname === accounts.volunteer.home, { timeout: 20_000 });
  });
  afterAll(async () => {
    await close();
  });

  it("the measurement finds a control that is too small, and exempts only what the rules say (the check can fail)", async () => {
    const probe = await context.newPage();
    await probe.setContent(`<main>
      <button style="width:80px;height:30px">small</button>
      <p>Read <a href="/x">this</a> first.</p>
      <a href="/y" style="display:inline-block;width:50px;height:50px">big</a>
      <p><a href="/z">alone in its block</a></p>
      <label style="display:block;height:20px"><input type="checkbox"> short label</label>
    </main>`);
    const { measured, undersized } = await measureTargets(probe);
    await probe.close();
    expect(measured).toBe(4);
    expect(undersized.map((u) => u.what)).toEqual(['button "small"', 'a "alone in its block"', 'label "short label"']);
  });

  it("field home, with the safety notice in the menu", async () => {
    await new FieldHomePage(page).open();
    await expectSafetyInMenu(page);
    expect(await undersizedTargets(page)).toEqual([]);
  });

  it("the frame's skip link, shown on keyboard focus", async () => {
    const skip = await skipLinkWhenFocused(page);
    expect(Math.min(skip.width, skip.height)).toBeGreaterThanOrEqual(MIN_TARGET_PX);
  });

  it("the safety notice before a first walk, then the start-walk form", async () => {
    await new FieldHomePage(page).startVisitOnFirstTransect();
    const acknowledge = page.getByRole("button", { name: "I have read this and will take care" });
    await acknowledge.or(page.getByLabel("Temperature (°C)")).first().waitFor({ timeout: 30_000 });
    if (await acknowledge.isVisible()) expect(await undersizedTargets(page)).toEqual([]);
    await new VisitPage(page).acknowledgeSafetyIfAsked();
    await expectSafetyInMenu(page);
    expect(await undersizedTargets(page)).toEqual([]);
  });

  it("the recording screen with the add-sighting form open, a position and a photo", async () => {
    await new VisitPage(page).start({ startTime: "10:30", temperature: "18", wind: "2" });
    await expectSafetyInMenu(page);
    expect(await undersizedTargets(page)).toEqual([]);
    await openSightingForm(page, "white");
    expect(await undersizedTargets(page)).toEqual([]);
    await page.getByRole("list", { name: "Matching species" }).getByRole("button").first().click();
    await page.getByRole("button", { name: "Add my position" }).click();
    await page.getByRole("button", { name: "Remove the position" }).waitFor();
    await page.getByLabel("Photos (optional)").setInputFiles({ name: "wing.jpg", mimeType: "image/jpeg", buffer: await phoneJpeg() });
    await page.getByRole("button", { name: "Remove Photo 1" }).waitFor();
    expect(await undersizedTargets(page)).toEqual([]);
  });

  it("the recording screen's confirmations and its finishing form", async () => {
    await page.getByRole("button", { name: "Save sighting" }).click();
    await page.getByRole("button", { name: "+ Add a sighting" }).waitFor();
    await page.getByRole("button", { name: /^Delete (?!this walk)/ }).first().click();
    await page.getByRole("button", { name: "Yes, delete it" }).waitFor();
    expect(await undersizedTargets(page)).toEqual([]);
    await page.getByRole("button", { name: "Keep it" }).click();
    await page.getByRole("button", { name: "Finish the walk" }).click();
    await page.getByLabel("End time").waitFor();
    expect(await undersizedTargets(page)).toEqual([]);
    await page.getByRole("button", { name: "Back" }).click();
  });

  it("My walks", async () => {
    await new MyRecordsPage(page).open();
    await expectSafetyInMenu(page);
    expect(await undersizedTargets(page)).toEqual([]);
  });

  it("the safety page", async () => {
    await page.goto("/safety");
    await page.getByRole("heading", { level: 1 }).waitFor();
    expect(await undersizedTargets(page)).toEqual([]);
  });
});
