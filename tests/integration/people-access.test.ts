import { randomUUID } from "node:crypto";
import { readdirSync } from "node:fs";
import { join, relative, sep } from "node:path";
import { eq } from "drizzle-orm";
import { beforeAll, describe, expect, it, vi } from "vitest";
import { db } from "@/db/client";
import { networkChanges, users } from "@/db/schema";
import type { Actor } from "@/lib/auth/guard";
import { acceptAgreement, publishAgreement } from "@/lib/queries/agreements";
import { updatePerson } from "@/lib/queries/people";
import { resetToDemo } from "./support/db";
import { call, demo, userId } from "./transects-helpers";

// Who reaches which area, through the real handlers and layouts: only Auth.js's cookie decoding
// is replaced (the person and their roles are read from the database, as on every request).
const session = vi.hoisted(() => ({ userId: null as string | null }));
vi.mock("@/lib/auth/session", () => ({ sessionUserId: async () => session.userId }));
// The shell's sign-out button imports Auth.js, which only loads inside Next.
vi.mock("@/auth", () => ({ signOut: async () => undefined }));
// Next's forbidden() and redirect() need the app's build settings; here they throw as Next's do,
// with the digest Next reads to answer 403 or a redirect.
const interrupt = (digest: string) => () => {
  throw Object.assign(new Error(digest), { digest });
};
vi.mock("next/navigation", async (original) => ({
  ...(await original<typeof import("next/navigation")>()),
  forbidden: interrupt("NEXT_HTTP_ERROR_FALLBACK;403"),
  unauthorized: interrupt("NEXT_HTTP_ERROR_FALLBACK;401"),
  redirect: interrupt("NEXT_REDIRECT"),
}));

const appDir = join(__dirname, "..", "..", "app");
const METHODS = ["GET", "POST", "PUT", "PATCH", "DELETE"] as const;
type Handler = Parameters<typeof call>[0];

/** Every route handler file under a folder of app/, as its URL path and module. */
async function routesUnder(folder: string) {
  const files: string[] = [];
  const walk = (dir: string) => {
    for (const e of readdirSync(dir, { withFileTypes: true })) {
      if (e.isDirectory()) walk(join(dir, e.name));
      else if (e.name === "route.ts") files.push(join(dir, e.name));
    }
  };
  walk(join(appDir, folder));
  return Promise.all(
    files.map(async (file) => ({
      path: `/${relative(appDir, file).split(sep).slice(0, -1).filter((s) => !/^\(.*\)$/.test(s)).join("/")}`,
      module: (await import(file)) as Partial<Record<(typeof METHODS)[number], Handler>>,
    })),
  );
}

async function each(folder: string, fn: (path: string, method: (typeof METHODS)[number], handler: Handler) => Promise<void>) {
  for (const { path, module } of await routesUnder(folder)) {
    for (const method of METHODS) {
      const handler = module[method];
      if (handler) await fn(path, method, handler);
    }
  }
}

/**
 * Calls a handler as the current session. A write goes as JSON; a route that takes only form posts
 * refuses JSON by its headers (415) before the session is read, so it is asked again with an empty
 * form, which reaches the role check.
 */
async function asRequest(method: string, handler: Handler) {
  const write = method !== "GET" && method !== "DELETE";
  const params = { id: randomUUID() };
  const answer = await call(handler, { method, body: write ? {} : undefined, params });
  if (!write || answer.status !== 415) return answer;
  const boundary = "access-test-boundary";
  return call(handler, { method, rawBody: `--${boundary}--\r\n`, contentType: `multipart/form-data; boundary=${boundary}`, params });
}

/** A page or layout's verdict: rendered, or 403, or a redirect. */
async function verdict(render: () => Promise<unknown>): Promise<"rendered" | "403" | "redirect"> {
  try {
    await render();
    return "rendered";
  } catch (error) {
    const digest = (error as { digest?: string }).digest ?? "";
    if (digest.startsWith("NEXT_HTTP_ERROR_FALLBACK;403")) return "403";
    if (digest.startsWith("NEXT_REDIRECT")) return "redirect";
    throw error;
  }
}

const layouts = {
  field: () => import("@/app/(field)/layout"),
  review: () => import("@/app/(review)/layout"),
  network: () => import("@/app/(network)/layout"),
  data: () => import("@/app/(partner)/layout"),
};
async function areasReached(): Promise<string[]> {
  const reached: string[] = [];
  for (const [area, load] of Object.entries(layouts)) {
    const Layout = (await load()).default as (props: { children: React.ReactNode }) => Promise<unknown>;
    if ((await verdict(() => Layout({ children: null }))) === "rendered") reached.push(area);
  }
  return reached;
}

describe("who reaches which area", () => {
  let twoRoles: string;

  beforeAll(async () => {
    await resetToDemo();
    const [o] = await db().select().from(users).where(eq(users.email, demo.organiser));
    const organiser: Actor = { id: o!.id, roles: o!.roles, name: o!.name, email: o!.email };
    twoRoles = await userId("volunteer02@harrowmere.example");
    await updatePerson(organiser, { userId: twoRoles, roles: ["volunteer", "coordinator"] });
  });

  it.each(["volunteer", "partner"] as const)("refuses a %s every network route, reading or writing, and writes nothing", async (role) => {
    session.userId = await userId(demo[role]);
    const changes = (await db().select().from(networkChanges)).length;
    let checked = 0;
    await each("(network)/api", async (path, method, handler) => {
      const { status } = await asRequest(method, handler);
      expect(status, `${method} ${path}`).toBe(403);
      checked++;
    });
    expect(checked).toBeGreaterThan(15); // the walk found the routes
    expect((await db().select().from(networkChanges)).length).toBe(changes);
  });

  it("a reviewer reads transects, habitat groups, the checklist and the seasons, and changes nothing; people and the agreement stay the organisers'", async () => {
    session.userId = await userId(demo.coordinator);
    await each("(network)/api", async (path, method, handler) => {
      const { status } = await asRequest(method, handler);
      const reads = method === "GET" && /^\/api\/network\/(transects|habitats|checklist|seasons|settings\/season-grace)/.test(path);
      if (reads) expect(status, `${method} ${path}`).not.toBe(403);
      else expect(status, `${method} ${path}`).toBe(403);
    });
  });

  it("organisers have every reviewer power: the review area and its API admit them", async () => {
    session.userId = await userId(demo.organiser);
    const { GET } = await import("@/app/(review)/api/review/queue/route");
    expect((await call(GET as Handler)).status).toBe(200);
    expect(await areasReached()).toEqual(["review", "network"]);
  });

  it("a person with two roles reaches both areas and nothing more", async () => {
    session.userId = twoRoles;
    expect(await areasReached()).toEqual(["field", "review"]);
    const field = await import("@/app/(field)/api/field/reference/route");
    const review = await import("@/app/(review)/api/review/queue/route");
    const data = await import("@/app/(partner)/api/data/seasons/route");
    const people = await import("@/app/(network)/api/network/people/route");
    expect((await call(field.GET as Handler)).status).toBe(200);
    expect((await call(review.GET as Handler)).status).toBe(200);
    expect((await call(data.GET as Handler)).status).toBe(403);
    expect((await call(people.GET as Handler)).status).toBe(403);
  });

  it("each single-role person reaches only their own area; a deactivated person none, at once", async () => {
    const expected = { volunteer: ["field"], coordinator: ["review"], partner: ["data"] } as const;
    for (const [role, areas] of Object.entries(expected)) {
      session.userId = await userId(demo[role as keyof typeof expected]);
      expect(await areasReached(), role).toEqual(areas);
    }
    const [o] = await db().select().from(users).where(eq(users.email, demo.organiser));
    await updatePerson({ id: o!.id, roles: o!.roles, name: o!.name, email: o!.email }, { userId: twoRoles, active: false });
    session.userId = twoRoles;
    const field = await import("@/app/(field)/api/field/reference/route");
    expect((await call(field.GET as Handler)).status).toBe(401);
  });

  it("the field area sends a volunteer to the recorder agreement until they accept its current version", async () => {
    const [o] = await db().select().from(users).where(eq(users.email, demo.organiser));
    const organiser: Actor = { id: o!.id, roles: o!.roles, name: o!.name, email: o!.email };
    const [v] = await db().select().from(users).where(eq(users.email, demo.volunteer));
    const volunteer: Actor = { id: v!.id, roles: v!.roles, name: v!.name, email: v!.email };
    session.userId = volunteer.id;
    const Field = (await layouts.field()).default as (props: { children: React.ReactNode }) => Promise<unknown>;
    expect(await verdict(() => Field({ children: null }))).toBe("rendered");
    const { version } = await publishAgreement(organiser, { body: "How the network uses your records: to measure change.", licence: "CC-BY-4.0" });
    expect(await verdict(() => Field({ children: null }))).toBe("redirect");
    await acceptAgreement(volunteer, { version, publishName: false, newsletter: false });
    expect(await verdict(() => Field({ children: null }))).toBe("rendered");
    await publishAgreement(organiser, { body: "How the network uses your records: to measure change, and photos too.", licence: "CC-BY-4.0" });
    expect(await verdict(() => Field({ children: null }))).toBe("redirect");
  });
});
