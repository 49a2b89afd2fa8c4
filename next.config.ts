import type { NextConfig } from "next";

const nextConfig: NextConfig = {
  // Keeps `unauthorized()` / `forbidden()` available so pages answer 401/403 with their own screens.
  experimental: { authInterrupts: true },
  serverExternalPackages: ["sharp", "postgres", "libheif-js", "piscina"],
  poweredByHeader: false,
  async headers() {
    return [
      {
        source: "/:path*",
        headers: [
          { key: "X-Content-Type-Options", value: "nosniff" },
          { key: "Referrer-Policy", value: "strict-origin-when-cross-origin" },
          { key: "X-Frame-Options", value: "DENY" },
          { key: "Permissions-Policy", value: "camera=(self), geolocation=(self), microphone=()" },
        ],
      },
      { source: "/sw.js", headers: [{ key: "Cache-Control", value: "no-cache" }, { key: "Service-Worker-Allowed", value: "/" }] },
    ];
  },
};

export default nextConfig;
