import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { BrowserContext } from "playwright-core";
import { demoPeople } from "@/db/seed/network";
import { areasFor, roles, type Role } from "@/lib/auth/roles";
import { SignInPage } from "./pages/sign-in-page";
import { accounts, password } from "./support/accounts";
import { baseUrl, openBrowser } from "./support/browser";

const article = (word: string) => (/^[aeiou]/i.test(word) ? "an" : "a");

// Each area's page and one of its API routes.
const areaOf: Record<string, { page: string; api: string }> = {
  "/field": { page: "/field", api: "/api/field/transects" },
  "/review": { page: "/review", api: "/api/review/queue" },
  "/network": { page: "/network", api: "/api/network/people" },
  "/data": { page: "/data", api: "/api/data/seasons" },
};
const allAreas = Object.keys(areaOf);
// Each sign-in costs a bcrypt comparison (cost 12) and a first page render: four in a row need more than the default hook time.
const SIGN_INS_TIMEOUT = 240_000;
const SIGNED_IN_TEST_TIMEOUT = 120_000;

async function signedIn(email: string, home: string) {
  const session = await openBrowser();
  const page = await session.context.newPage();
  const signIn = new SignInPage(page);
  await signIn.open();
  await signIn.signIn(email, password);
  await page.waitForURL((url) => url.pathname === home, { timeout: 20_000 });
  await page.close();
  return session;
}

/** Opens an area's page and API route, and says whether both were allowed (200) or both refused (403). */
async function reach(context: BrowserContext, area: string): Promise<"allowed" | "refused"> {
  const api = await context.request.get(areaOf[area]!.api);
  const page = await context.newPage();
  const response = await page.goto(areaOf[area]!.page);
  const status = response?.status();
  if (status === 403) await expect.poll(() => page.getByRole("heading", { level: 1 }).textContent()).toMatch(/Not part of your role/);
  await page.close();
  if (api.status() === 200 && status === 200) return "allowed";
  if (api.status() === 403 && status === 403) return "refused";
  throw new Error(`${area}: the API answered ${api.status()} and the page ${status}`);
}

describe("without a session", () => {
  for (const area of allAreas) {
    it(`${areaOf[area]!.api} answers 401 and ${areaOf[area]!.page} sends to sign-in`, async () => {
      const api = await fetch(`${baseUrl}${areaOf[area]!.api}`);
      expect(api.status).toBe(401);
      expect((await api.json()).error.code).toBe("unauthorized");
      const page = await fetch(`${baseUrl}${areaOf[area]!.page}`, { redirect: "manual" });
      expect([302, 303, 307]).toContain(page.status);
      expect(page.headers.get("location")).toMatch(/\/sign-in/);
    });
  }
});

describe("each role's areas", () => {
  const sessions = new Map<Role, { context: BrowserContext; close: () => Promise<void> }>();

  beforeAll(async () => {
    for (const role of roles) sessions.set(role, await signedIn(accounts[role].email, accounts[role].home));
  }, SIGN_INS_TIMEOUT);
  afterAll(async () => {
    for (const s of sessions.values()) await s.close();
  });

  for (const role of roles) {
    it(`${article(role)} ${role} reaches their own areas and is refused every other (403)`, async () => {
      const { context } = sessions.get(role)!;
      const own = areasFor([role]).map((a) => a.home);
      expect(own).toContain(accounts[role].home);
      for (const area of allAreas) expect(await reach(context, area), area).toBe(own.includes(area) ? "allowed" : "refused");
    }, SIGNED_IN_TEST_TIMEOUT);
  }

  it("an organiser also reaches the reviewers' area, and their frame links both areas", async () => {
    const { context } = sessions.get("organiser")!;
    expect(await reach(context, "/review")).toBe("allowed");
    const page = await context.newPage();
    await page.goto("/network");
    const areas = page.getByRole("navigation", { name: "Your areas" });
    await areas.getByRole("link", { name: "Reviewing" }).click();
    await page.waitForURL((url) => url.pathname === "/review");
    await expect.poll(() => page.getByRole("heading", { level: 1 }).textContent()).toMatch(/Sightings to review/);
    await page.close();
  }, SIGNED_IN_TEST_TIMEOUT);
});

describe("a person with two roles", () => {
  // A demo volunteer no other browser suite signs in as; given a second role for this suite only.
  const person = demoPeople.volunteers[10]!;
  let organiser: Awaited<ReturnType<typeof openBrowser>>;
  let personId: string;

  const setRoles = async (list: Role[]) => {
    const answer = await organiser.context.request.patch(`/api/network/people/${personId}`, { data: { roles: list } });
    expect(answer.status()).toBe(200);
  };

  beforeAll(async () => {
    organiser = await signedIn(accounts.organiser.email, accounts.organiser.home);
    const list = await (await organiser.context.request.get("/api/network/people")).json();
    personId = list.people.find((p: { email: string }) => p.email === person.email).id;
    await setRoles(["volunteer", "coordinator"]);
  }, SIGN_INS_TIMEOUT);
  afterAll(async () => {
    await setRoles(["volunteer"]);
    await organiser.close();
  });

  it("lands on their first area, moves between both with the switcher, and reaches nothing more", async () => {
    const session = await signedIn(person.email, "/review");
    try {
      for (const area of allAreas) expect(await reach(session.context, area), area).toBe(area === "/field" || area === "/review" ? "allowed" : "refused");
      const page = await session.context.newPage();
      await page.goto("/review");
      const areas = page.getByRole("navigation", { name: "Your areas" });
      expect(await areas.getByRole("link").allTextContents()).toEqual(["Recording"]);
      await areas.getByRole("link", { name: "Recording" }).click();
      await page.waitForURL((url) => url.pathname === "/field");
      await expect.poll(() => page.getByRole("navigation", { name: "Your areas" }).getByRole("link").allTextContents()).toEqual(["Reviewing"]);
      await page.close();
    } finally {
      await session.close();
    }
  }, SIGNED_IN_TEST_TIMEOUT);

  it("loses the second area at once when the role is taken away, session unchanged", async () => {
    const session = await signedIn(person.email, "/review");
    try {
      await setRoles(["volunteer"]);
      expect(await reach(session.context, "/review")).toBe("refused");
      expect(await reach(session.context, "/field")).toBe("allowed");
    } finally {
      await setRoles(["volunteer", "coordinator"]);
      await session.close();
    }
  }, SIGNED_IN_TEST_TIMEOUT);
});
