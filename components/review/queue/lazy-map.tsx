"use client";

import dynamic from "next/dynamic";

// Leaflet reads window when it loads, so the map is rendered in the browser only.
export const SightingMap = dynamic(() => import("./sighting-map"), {
  ssr: false,
  loading: () => <div className="flex h-[280px] items-center justify-center rounded-xl border border-shingle-200 bg-shingle-50 text-shingle-600">Loading the map…</div>,
});
