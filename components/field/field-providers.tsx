"use client";

import { QueryClient, QueryClientProvider } from "@tanstack/react-query";
import { useEffect, useState } from "react";
import { startSyncController } from "@/lib/offline/sync-controller";

// Field routes a volunteer may open with no signal: fetched once online so the service
// worker holds a copy of each.
const fieldRoutes = ["/field", "/field/visit", "/field/records", "/safety"];

async function registerServiceWorker() {
  if (!("serviceWorker" in navigator)) return;
  try {
    await navigator.serviceWorker.register("/sw.js", { scope: "/" });
    await navigator.serviceWorker.ready;
    if (navigator.onLine) await Promise.all(fieldRoutes.map((r) => fetch(r, { credentials: "same-origin" }).catch(() => undefined)));
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
