// Security headers, built by pure functions. Pages get a Content-Security-Policy with a fresh
// script nonce from proxy.ts; API and static answers get fixed headers from next.config.ts,
// which imports this file at build time (so: relative imports only, no environment reads here).

/** Where the page may load photos from and send them to: the object store's origins. */
export type PolicySources = {
  /** S3_ENDPOINT, S3_BUCKET and S3_FORCE_PATH_STYLE. */
  objectStore: { endpoint: string; bucket: string; pathStyle: boolean };
  /** MAP_TILE_URL, an XYZ template such as https://{s}.tiles.example/{z}/{x}/{y}.png. */
  mapTiles?: string;
};

export type PagePolicyInput = PolicySources & {
  nonce: string;
  /** Served over HTTPS: then mixed content is upgraded (and HSTS is sent, see strictTransportSecurity). */
  https: boolean;
  /** `next dev` only: React needs eval there for its debugging aids (Next's CSP guide). */
  development: boolean;
};

/**
 * The object store's origins. Presigned URLs name the endpoint itself with path-style addressing,
 * and the bucket as a subdomain of it otherwise; both are allowed then, because a client may
 * still fall back to path style (a bucket name with dots, over TLS).
 */
export function objectStoreOrigins({ endpoint, bucket, pathStyle }: PolicySources["objectStore"]): string[] {
  const url = new URL(endpoint);
  if (pathStyle) return [url.origin];
  return [url.origin, `${url.protocol}//${bucket}.${url.host}`];
}

/**
 * The map tiles' origin as a CSP source. A `{s}` subdomain placeholder becomes the `*.` wildcard,
 * which CSP allows only as the host's first label (CSP Level 3, host-source grammar).
 */
export function mapTileSource(template: string | undefined): string[] {
  if (!template) return [];
  const marker = "tile-subdomain-marker";
  const url = new URL(template.replaceAll("{s}", marker).replace(/\{[a-z]+\}/g, "0"));
  const labels = url.hostname.split(".");
  if (labels.slice(1).some((l) => l.includes(marker)) || (labels[0]!.includes(marker) && labels[0] !== marker)) {
    throw new Error("MAP_TILE_URL: {s} may only stand for the whole first label of the host, as in https://{s}.tiles.example/...");
  }
  const port = url.port ? `:${url.port}` : "";
  const host = labels[0] === marker ? `*.${labels.slice(1).join(".")}` : url.hostname;
  return [`${url.protocol}//${host}${port}`];
}

const unique = (values: string[]) => [...new Set(values)];

/** The pages' policy. Styles stay 'unsafe-inline': Leaflet and React set inline styles. */
export function contentSecurityPolicy(input: PagePolicyInput): string {
  const store = objectStoreOrigins(input.objectStore);
  const directives: [string, ...string[]][] = [
    ["default-src", "'self'"],
    // 'strict-dynamic': the scripts Next's nonce-carrying scripts load (its chunks) run too.
    ["script-src", "'self'", `'nonce-${input.nonce}'`, "'strict-dynamic'", ...(input.development ? ["'unsafe-eval'"] : [])],
    ["style-src", "'self'", "'unsafe-inline'"],
    ["img-src", ...unique(["'self'", "data:", "blob:", ...store, ...mapTileSource(input.mapTiles)])],
    // The phone PUTs photos straight to the object store.
    ["connect-src", ...unique(["'self'", ...store])],
    ["font-src", "'self'"],
    ["worker-src", "'self'"],
    ["manifest-src", "'self'"],
    ["object-src", "'none'"],
    ["base-uri", "'self'"],
    ["form-action", "'self'"],
    ["frame-ancestors", "'none'"],
  ];
  if (input.https) directives.push(["upgrade-insecure-requests"]);
  return directives.map((d) => d.join(" ")).join("; ");
}

/** API JSON and static files are never documents that run anything. */
export const NON_DOCUMENT_POLICY = "default-src 'none'; frame-ancestors 'none'";

/**
 * The service worker's own policy (a worker's CSP comes with its script). It fetches on behalf of
 * pages whose own policy already allowed each request, so its connections are left open; it may
 * load scripts only from this origin.
 */
export const SERVICE_WORKER_POLICY = "script-src 'self'; object-src 'none'; base-uri 'none'; frame-ancestors 'none'";

/** One year, subdomains included (RFC 6797 §6.1; one year is common practice). Only over HTTPS. */
export const STRICT_TRANSPORT_SECURITY = "max-age=31536000; includeSubDomains";

/** Headers every answer carries, whatever it is. */
export const COMMON_SECURITY_HEADERS: readonly { key: string; value: string }[] = [
  { key: "X-Content-Type-Options", value: "nosniff" },
  { key: "Referrer-Policy", value: "strict-origin-when-cross-origin" },
  // For browsers that predate frame-ancestors.
  { key: "X-Frame-Options", value: "DENY" },
  { key: "Permissions-Policy", value: "camera=(self), geolocation=(self), microphone=()" },
];

/** A script nonce: 128 random bits, base64 (CSP Level 3 asks for at least 128 bits). */
export function newNonce(): string {
  const bytes = crypto.getRandomValues(new Uint8Array(16));
  return btoa(String.fromCharCode(...bytes));
}
