"use client";

import { CircleMarker, Polyline, Tooltip } from "react-leaflet";
import { colourHex } from "@/lib/geo/palette";
import type { Position } from "@/lib/geo/types";
import { boundsOf, toLatLngs } from "./coords";
import { MapFrame } from "./map-frame";

export type MapRoute = {
  id: string;
  label: string;
  /** A palette key (lib/geo/palette.ts). */
  colour: string;
  /** The route, or null when only its generalised centre may be shown. */
  coordinates: Position[] | null;
  centre?: Position;
  detail?: string;
  /** Faded and dashed (a retired transect). */
  dimmed?: boolean;
  /** Dashed only (every other section of one route). */
  dashed?: boolean;
};

/** Many routes at once, each in its habitat group's colour; a click opens the transect. */
export default function RoutesMap({ routes, tileUrl, label, onOpen }: { routes: MapRoute[]; tileUrl: string | null; label: string; onOpen?: (id: string) => void }) {
  const lines = routes.flatMap((r) => (r.coordinates ? [r.coordinates] : r.centre ? [[r.centre]] : []));
  return (
    <MapFrame tileUrl={tileUrl} bounds={boundsOf(lines)} fitKey={routes.map((r) => r.id).join(",")} label={label}>
      {routes.map((r) => {
        const colour = colourHex(r.colour);
        const tip = (
          <Tooltip sticky>
            <strong>{r.label}</strong>
            {r.detail ? <br /> : null}
            {r.detail}
          </Tooltip>
        );
        const eventHandlers = onOpen ? { click: () => onOpen(r.id) } : undefined;
        if (r.coordinates) {
          return (
            <Polyline key={r.id} positions={toLatLngs(r.coordinates)} pathOptions={{ color: colour, weight: 5, opacity: r.dimmed ? 0.45 : 1, dashArray: r.dimmed ? "6 8" : r.dashed ? "10 6" : undefined }} eventHandlers={eventHandlers}>
              {tip}
            </Polyline>
          );
        }
        return r.centre ? (
          <CircleMarker key={r.id} center={toLatLngs([r.centre])[0]!} radius={14} pathOptions={{ color: colour, dashArray: "4 4", fillOpacity: 0.1 }} eventHandlers={eventHandlers}>
            {tip}
          </CircleMarker>
        ) : null;
      })}
    </MapFrame>
  );
}
