import { readdirSync } from "node:fs";
import { join, relative, sep } from "node:path";
import { describe, expect, it } from "vitest";
import { authConfig, publicPaths } from "@/auth.config";

const appDir = join(__dirname, "..", "..", "app");

/** Every page's URL path, read from the app folder: route groups "(name)" do not appear in URLs (Next.js App Router docs, "Route Groups"). */
function pageRoutes(dir = appDir): string[] {
  return readdirSync(dir, { withFileTypes: true }).flatMap((entry) => {
    const full = join(dir, entry.name);
    if (entry.isDirectory()) return pageRoutes(full);
    if (entry.name !== "page.tsx") return [];
    const segments = relative(appDir, dir).split(sep).filter((s) => s && !/^\(.*\)$/.test(s));
    return [`/${segments.join("/")}`];
  });
}

const authorized = (pathname: string) =>
  authConfig.callbacks.authorized({ auth: null, request: { nextUrl: new URL(pathname, "http://localhost") } } as never);

describe("pages open to strangers", () => {
  it("each public path is a page of this app, or has pages beneath it", () => {
    const routes = pageRoutes();
    expect(routes).toContain("/sign-in"); // the reader works
    for (const path of publicPaths) expect(routes.some((r) => r === path || r.startsWith(`${path}/`)), path).toBe(true);
  });

  it("a stranger may open sign-in, safety and an invitation, and nothing else", () => {
    expect(authorized("/sign-in")).toBe(true);
    expect(authorized("/safety")).toBe(true);
    expect(authorized("/invitation/some-token")).toBe(true);
    expect(authorized("/offline")).toBe(false);
    expect(authorized("/field")).toBe(false);
  });
});
