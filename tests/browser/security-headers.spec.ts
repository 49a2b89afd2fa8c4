import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { BrowserContext, Page, Response } from "playwright-core";
import { demoPeople } from "@/db/seed/network";
import { FieldHomePage, VisitPage } from "./pages/field-pages";
import { SignInPage } from "./pages/sign-in-page";
import { password } from "./support/accounts";
import { openBrowser } from "./support/browser";

// Content Security Policy Level 3 (W3C): a script runs when it carries the policy's nonce, or
// when a script that did loaded it ('strict-dynamic'); the browser reports each refusal as a
// securitypolicyviolation event and a console error, which this suite collects.
const phone = { viewport: { width: 390, height: 844 }, isMobile: true, hasTouch: true, deviceScaleFactor: 2 };

function scriptNonceOf(policy: string): string {
  const script = policy.split(";").map((d) => d.trim().split(/\s+/)).find(([name]) => name === "script-src");
  const nonce = script?.find((s) => s.startsWith("'nonce-"));
  expect(nonce, `script-src with a nonce in: ${policy}`).toBeDefined();
  return nonce!.slice("'nonce-".length, -1);
}

/** Every <script> opening tag in the served HTML, with its nonce attribute (browsers hide it from the DOM). */
function scriptTags(html: string): { tag: string; nonce: string | undefined }[] {
  return [...html.matchAll(/<script\b[^>]*>/g)].map(([tag]) => ({ tag, nonce: /\snonce="([^"]*)"/.exec(tag)?.[1] }));
}

async function expectNonceOnEveryScript(response: Response | null) {
  expect(response?.status()).toBe(200);
  const policy = response!.headers()["content-security-policy"];
  expect(policy).toBeDefined();
  const nonce = scriptNonceOf(policy!);
  const scripts = scriptTags(await response!.text());
  expect(scripts.filter((s) => !s.tag.includes(" src=")).length).toBeGreaterThan(0); // Next's inline scripts are there
  expect(scripts.filter((s) => s.nonce !== nonce)).toEqual([]);
  return { policy: policy!, nonce };
}

describe("security headers and the pages' Content-Security-Policy", () => {
  let context: BrowserContext;
  let close: () => Promise<void>;
  let page: Page;
  const consoleErrors: string[] = [];

  const violations = () => page.evaluate(() => (window as unknown as { cspViolations?: string[] }).cspViolations ?? []);

  beforeAll(async () => {
    ({ context, close } = await openBrowser(phone));
    // Runs before any page script, in every document this context opens.
    await context.addInitScript(() => {
      const w = window as unknown as { cspViolations: string[] };
      w.cspViolations = [];
      document.addEventListener("securitypolicyviolation", (e) => w.cspViolations.push(`${e.effectiveDirective} refused ${e.blockedURI}`));
    });
    page = await context.newPage();
    page.on("console", (m) => {
      if (/Content Security Policy|Refused to/i.test(m.text())) consoleErrors.push(m.text());
    });
  });
  afterAll(async () => {
    await close();
  });

  it("the sign-in page carries a fresh nonce per request that matches every script Next wrote, and signing in works", async () => {
    const first = await expectNonceOnEveryScript(await page.goto("/sign-in"));
    const second = await expectNonceOnEveryScript(await page.goto("/sign-in"));
    expect(second.nonce).not.toBe(first.nonce);
    expect(first.policy).toMatch(/frame-ancestors 'none'/);
    expect(first.policy).not.toMatch(/upgrade-insecure-requests/); // plain-http localhost

    const signIn = new SignInPage(page);
    await signIn.open();
    await signIn.signIn(demoPeople.volunteers[4]!.email, password);
    await page.waitForURL((u) => u.pathname === "/field", { timeout: 20_000 });
    expect(await violations()).toEqual([]);
  });

  it("field pages run under the policy: nonce on every script, service worker, lazily loaded forms, no violation", async () => {
    await expectNonceOnEveryScript(await page.goto("/field"));
    const home = new FieldHomePage(page);
    await home.open();
    await page.evaluate(() => navigator.serviceWorker.ready.then(() => true));
    await home.startVisitOnFirstTransect();
    const visit = new VisitPage(page);
    await visit.acknowledgeSafetyIfAsked();
    await visit.start({ startTime: "10:30", temperature: "18", wind: "2" });
    // The sighting form is a chunk loaded on first use: a script a nonce-carrying script loaded.
    await page.getByRole("button", { name: "+ Add a sighting" }).click();
    await page.getByRole("searchbox", { name: "Species" }).waitFor();
    expect(await violations()).toEqual([]);
    expect(consoleErrors).toEqual([]);
  });

  it("pages, API answers (an error too) and static files carry the fixed headers; HSTS never on plain http", async () => {
    const api = await context.request.get("/api/field/transects");
    const stranger = await fetch(new URL("/api/field/transects", page.url())); // no cookies: 401
    expect(api.status()).toBe(200);
    expect(stranger.status).toBe(401);
    const answers: Record<string, Record<string, string>> = {
      page: (await context.request.get("/sign-in")).headers(),
      api: api.headers(),
      error: Object.fromEntries(stranger.headers),
      static: (await context.request.get("/manifest.webmanifest")).headers(),
    };
    for (const [what, headers] of Object.entries(answers)) {
      expect(headers["x-content-type-options"], what).toBe("nosniff");
      expect(headers["referrer-policy"], what).toBe("strict-origin-when-cross-origin");
      expect(headers["x-frame-options"], what).toBe("DENY");
      expect(headers["content-security-policy"], what).toMatch(/frame-ancestors 'none'/);
      expect(headers["strict-transport-security"], what).toBeUndefined();
    }
    expect(answers.api!["content-security-policy"]).toBe("default-src 'none'; frame-ancestors 'none'");
    expect(answers.error!["content-security-policy"]).toBe("default-src 'none'; frame-ancestors 'none'");
  });
});
