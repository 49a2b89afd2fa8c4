import { defineConfig } from "vitest/config";
import { fileURLToPath } from "node:url";

// Browser suites: playwright-core drives Debian's chromium against the app that
// scripts/test.sh starts on TEST_BASE_URL. One file at a time keeps two cores calm.
export default defineConfig({
  resolve: { alias: { "@": fileURLToPath(new URL("./", import.meta.url)) } },
  test: {
    name: "browser",
    environment: "node",
    include: ["tests/browser/**/*.spec.ts"],
    fileParallelism: false,
    testTimeout: 60_000,
    hookTimeout: 90_000,
  },
});
