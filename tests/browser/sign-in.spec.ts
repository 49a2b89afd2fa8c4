import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { BrowserContext } from "playwright-core";
import { roles } from "@/lib/auth/roles";
import { SignInPage } from "./pages/sign-in-page";
import { accounts, password } from "./support/accounts";
import { seriousViolations } from "./support/axe";
import { baseUrl, openBrowser } from "./support/browser";

describe("signing in", () => {
  let context: BrowserContext;
  let close: () => Promise<void>;

  beforeAll(async () => {
    ({ context, close } = await openBrowser());
  });
  afterAll(async () => close());

  it("the sign-in page has no serious or critical accessibility violations (axe-core)", async () => {
    const page = await context.newPage();
    await new SignInPage(page).open();
    expect(await seriousViolations(page)).toEqual([]);
    await page.close();
  });

  it("a wrong password shows a clear message and does not sign in", async () => {
    const page = await context.newPage();
    const signIn = new SignInPage(page);
    await signIn.open();
    await signIn.signIn(accounts.volunteer.email, "not-the-password");
    await expect.poll(() => signIn.alert().textContent()).toMatch(/do not match an active account/);
    expect(new URL(page.url()).pathname).toBe("/sign-in");
    await page.close();
  });

  it("an unknown e-mail gets the same message as a wrong password", async () => {
    const page = await context.newPage();
    const signIn = new SignInPage(page);
    await signIn.open();
    await signIn.signIn("nobody-here@harrowmere.example", "whatever-password");
    await expect.poll(() => signIn.alert().textContent()).toMatch(/do not match an active account/);
    await page.close();
  });

  it("a return path that a browser reads as another site (/\\evil.example) is dropped: the volunteer lands on their home", async () => {
    const { context: own, close: closeOwn } = await openBrowser();
    const page = await own.newPage();
    const signIn = new SignInPage(page);
    await signIn.open("/\\evil.example/field");
    await signIn.signIn(accounts.volunteer.email, password);
    await page.waitForURL((url) => url.pathname === accounts.volunteer.home, { timeout: 20_000 });
    expect(new URL(page.url()).origin).toBe(new URL(baseUrl).origin);
    await closeOwn();
  });

  it("a return path on this site is followed after sign-in, query included", async () => {
    const { context: own, close: closeOwn } = await openBrowser();
    const page = await own.newPage();
    const signIn = new SignInPage(page);
    await signIn.open("/field/records?from=sign-in");
    await signIn.signIn(accounts.volunteer.email, password);
    await page.waitForURL((url) => url.pathname === "/field/records", { timeout: 20_000 });
    expect(new URL(page.url()).search).toBe("?from=sign-in");
    await closeOwn();
  });

  it("repeated failures for one e-mail from one connection are asked to wait, and told how long; the first three never are", async () => {
    const page = await context.newPage();
    const signIn = new SignInPage(page);
    await signIn.open();
    // An address no account has: the limit applies all the same, and says nothing about whether it exists.
    const email = `nobody-${Date.now()}@harrowmere.example`;
    // The waits double from 1 s after the third failure, so however slowly this machine types, a try soon lands inside one.
    let answer = "";
    let tries = 0;
    while (tries < 12 && !/Too many/.test(answer)) {
      answer = await signIn.refusedMessage(email, `wrong-password-${tries}`);
      tries++;
      if (tries <= 3) expect(answer).toMatch(/do not match an active account/);
    }
    expect(tries).toBeGreaterThan(3);
    expect(answer).toMatch(/^Too many sign-in attempts\. Try again in \d+ (seconds?|minutes?)\.$/);
    await page.close();
  });

  for (const role of roles) {
    it(`a ${role} signs in, lands on their home, and it passes axe-core`, async () => {
      const { context: own, close: closeOwn } = await openBrowser();
      const page = await own.newPage();
      const signIn = new SignInPage(page);
      await signIn.open();
      await signIn.signIn(accounts[role].email, password);
      await page.waitForURL((url) => url.pathname === accounts[role].home, { timeout: 20_000 });
      await expect.poll(() => page.getByRole("heading", { level: 1 }).textContent()).toMatch(accounts[role].heading);
      expect(await seriousViolations(page)).toEqual([]);
      await closeOwn();
    });
  }
});
