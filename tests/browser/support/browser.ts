import { mkdtempSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import { chromium, type BrowserContext, type BrowserContextOptions } from "playwright-core";

export const baseUrl = process.env.TEST_BASE_URL ?? "http://localhost:3100";

// Flags from the project's toolchain notes: no sandbox as root, no background network calls.
const args = ["--no-sandbox", "--disable-gpu", "--disable-quic", "--no-first-run", "--disable-background-networking", "--disable-component-update", "--disable-sync"];

export async function openBrowser(options: BrowserContextOptions = {}): Promise<{ context: BrowserContext; close: () => Promise<void> }> {
  const dir = mkdtempSync(path.join(tmpdir(), "turnstone-chromium-"));
  const context = await chromium.launchPersistentContext(dir, {
    executablePath: process.env.CHROMIUM_PATH ?? "/usr/bin/chromium",
    headless: true,
    args,
    baseURL: baseUrl,
    ...options,
  });
  return {
    context,
    close: async () => {
      await context.close();
      rmSync(dir, { recursive: true, force: true });
    },
  };
}
