import type { LatLngBoundsExpression, LatLngTuple } from "leaflet";
import type { Position } from "@/lib/geo/types";

// GeoJSON orders positions [longitude, latitude] (RFC 7946 §3.1.1); Leaflet wants [lat, lng].

export const toLatLngs = (coordinates: Position[]): LatLngTuple[] => coordinates.map(([lon, lat]) => [lat, lon]);

const round6 = (x: number) => Math.round(x * 1e6) / 1e6;

/** Leaflet's points back to GeoJSON positions, to a micro-degree (about 0.1 m). */
export const toPositions = (latlngs: { lat: number; lng: number }[]): Position[] => latlngs.map((ll) => [round6(ll.lng), round6(ll.lat)]);

/** The box around every line, or null when there is nothing to show. */
export function boundsOf(lines: Position[][]): LatLngBoundsExpression | null {
  let [south, west, north, east] = [Infinity, Infinity, -Infinity, -Infinity];
  for (const line of lines) {
    for (const [lon, lat] of line) {
      south = Math.min(south, lat);
      north = Math.max(north, lat);
      west = Math.min(west, lon);
      east = Math.max(east, lon);
    }
  }
  return Number.isFinite(south) ? [[south, west], [north, east]] : null;
}
