// npm run bench:field: loads the field home and the add-sighting screen (also with its form opened) in Chromium with phone
// emulation, 4x CPU slowdown and a slow mobile network (DevTools protocol), cold and warm
// (service worker), and prints JavaScript bytes transferred, LCP and CLS against the targets.
// Needs the app running (npm start); BENCH_BASE_URL overrides http://localhost:3000.
import { mkdtempSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import { gzipSync } from "node:zlib";
import { chromium, type BrowserContext, type CDPSession, type Page } from "playwright-core";
import { demoPassword, demoPeople } from "../db/seed/network";

const base = process.env.BENCH_BASE_URL ?? "http://localhost:3000";
// "Slow 4G" as DevTools and Lighthouse define it (150 ms RTT, 1.6 Mbit/s down, 750 kbit/s up), from memory.
const network = { offline: false, latency: 150, downloadThroughput: (1.6 * 1024 * 1024) / 8, uploadThroughput: (750 * 1024) / 8 };
const targets = { jsKb: 200, lcpMs: 2500, cls: 0.1 };

type Measure = { route: string; mode: "cold" | "warm"; jsKb: number; jsFromServiceWorker: number; lcpMs: number | null; cls: number; usableMs: number };

const metricsScript = () => {
  const w = window as unknown as { __lcp: number | null; __cls: number };
  w.__lcp = null;
  w.__cls = 0;
  new PerformanceObserver((list) => {
    for (const e of list.getEntries()) w.__lcp = e.startTime;
  }).observe({ type: "largest-contentful-paint", buffered: true });
  new PerformanceObserver((list) => {
    for (const e of list.getEntries() as (PerformanceEntry & { value: number; hadRecentInput: boolean })[]) if (!e.hadRecentInput) w.__cls += e.value;
  }).observe({ type: "layout-shift", buffered: true });
};

async function throttle(cdp: CDPSession) {
  await cdp.send("Network.enable");
  await cdp.send("Network.emulateNetworkConditions", network);
  await cdp.send("Emulation.setCPUThrottlingRate", { rate: 4 });
}

type Step = (page: Page) => Promise<void>;

async function measure(context: BrowserContext, route: string, mode: Measure["mode"], ready: string, label?: string, then?: Step): Promise<Measure> {
  const page = await context.newPage();
  await page.addInitScript(metricsScript);
  const cdp = await context.newCDPSession(page);
  await throttle(cdp);
  const scripts = new Map<string, boolean>();
  let jsBytes = 0;
  let fromSw = 0;
  const notFromNetwork: string[] = []; // scripts a service worker or a cache answered
  const cached = new Set<string>();
  cdp.on("Network.requestServedFromCache", (e) => cached.add(e.requestId));
  cdp.on("Network.responseReceived", (e) => {
    if (e.type === "Script") {
      const fromNetwork = !(e.response.fromServiceWorker || e.response.fromDiskCache || e.response.fromPrefetchCache || cached.has(e.requestId));
      scripts.set(e.requestId, fromNetwork);
      if (!fromNetwork) notFromNetwork.push(e.response.url);
      if (e.response.fromServiceWorker) fromSw++;
    }
  });
  cdp.on("Network.loadingFinished", (e) => {
    if (scripts.get(e.requestId)) jsBytes += e.encodedDataLength; // body and headers as sent
  });
  const started = Date.now();
  await page.goto(`${base}${route}`, { waitUntil: "commit", timeout: 120_000 });
  // LCP is when the main content is painted; "usable" is when the screen's own control works.
  await page.locator(ready).first().waitFor({ timeout: 120_000 });
  const usableMs = Date.now() - started;
  await page.waitForLoadState("load");
  if (then) await then(page); // e.g. open the sighting form, whose code loads on first use
  await page.waitForTimeout(3000); // let LCP settle and late shifts happen
  const { lcp, cls } = await page.evaluate(() => {
    const w = window as unknown as { __lcp: number | null; __cls: number };
    return { lcp: w.__lcp, cls: w.__cls };
  });
  await page.close();
  // Cold means a phone that has never been here: a script a service worker (installed during this
  // very load) or a cache answered counts too, at its gzip size, as it would have come over the network.
  if (mode === "cold") for (const url of notFromNetwork) jsBytes += gzipSync(Buffer.from(await (await fetch(url)).arrayBuffer())).length;
  return { route: label ?? route.split("?")[0] + (route.includes("?") ? "?id=…" : ""), mode, jsKb: jsBytes / 1024, jsFromServiceWorker: fromSw, lcpMs: lcp, cls, usableMs };
}

async function clearCaches(context: BrowserContext, page: Page) {
  // Cold: no HTTP cache, no service worker, no Cache Storage; cookies and IndexedDB stay.
  const cdp = await context.newCDPSession(page);
  await cdp.send("Network.clearBrowserCache");
  await cdp.send("Storage.clearDataForOrigin", { origin: new URL(base).origin, storageTypes: "cache_storage,service_workers" });
  await cdp.detach();
}

async function waitForServiceWorker(page: Page) {
  await page.goto(`${base}/field`);
  // waitForFunction does not await an async predicate, so poll an evaluate instead.
  for (let i = 0; i < 240; i++) {
    const ready = await page.evaluate(async () => {
      if (!navigator.serviceWorker.controller) return false;
      const keys = (await (await caches.open("turnstone-field-pages")).keys()).map((r) => new URL(r.url).pathname);
      return keys.includes("/field") && keys.includes("/field/visit");
    });
    if (ready) return;
    await page.waitForTimeout(500);
  }
  throw new Error("service worker not ready");
}

const dir = mkdtempSync(path.join(tmpdir(), "turnstone-bench-field-"));
const context = await chromium.launchPersistentContext(dir, {
  executablePath: process.env.CHROMIUM_PATH ?? "/usr/bin/chromium",
  headless: true,
  args: ["--no-sandbox", "--disable-gpu", "--disable-quic", "--no-first-run", "--disable-background-networking", "--disable-component-update", "--disable-sync"],
  viewport: { width: 390, height: 844 },
  isMobile: true,
  hasTouch: true,
  deviceScaleFactor: 2,
});
try {
  const page = await context.newPage();
  await page.goto(`${base}/sign-in`);
  await page.waitForLoadState("networkidle");
  await page.getByLabel("E-mail").fill(demoPeople.volunteers[0]!.email);
  await page.getByLabel("Password").fill(demoPassword);
  await page.getByRole("button", { name: "Sign in" }).click();
  await page.waitForURL((u) => u.pathname === "/field", { timeout: 30_000 });
  // A visit in progress on this phone, so the add-sighting screen has something to open.
  await page.getByRole("link", { name: "Start a walk" }).first().click();
  const ack = page.getByRole("button", { name: "I have read this and will take care" });
  await ack.waitFor({ timeout: 30_000 }).then(() => ack.click()).catch(() => undefined);
  await page.getByRole("button", { name: "Start recording" }).click();
  await page.getByRole("button", { name: "+ Add a sighting" }).waitFor();
  const visitRoute = new URL(page.url()).pathname + new URL(page.url()).search;

  const openSightingForm: Step = async (p) => {
    await p.getByRole("button", { name: "+ Add a sighting" }).click();
    await p.getByRole("searchbox", { name: "Species" }).waitFor({ timeout: 120_000 });
  };
  const routes: { route: string; ready: string; label?: string; then?: Step }[] = [
    { route: "/field", ready: "[data-testid=assigned-transect]" },
    { route: visitRoute, ready: "text=+ Add a sighting" },
    // The same screen with the add-sighting form opened, counting the form's own code.
    { route: visitRoute, ready: "text=+ Add a sighting", label: "/field/visit + form", then: openSightingForm },
  ];
  const results: Measure[] = [];
  for (const r of routes) {
    await clearCaches(context, page);
    results.push(await measure(context, r.route, "cold", r.ready, r.label, r.then));
    await waitForServiceWorker(page);
    results.push(await measure(context, r.route, "warm", r.ready, r.label, r.then));
  }
  await page.close();

  console.log(`bench:field against ${base} (phone 390x844, CPU 4x slower, Slow 4G)`);
  console.log("JS kB: cold = every script the screen ran (transfer size, or gzip size where a cache or the service worker answered);");
  console.log("       warm = bytes that still came over the network (the rest came from the service worker).");
  console.log("route                     mode   JS kB (gzip)           JS from SW  LCP ms   CLS    usable ms");
  for (const m of results) {
    console.log(
      `${m.route.padEnd(25)} ${m.mode.padEnd(6)} ${m.jsKb.toFixed(1).padStart(10)}            ${String(m.jsFromServiceWorker).padStart(5)}    ${m.lcpMs == null ? "  n/a" : m.lcpMs.toFixed(0).padStart(5)}  ${m.cls.toFixed(3)}  ${String(m.usableMs).padStart(7)}`,
    );
  }
  const cold = results.filter((m) => m.mode === "cold");
  const verdict = (ok: boolean) => (ok ? "PASS" : "FAIL");
  console.log(`JavaScript <= ${targets.jsKb} kB on field routes (cold): ${verdict(cold.every((m) => m.jsKb <= targets.jsKb))}`);
  console.log(`LCP < ${targets.lcpMs} ms cold: ${verdict(cold.every((m) => m.lcpMs != null && m.lcpMs < targets.lcpMs))}`);
  console.log(`CLS < ${targets.cls}: ${verdict(results.every((m) => m.cls < targets.cls))}`);
} finally {
  await context.close();
  rmSync(dir, { recursive: true, force: true });
}
