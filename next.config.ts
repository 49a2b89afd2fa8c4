import type { NextConfig } from "next";
import { COMMON_SECURITY_HEADERS, NON_DOCUMENT_POLICY, SERVICE_WORKER_POLICY, STRICT_TRANSPORT_SECURITY } from "./lib/http/security-headers";
import { requestBodyLimits } from "./lib/limits/request-bodies";

// Headers here are fixed when the app is built, so nothing depends on the environment: the
// pages' policy, with its nonce and the store's and tiles' origins, is set per request in proxy.ts
// (which replaces the fixed policy below on pages).
const nextConfig: NextConfig = {
  experimental: {
    // Keeps `unauthorized()` / `forbidden()` available so pages answer 401/403 with their own screens.
    authInterrupts: true,
    serverActions: { bodySizeLimit: requestBodyLimits.serverAction },
  },
  serverExternalPackages: ["sharp", "postgres", "libheif-js", "piscina"],
  poweredByHeader: false,
  async headers() {
    return [
      {
        source: "/:path*",
        headers: [...COMMON_SECURITY_HEADERS, { key: "Content-Security-Policy", value: NON_DOCUMENT_POLICY }],
      },
      {
        // HSTS counts only when it arrives over HTTPS (RFC 6797 §8.1), which a TLS-terminating proxy
        // reports in X-Forwarded-Proto; never sent on plain-http localhost.
        source: "/:path*",
        has: [{ type: "header", key: "x-forwarded-proto", value: "https" }],
        headers: [{ key: "Strict-Transport-Security", value: STRICT_TRANSPORT_SECURITY }],
      },
      {
        source: "/sw.js",
        headers: [
          { key: "Cache-Control", value: "no-cache" },
          { key: "Service-Worker-Allowed", value: "/" },
          { key: "Content-Security-Policy", value: SERVICE_WORKER_POLICY },
        ],
      },
    ];
  },
};

export default nextConfig;
