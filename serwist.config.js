// Service worker build (configurator mode, because Next 16 builds with Turbopack).
// Runs after `next build`: bundles app/sw.ts and injects the precache list of built assets.
import { serwist } from "@serwist/next/config";

export default serwist({
  swSrc: "app/sw.ts",
  swDest: "public/sw.js",
  // The field pages are per-person and dynamic: they are cached at run time, not precached.
  precachePrerendered: false,
  globIgnores: ["**/*.map"],
});
