/// <reference lib="webworker" />
import { defaultCache } from "@serwist/next/worker";
import type { PrecacheEntry, SerwistGlobalConfig } from "serwist";
import { CacheableResponsePlugin, NetworkFirst, NetworkOnly, Serwist } from "serwist";
import { FIELD_PAGES_CACHE } from "../lib/offline/cache-names";

declare global {
  interface WorkerGlobalScope extends SerwistGlobalConfig {
    __SW_MANIFEST: (PrecacheEntry | string)[] | undefined;
  }
}
declare const self: ServiceWorkerGlobalScope;

// Field pages a volunteer needs with no signal. Their HTML is cached on every visit online
// (network first, so a fresh copy wins whenever there is signal). Field data lives in
// IndexedDB, not in this cache: see lib/offline.
const fieldPage = (pathname: string) => pathname === "/field" || pathname.startsWith("/field/") || pathname === "/safety";

const serwist = new Serwist({
  precacheEntries: self.__SW_MANIFEST,
  skipWaiting: true,
  clientsClaim: true,
  navigationPreload: false,
  runtimeCaching: [
    {
      matcher: ({ request, url, sameOrigin }) => sameOrigin && request.mode === "navigate" && fieldPage(url.pathname),
      handler: new NetworkFirst({
        cacheName: FIELD_PAGES_CACHE,
        networkTimeoutSeconds: 5,
        matchOptions: { ignoreSearch: true, ignoreVary: true },
        // Only a real page: a redirect to sign-in (an expired session) must not replace the
        // cached field page, or the phone would have nothing to open offline.
        plugins: [new CacheableResponsePlugin({ statuses: [200] })],
      }),
    },
    {
      // API answers are per person and the phone keeps what it needs in IndexedDB: never answer
      // one from a cache, or a shared phone could show one volunteer's records to the next.
      matcher: ({ url, sameOrigin }) => sameOrigin && url.pathname.startsWith("/api/"),
      handler: new NetworkOnly(),
    },
    ...defaultCache,
  ],
});

serwist.addEventListeners();
