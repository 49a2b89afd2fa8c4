import { defineConfig } from "vitest/config";
import { fileURLToPath } from "node:url";
import { BaseSequencer, type TestSpecification } from "vitest/node";

// Suites that change what every account meets (network-setup publishes the first recorder
// agreement, which volunteers must then accept) run after the others.
const LAST = ["network-setup.spec.ts"];
class LastSequencer extends BaseSequencer {
  override async sort(files: TestSpecification[]) {
    const sorted = await super.sort(files);
    const last = (f: TestSpecification) => LAST.some((name) => f.moduleId.endsWith(`/${name}`));
    return [...sorted.filter((f) => !last(f)), ...sorted.filter(last)];
  }
}

// Browser suites: playwright-core drives Debian's chromium against the app that
// scripts/test.sh starts on TEST_BASE_URL. One file at a time keeps two cores calm.
export default defineConfig({
  resolve: { alias: { "@": fileURLToPath(new URL("./", import.meta.url)) } },
  test: {
    name: "browser",
    environment: "node",
    include: ["tests/browser/**/*.spec.ts"],
    fileParallelism: false,
    sequence: { sequencer: LastSequencer },
    testTimeout: 60_000,
    hookTimeout: 90_000,
  },
});
