"use client";

import dynamic from "next/dynamic";

// Leaflet reads window when it loads, so the maps are rendered in the browser only.
function MapLoading() {
  return <div className="flex h-[420px] items-center justify-center rounded-xl border border-shingle-200 bg-shingle-50 text-shingle-600">Loading the map…</div>;
}

export const RoutesMap = dynamic(() => import("./routes-map"), { ssr: false, loading: MapLoading });
export const RouteEditorMap = dynamic(() => import("./route-editor-map"), { ssr: false, loading: MapLoading });
export type { MapRoute } from "./routes-map";
export type { EditorMode } from "./route-editor-map";
