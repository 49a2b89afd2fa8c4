import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { BrowserContext } from "playwright-core";
import { roles, type Role } from "@/lib/auth/roles";
import { SignInPage } from "./pages/sign-in-page";
import { accounts, password } from "./support/accounts";
import { baseUrl, openBrowser } from "./support/browser";

const article = (word: string) => (/^[aeiou]/i.test(word) ? "an" : "a");

// Each role's own page and API route; every other role must be refused both.
const owned: Record<Role, { page: string; api: string }> = {
  volunteer: { page: "/field", api: "/api/field/transects" },
  coordinator: { page: "/review", api: "/api/review/queue" },
  organiser: { page: "/network", api: "/api/network/people" },
  partner: { page: "/data", api: "/api/data/seasons" },
};

describe("without a session", () => {
  for (const role of roles) {
    it(`${owned[role].api} answers 401 and ${owned[role].page} sends to sign-in`, async () => {
      const api = await fetch(`${baseUrl}${owned[role].api}`);
      expect(api.status).toBe(401);
      expect((await api.json()).error.code).toBe("unauthorized");
      const page = await fetch(`${baseUrl}${owned[role].page}`, { redirect: "manual" });
      expect([302, 303, 307]).toContain(page.status);
      expect(page.headers.get("location")).toMatch(/\/sign-in/);
    });
  }
});

describe("with the wrong role", () => {
  const sessions = new Map<Role, { context: BrowserContext; close: () => Promise<void> }>();

  beforeAll(async () => {
    for (const role of roles) {
      const session = await openBrowser();
      const page = await session.context.newPage();
      const signIn = new SignInPage(page);
      await signIn.open();
      await signIn.signIn(accounts[role].email, password);
      await page.waitForURL((url) => url.pathname === accounts[role].home, { timeout: 20_000 });
      await page.close();
      sessions.set(role, session);
    }
  });
  afterAll(async () => {
    for (const s of sessions.values()) await s.close();
  });

  for (const role of roles) {
    for (const other of roles.filter((r) => r !== role)) {
      it(`${article(role)} ${role} is refused the ${other}'s page and API route (403)`, async () => {
        const { context } = sessions.get(role)!;
        const api = await context.request.get(owned[other].api);
        expect(api.status()).toBe(403);
        expect((await api.json()).error.code).toBe("forbidden");
        const page = await context.newPage();
        const response = await page.goto(owned[other].page);
        expect(response?.status()).toBe(403);
        await expect.poll(() => page.getByRole("heading", { level: 1 }).textContent()).toMatch(/Not part of your role/);
        await page.close();
      });
    }
    it(`${article(role)} ${role} reaches their own API route (200)`, async () => {
      const { context } = sessions.get(role)!;
      const api = await context.request.get(owned[role].api);
      expect(api.status()).toBe(200);
    });
  }
});
