import { existsSync, readdirSync, readFileSync } from "node:fs";
import path from "node:path";
import { describe, expect, it } from "vitest";

// The engine's method is written down inside the repository (lib/change/README.md), so the
// repository stands on its own: nothing in lib/change points at a document outside it, and
// every file the README names exists.
const root = process.cwd();
const changeDir = path.join(root, "lib/change");
const readme = readFileSync(path.join(changeDir, "README.md"), "utf8");
const outside = /(^|[\s`(])(\/work\/|\/tmp\/|\/home\/|\.\.\/shared\/)|method\.md/m;

describe("lib/change stands on its own", () => {
  it("neither the README nor the engine's files refer to a document outside the repository", () => {
    expect(outside.test("It implements `../shared/method.md`")).toBe(true); // the check can fail
    const offenders = readdirSync(changeDir).filter((f) => outside.test(readFileSync(path.join(changeDir, f), "utf8")));
    expect(offenders).toEqual([]);
  });

  it("states the method's formulas, sources and check values", () => {
    for (const heading of ["## The method", "## Check values", "## Sources"]) expect(readme).toContain(heading);
    expect(readme).toContain("(b + c) / den");
    expect(readme).toContain("t = 4.0621, df = 9, p = 0.002833");
    expect(readme).toContain("Legendre, P. (2019)");
  });

  it("names only files that exist", () => {
    const named = [...readme.matchAll(/`((?:lib|tests|scripts)\/[\w./-]+\.\w+)`/g)].map((m) => m[1]!);
    expect(named.length).toBeGreaterThan(4);
    expect(named.filter((p) => !existsSync(path.join(root, p)))).toEqual([]);
  });
});
