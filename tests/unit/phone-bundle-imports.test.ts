import { existsSync, readFileSync } from "node:fs";
import path from "node:path";
import { describe, expect, it } from "vitest";

// The field pages have a 200 kB JavaScript budget (bench:field). A validator or a server module
// pulled in by one stray value import costs a sixth of it, and nothing else would notice: this
// walks the static imports of the phone's code (lazy `import()` chunks are not followed).
const root = path.resolve(__dirname, "../..");
const entries = [
  "components/field/field-home.tsx",
  "components/field/field-providers.tsx",
  "components/field/outbox-panel.tsx",
  "components/field/my-records.tsx",
  "components/field/visit/visit-screen.tsx",
  "components/field/visit/recording-screen.tsx",
  "components/field/visit/sighting-form.tsx",
  "components/shell/sign-out-button.tsx",
  "lib/offline/sync-controller.ts",
];
const forbidden = ["zod", "drizzle-orm", "postgres", "sharp", "server-only", "@aws-sdk/client-s3"];

function resolve(from: string, spec: string): string | null {
  const base = spec.startsWith("@/") ? path.join(root, spec.slice(2)) : spec.startsWith(".") ? path.resolve(path.dirname(from), spec) : null;
  if (!base) return null;
  for (const candidate of [base, `${base}.ts`, `${base}.tsx`, path.join(base, "index.ts"), path.join(base, "index.tsx")]) {
    if (existsSync(candidate) && !candidate.endsWith("/")) try { readFileSync(candidate); return candidate; } catch { /* a folder */ }
  }
  return null;
}

/** Static value imports of one file (type-only imports vanish from the bundle). */
function importsOf(file: string): string[] {
  const text = readFileSync(file, "utf8");
  // A "use server" module reaches the phone as a reference to a server action, not as code.
  if (/^\s*["']use server["']/.test(text)) return [];
  const found: string[] = [];
  for (const m of text.matchAll(/^\s*(import|export)\s+(type\s+)?(?:[^'"]*?\s+from\s+)?["']([^"']+)["']/gm)) {
    if (!m[2]) found.push(m[3]!);
  }
  return found;
}

function walk(entry: string): { packages: Map<string, string>; files: number } {
  const reached = new Map<string, string>(); // package -> file that imports it
  const seen = new Set<string>();
  const queue = [path.join(root, entry)];
  while (queue.length) {
    const file = queue.pop()!;
    if (seen.has(file)) continue;
    seen.add(file);
    for (const spec of importsOf(file)) {
      const local = resolve(file, spec);
      if (local) queue.push(local);
      else if (!spec.startsWith(".") && !spec.startsWith("@/")) reached.set(spec, path.relative(root, file));
    }
  }
  return { packages: reached, files: seen.size };
}

describe("the phone's field code stays light", () => {
  it.each(entries)("%s reaches no validator or server-side package", (entry) => {
    const { packages, files } = walk(entry);
    const offending = forbidden.filter((p) => packages.has(p)).map((p) => `${p} (imported by ${packages.get(p)})`);
    expect(offending).toEqual([]);
    expect(files).toBeGreaterThan(1); // the walk really followed the file's own imports
  });

  it("would notice a validator imported by a phone module", () => {
    expect(walk("lib/photos/contract.ts").packages.has("zod")).toBe(true);
  });
});
