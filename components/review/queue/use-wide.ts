"use client";

import { useSyncExternalStore } from "react";

// Whether the list and the open sighting fit side by side (Tailwind's lg, 64rem). On a narrower
// screen the open sighting takes the whole page, so the focus goes to it instead of the list.
const QUERY = "(min-width: 64rem)";

const subscribe = (notify: () => void) => {
  if (typeof window.matchMedia !== "function") return () => {};
  const list = window.matchMedia(QUERY);
  list.addEventListener("change", notify);
  return () => list.removeEventListener("change", notify);
};
const snapshot = () => (typeof window.matchMedia === "function" ? window.matchMedia(QUERY).matches : true);

export const useWide = () => useSyncExternalStore(subscribe, snapshot, () => true);
