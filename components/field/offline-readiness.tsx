"use client";

import { useEffect, useState } from "react";
import { FIELD_PAGES_CACHE } from "@/lib/offline/cache-names";

/** Sent by the field providers once the service worker runs and the field pages are stored. */
export const OFFLINE_READY_EVENT = "turnstone:offline-ready";
const needed = ["/field", "/field/visit"];

type Readiness = "checking" | "ready" | "not-yet" | "unsupported";

async function check(): Promise<Readiness> {
  if (!("serviceWorker" in navigator) || !("caches" in window)) return "unsupported";
  if (!navigator.serviceWorker.controller) return "not-yet";
  const cache = await caches.open(FIELD_PAGES_CACHE);
  const stored = (await cache.keys()).map((r) => new URL(r.url).pathname);
  return needed.every((p) => stored.includes(p)) ? "ready" : "not-yet";
}

/**
 * Tells the volunteer whether this phone can be taken out of signal yet: the service worker is
 * running and holds the field pages (their transects and checklist are in IndexedDB by then).
 */
export function OfflineReadiness({ hasReference }: { hasReference: boolean }) {
  const [state, setState] = useState<Readiness>("checking");
  useEffect(() => {
    const update = () => void check().then(setState).catch(() => setState("not-yet"));
    update();
    window.addEventListener(OFFLINE_READY_EVENT, update);
    return () => window.removeEventListener(OFFLINE_READY_EVENT, update);
  }, []);
  const ready = state === "ready" && hasReference;
  const text =
    state === "checking" ? "" :
    state === "unsupported" ? "This browser cannot keep Turnstone for use with no signal: record with a signal, or use another browser." :
    ready ? "This phone is ready to record with no signal." :
    "Getting this phone ready for no signal… keep Turnstone open while you have a signal.";
  // The lines keep their height while the check runs, so the screen does not jump when it fills in.
  return (
    <p role="status" data-testid="offline-readiness" className={`min-h-10 text-sm ${ready ? "text-tideline-700" : "text-sand-800"}`}>
      {text}
    </p>
  );
}
