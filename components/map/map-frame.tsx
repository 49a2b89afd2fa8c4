"use client";

import "leaflet/dist/leaflet.css";
import { useEffect, useState, type ReactNode } from "react";
import { MapContainer, useMap } from "react-leaflet";
import type { LatLngBoundsExpression } from "leaflet";
import { MAP_PLAIN_BACKGROUND } from "@/lib/geo/palette";
import { SafeTileLayer } from "./safe-tile-layer";

function FitTo({ bounds, fitKey }: { bounds: LatLngBoundsExpression | null; fitKey: string | number }) {
  const map = useMap();
  useEffect(() => {
    if (bounds) map.fitBounds(bounds, { padding: [24, 24], maxZoom: 17 });
    // Refit when the caller says the content is new, not on every redraw.
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [map, fitKey]);
  return null;
}

/** A Leaflet map on our plain background, with tiles when they are configured and load. */
export function MapFrame({ tileUrl, bounds, fitKey, label, height = 420, children }: { tileUrl: string | null; bounds: LatLngBoundsExpression | null; fitKey: string | number; label: string; height?: number; children: ReactNode }) {
  const [tilesFailed, setTilesFailed] = useState(false);
  return (
    <figure className="space-y-1">
      <div role="region" aria-label={label} data-tiles={tileUrl && !tilesFailed ? "on" : "off"} className="overflow-hidden rounded-xl border border-shingle-200">
        <MapContainer
          center={[51.05, -1.3]}
          zoom={12}
          style={{ height, background: MAP_PLAIN_BACKGROUND }}
          scrollWheelZoom={false}
        >
          <SafeTileLayer url={tileUrl} onFailed={() => setTilesFailed(true)} />
          <FitTo bounds={bounds} fitKey={fitKey} />
          {children}
        </MapContainer>
      </div>
      {tileUrl && tilesFailed && <figcaption role="status" className="text-sm text-shingle-600">Map tiles could not load, so routes are drawn on a plain background.</figcaption>}
      {!tileUrl && <figcaption className="text-sm text-shingle-600">No map tiles are set up (MAP_TILE_URL): routes are drawn on a plain background.</figcaption>}
    </figure>
  );
}
