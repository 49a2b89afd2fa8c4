"use client";

import { QueryClient, QueryClientProvider } from "@tanstack/react-query";
import { useEffect, useState } from "react";
import { FIELD_PAGES_CACHE } from "@/lib/offline/cache-names";
import { startSyncController } from "@/lib/offline/sync-controller";

// Field routes a volunteer may open with no signal: stored once online in the cache the
// service worker answers field navigations from.
const fieldRoutes = ["/field", "/field/visit", "/field/records", "/safety"];

/** Resolves once the page has loaded and the main thread has had a quiet moment. */
function afterLoadAndIdle(): Promise<void> {
  return new Promise((resolve) => {
    const idle = () => ("requestIdleCallback" in window ? window.requestIdleCallback(() => resolve(), { timeout: 4000 }) : setTimeout(resolve, 1500));
    if (document.readyState === "complete") idle();
    else window.addEventListener("load", idle, { once: true });
  });
}

async function registerServiceWorker() {
  if (!("serviceWorker" in navigator)) return;
  try {
    // Installing the worker and caching pages competes with the page itself on a slow network.
    await afterLoadAndIdle();
    await navigator.serviceWorker.register("/sw.js", { scope: "/" });
    await navigator.serviceWorker.ready;
    if (navigator.onLine && "caches" in window) {
      const cache = await caches.open(FIELD_PAGES_CACHE);
      await Promise.all(
        fieldRoutes.map(async (route) => {
          const res = await fetch(route, { credentials: "same-origin" }).catch(() => null);
          if (res?.ok && !res.redirected) await cache.put(route, res);
        }),
      );
    }
  } catch {
    // Without a service worker the app still works online; the outbox still keeps records.
  }
}

export function FieldProviders({ children }: { children: React.ReactNode }) {
  const [client] = useState(() => new QueryClient({ defaultOptions: { queries: { retry: 1, staleTime: 60_000, networkMode: "always" } } }));
  useEffect(() => {
    void registerServiceWorker();
    startSyncController();
  }, []);
  return <QueryClientProvider client={client}>{children}</QueryClientProvider>;
}
