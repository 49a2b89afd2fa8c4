"use client";

import { useState } from "react";
import { TileLayer } from "react-leaflet";
import { useTileCreditHtml } from "./tile-credit";

/**
 * Background tiles from the configured XYZ template, taken away at the first tile that fails
 * (offline, blocked, or the server is down): the routes then stay on the map's plain background
 * instead of a grid of broken images.
 */
export function SafeTileLayer({ url, onFailed }: { url: string | null; onFailed?: () => void }) {
  const [failed, setFailed] = useState(false);
  const attribution = useTileCreditHtml();
  if (!url || failed) return null;
  return (
    <TileLayer
      url={url}
      attribution={attribution}
      eventHandlers={{
        tileerror: () => {
          setFailed(true);
          onFailed?.();
        },
      }}
    />
  );
}
