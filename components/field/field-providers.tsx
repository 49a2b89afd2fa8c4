"use client";

import { QueryClient, QueryClientProvider } from "@tanstack/react-query";
import { createContext, useContext, useEffect, useState } from "react";
import { FIELD_PAGES_CACHE } from "@/lib/offline/cache-names";
import { fieldUser, setFieldUser } from "@/lib/offline/phone-store";
import { startSyncController } from "@/lib/offline/sync-controller";
import { OFFLINE_READY_EVENT } from "./offline-readiness";

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
    // Ask the browser not to clear this site's storage when space runs low: unsent records live
    // there. Browsers may say no (some decide from how often the app is used); nothing else changes.
    void navigator.storage?.persist?.().catch(() => false);
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
      window.dispatchEvent(new Event(OFFLINE_READY_EVENT));
    }
  } catch {
    // Without a service worker the app still works online; the outbox still keeps records.
  }
}

const FieldUserContext = createContext<string | null>(null);

/**
 * The signed-in volunteer's id, to show, edit and send only their items on a shared phone.
 * Outside the providers (a screen rendered on its own) it is the one the phone's store was
 * told about, which the local writes check too.
 */
export function useFieldUserId(): string | null {
  return useContext(FieldUserContext) ?? fieldUser();
}

/**
 * `userId` comes from the server's session check in the field layout. It only chooses what
 * this phone shows and sends: the server checks every item against the session.
 */
export function FieldProviders({ userId, children }: { userId: string; children: React.ReactNode }) {
  const [client] = useState(() => new QueryClient({ defaultOptions: { queries: { retry: 1, staleTime: 60_000, networkMode: "always" } } }));
  // Set while rendering, not in an effect: the screens inside run their effects before this
  // component's own, and new visits must carry their owner from the first one.
  if (typeof window !== "undefined" && fieldUser() !== userId) setFieldUser(userId);
  useEffect(() => {
    void registerServiceWorker();
  }, []);
  useEffect(() => startSyncController(userId), [userId]);
  return (
    <FieldUserContext.Provider value={userId}>
      <QueryClientProvider client={client}>{children}</QueryClientProvider>
    </FieldUserContext.Provider>
  );
}
