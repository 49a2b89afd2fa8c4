"use client";

import { Circle, CircleMarker, Polyline, Tooltip } from "react-leaflet";
import { boundsOf, toLatLngs } from "@/components/map/coords";
import { MapFrame } from "@/components/map/map-frame";
import type { SightingDetail } from "@/lib/review/contract";

const ROUTE = "#155555"; // tideline-700
const SPOT = "#9a3412"; // rust-700

/** The transect's route on the walk's date with the sighting's position (and how sure the phone was of it). */
export default function SightingMap({ route, position, label, tileUrl }: { route: SightingDetail["route"]; position: SightingDetail["position"]; label: string; tileUrl: string | null }) {
  const spot = position ? ([position.longitude, position.latitude] as [number, number]) : null;
  const bounds = boundsOf([route.line.coordinates, ...(spot ? [[spot]] : [])]);
  return (
    <MapFrame tileUrl={tileUrl} bounds={bounds} fitKey={`${route.line.coordinates.length}:${spot?.join(",") ?? ""}`} label={label} height={280}>
      <Polyline positions={toLatLngs(route.line.coordinates)} pathOptions={{ color: ROUTE, weight: 5 }}>
        <Tooltip sticky>The route ({route.sectionCount} sections)</Tooltip>
      </Polyline>
      {spot && position?.accuracyMetres ? <Circle center={toLatLngs([spot])[0]!} radius={position.accuracyMetres} pathOptions={{ color: SPOT, weight: 1, fillOpacity: 0.12 }} /> : null}
      {spot && (
        <CircleMarker center={toLatLngs([spot])[0]!} radius={7} pathOptions={{ color: "#ffffff", weight: 2, fillColor: SPOT, fillOpacity: 1 }}>
          <Tooltip>Where the sighting was recorded{position?.accuracyMetres ? ` (within about ${Math.round(position.accuracyMetres)} m)` : ""}</Tooltip>
        </CircleMarker>
      )}
    </MapFrame>
  );
}
