import { describe, expect, it } from "vitest";
import { contentSecurityPolicy, mapTileSource, newNonce, objectStoreOrigins, type PagePolicyInput } from "@/lib/http/security-headers";

// Directive and source names from Content Security Policy Level 3 (W3C). The policy is read back
// with that standard's "parse a serialized CSP" rule (directives split on ";", each a name and
// whitespace-separated values), so each check looks at one directive's own sources.
function parse(policy: string): Map<string, string[]> {
  const directives = new Map<string, string[]>();
  for (const token of policy.split(";")) {
    const [name, ...values] = token.trim().split(/\s+/);
    if (!name) continue;
    expect(directives.has(name.toLowerCase()), `${name} appears once`).toBe(false);
    directives.set(name.toLowerCase(), values);
  }
  return directives;
}

const local: PagePolicyInput = {
  nonce: "bm9uY2Utb2YtdGhpcy1yZXF1ZXN0",
  https: false,
  development: false,
  objectStore: { endpoint: "http://127.0.0.1:54330", bucket: "turnstone-photos", pathStyle: true },
};

describe("the pages' Content-Security-Policy", () => {
  it("runs only scripts carrying this request's nonce, and what they load ('strict-dynamic')", () => {
    const script = parse(contentSecurityPolicy(local)).get("script-src")!;
    expect(script).toContain(`'nonce-${local.nonce}'`);
    expect(script).toContain("'strict-dynamic'");
    expect(script).not.toContain("'unsafe-inline'");
    expect(script).not.toContain("'unsafe-eval'");
  });

  it("allows eval only under next dev, where React needs it (Next.js CSP guide)", () => {
    expect(parse(contentSecurityPolicy({ ...local, development: true })).get("script-src")).toContain("'unsafe-eval'");
  });

  it("locks down plugins, base URLs, form targets, framing, workers and the manifest", () => {
    const p = parse(contentSecurityPolicy(local));
    expect(p.get("default-src")).toEqual(["'self'"]);
    expect(p.get("object-src")).toEqual(["'none'"]);
    expect(p.get("base-uri")).toEqual(["'self'"]);
    expect(p.get("form-action")).toEqual(["'self'"]);
    expect(p.get("frame-ancestors")).toEqual(["'none'"]);
    expect(p.get("worker-src")).toEqual(["'self'"]);
    expect(p.get("manifest-src")).toEqual(["'self'"]);
    expect(p.get("style-src")).toEqual(["'self'", "'unsafe-inline'"]);
  });

  it("lets photos load from and upload to the object store, and nothing else off-site", () => {
    const p = parse(contentSecurityPolicy(local));
    expect(p.get("img-src")).toEqual(["'self'", "data:", "blob:", "http://127.0.0.1:54330"]);
    expect(p.get("connect-src")).toEqual(["'self'", "http://127.0.0.1:54330"]);
  });

  it("adds the map tiles' origin to images only", () => {
    const p = parse(contentSecurityPolicy({ ...local, mapTiles: "https://{s}.tiles.example.net/{z}/{x}/{y}.png" }));
    expect(p.get("img-src")).toContain("https://*.tiles.example.net");
    expect(p.get("connect-src")).not.toContain("https://*.tiles.example.net");
  });

  it("upgrades insecure requests only when served over HTTPS (it would break a plain-http local store)", () => {
    expect(parse(contentSecurityPolicy(local)).has("upgrade-insecure-requests")).toBe(false);
    expect(parse(contentSecurityPolicy({ ...local, https: true })).get("upgrade-insecure-requests")).toEqual([]);
  });
});

describe("policy sources from the settings", () => {
  it("names the endpoint for path-style buckets and the bucket's own host otherwise (S3 virtual-hosted addressing)", () => {
    expect(objectStoreOrigins({ endpoint: "http://127.0.0.1:54330/", bucket: "b", pathStyle: true })).toEqual(["http://127.0.0.1:54330"]);
    expect(objectStoreOrigins({ endpoint: "https://s3.eu-west-2.example.com", bucket: "valley-photos", pathStyle: false })).toEqual([
      "https://s3.eu-west-2.example.com",
      "https://valley-photos.s3.eu-west-2.example.com",
    ]);
  });

  it("turns a tile template into one origin, {s} into a first-label wildcard, keeping a port", () => {
    expect(mapTileSource(undefined)).toEqual([]);
    expect(mapTileSource("https://{s}.tiles.example.net/{z}/{x}/{y}.png")).toEqual(["https://*.tiles.example.net"]);
    expect(mapTileSource("http://localhost:8080/tiles/{z}/{x}/{y}.png")).toEqual(["http://localhost:8080"]);
    expect(mapTileSource("https://tiles.example.net/{z}/{x}/{y}{r}.png?key=abc")).toEqual(["https://tiles.example.net"]);
  });

  it("refuses a {s} that a CSP wildcard cannot express (only a whole first label can be *)", () => {
    expect(() => mapTileSource("https://maps.{s}.example.net/{z}/{x}/{y}.png")).toThrow(/MAP_TILE_URL/);
    expect(() => mapTileSource("https://tile-{s}.example.net/{z}/{x}/{y}.png")).toThrow(/MAP_TILE_URL/);
  });
});

describe("script nonces", () => {
  // CSP Level 3 asks for a fresh nonce per response of at least 128 bits (from memory of its
  // nonce-reuse advice).
  it("are 128 random bits in base64 and never repeat", () => {
    const nonces = Array.from({ length: 200 }, newNonce);
    expect(new Set(nonces).size).toBe(200);
    for (const n of nonces) {
      // CSP's base64-value grammar: ALPHA / DIGIT / "+" / "/" / "-" / "_", up to two "=".
      expect(n).toMatch(/^[A-Za-z0-9+/_-]+={0,2}$/);
      expect(Buffer.from(n, "base64")).toHaveLength(16);
    }
  });
});
