"use client";

import "@geoman-io/leaflet-geoman-free/dist/leaflet-geoman.css";
import L from "leaflet";
// Geoman extends the global L that leaflet sets on window, so it is imported after it.
import "@geoman-io/leaflet-geoman-free";
import { useEffect, useRef } from "react";
import { CircleMarker, Polyline, Tooltip, useMap } from "react-leaflet";
import { colourHex } from "@/lib/geo/palette";
import { splitAt } from "@/lib/geo/sections";
import type { Position } from "@/lib/geo/types";
import { boundsOf, toLatLngs, toPositions } from "./coords";
import { MapFrame } from "./map-frame";

export type EditorMode = "view" | "draw" | "edit";

type Props = {
  tileUrl: string | null;
  coordinates: Position[];
  /** Interior points (0-based) where one section ends and the next begins. */
  boundaries: number[];
  mode: EditorMode;
  colour: string;
  fitKey: number;
  onDrawn: (coordinates: Position[]) => void;
  onEdited: (coordinates: Position[], boundaries: number[]) => void;
  onToggleBoundary: (index: number) => void;
};

/** Shows every point as a marker up to this many; longer tracks are split by clicking the line. */
const MAX_POINT_MARKERS = 300;

/** The latest value for Leaflet's event handlers, which are bound once. */
function useLatest<T>(value: T) {
  const ref = useRef(value);
  useEffect(() => {
    ref.current = value;
  });
  return ref;
}

/** Geoman's line drawing: click to add points, click the last point again to finish. */
function DrawLine({ onDrawn, colour }: { onDrawn: Props["onDrawn"]; colour: string }) {
  const map = useMap();
  const done = useLatest(onDrawn);
  useEffect(() => {
    map.pm.enableDraw("Line", { snappable: false, templineStyle: { color: colour }, hintlineStyle: { color: colour, dashArray: "5 5" } });
    const created = (e: { layer: L.Layer }) => {
      const layer = e.layer as L.Polyline;
      const points = toPositions(layer.getLatLngs() as L.LatLng[]);
      layer.remove();
      done.current(points);
    };
    map.on("pm:create", created);
    return () => {
      map.off("pm:create", created);
      map.pm.disableDraw();
    };
  }, [map, colour, done]);
  return null;
}

const indexOf = (e: { indexPath?: number | number[] }) => (Array.isArray(e.indexPath) ? e.indexPath[e.indexPath.length - 1]! : (e.indexPath ?? -1));

/** Geoman's vertex editing of the line: drag points, add them from the midpoints, right-click to remove. */
function EditLine({ coordinates, boundaries, colour, onEdited }: Pick<Props, "coordinates" | "boundaries" | "colour" | "onEdited">) {
  const map = useMap();
  const start = useLatest({ coordinates, boundaries });
  const report = useLatest(onEdited);
  useEffect(() => {
    const layer = L.polyline(toLatLngs(start.current.coordinates), { color: colourHex(colour), weight: 5 }).addTo(map);
    // Section boundaries follow their points when points are added or removed before them.
    let cuts = [...start.current.boundaries];
    const send = () => report.current(toPositions(layer.getLatLngs() as L.LatLng[]), cuts);
    layer.on("pm:vertexadded", (e) => {
      const k = indexOf(e as never);
      cuts = cuts.map((b) => (b >= k ? b + 1 : b));
      send();
    });
    layer.on("pm:vertexremoved", (e) => {
      const k = indexOf(e as never);
      cuts = cuts.filter((b) => b !== k).map((b) => (b > k ? b - 1 : b));
      send();
    });
    layer.on("pm:edit", send);
    layer.on("pm:markerdragend", send);
    layer.pm.enable({ allowSelfIntersection: true, snappable: false });
    return () => {
      layer.pm.disable();
      layer.remove();
    };
  }, [map, colour, report, start]);
  return null;
}

function nearestInterior(coordinates: Position[], at: { lat: number; lng: number }): number | null {
  const k = Math.cos((at.lat * Math.PI) / 180);
  let best: number | null = null;
  let bestD = Infinity;
  for (let i = 1; i < coordinates.length - 1; i++) {
    const [lon, lat] = coordinates[i]!;
    const d = ((lon - at.lng) * k) ** 2 + (lat - at.lat) ** 2;
    if (d < bestD) [best, bestD] = [i, d];
  }
  return best;
}

/** The route cut into its sections, alternately solid and dashed; clicking the line toggles a boundary at the nearest point. */
function SectionsView({ coordinates, boundaries, colour, onToggleBoundary }: Pick<Props, "coordinates" | "boundaries" | "colour" | "onToggleBoundary">) {
  const hex = colourHex(colour);
  const sections = splitAt(coordinates, boundaries);
  const toggleNear = (e: L.LeafletMouseEvent) => {
    const i = nearestInterior(coordinates, e.latlng);
    if (i !== null) onToggleBoundary(i);
  };
  const cuts = new Set(boundaries);
  return (
    <>
      {sections.map((s, i) => {
        // The label sits halfway along the section's middle segment, clear of its boundary points.
        const k = Math.floor((s.coordinates.length - 2) / 2);
        const [a, b] = [s.coordinates[k]!, s.coordinates[k + 1]!];
        const middle: Position = [(a[0] + b[0]) / 2, (a[1] + b[1]) / 2];
        return (
          <Polyline key={`s${i}`} positions={toLatLngs(s.coordinates)} pathOptions={{ color: hex, weight: 6, dashArray: i % 2 ? "10 6" : undefined }} eventHandlers={{ click: toggleNear }}>
            <Tooltip sticky>Section {i + 1}: click the line to add or remove a section boundary at the nearest point</Tooltip>
            <CircleMarker center={toLatLngs([middle])[0]!} radius={0} pathOptions={{ opacity: 0 }}>
              <Tooltip permanent direction="center" className="font-bold">{i + 1}</Tooltip>
            </CircleMarker>
          </Polyline>
        );
      })}
      {coordinates.length <= MAX_POINT_MARKERS &&
        coordinates.slice(1, -1).map((p, j) =>
          cuts.has(j + 1) ? null : (
            <CircleMarker key={`p${j}`} center={toLatLngs([p])[0]!} radius={4} pathOptions={{ color: hex, fillColor: "#ffffff", fillOpacity: 1, weight: 2 }} eventHandlers={{ click: () => onToggleBoundary(j + 1) }}>
              <Tooltip>Point {j + 2}: click to end a section here</Tooltip>
            </CircleMarker>
          ),
        )}
      {[...cuts].map((b) =>
        coordinates[b] ? (
          <CircleMarker key={`b${b}`} center={toLatLngs([coordinates[b]])[0]!} radius={8} pathOptions={{ color: "#1f1e1b", fillColor: hex, fillOpacity: 1, weight: 3 }} eventHandlers={{ click: () => onToggleBoundary(b) }}>
            <Tooltip>Section boundary at point {b + 1}: click to join the sections</Tooltip>
          </CircleMarker>
        ) : null,
      )}
      {coordinates[0] && (
        <CircleMarker center={toLatLngs([coordinates[0]])[0]!} radius={7} pathOptions={{ color: "#1f1e1b", fillColor: "#ffffff", fillOpacity: 1, weight: 3 }}>
          <Tooltip permanent direction="left">Start</Tooltip>
        </CircleMarker>
      )}
    </>
  );
}

/** One transect's route: drawn with geoman, edited point by point, or split into sections. */
export default function RouteEditorMap(props: Props) {
  const { tileUrl, coordinates, boundaries, mode, colour, fitKey } = props;
  return (
    <MapFrame tileUrl={tileUrl} bounds={boundsOf([coordinates])} fitKey={fitKey} label="Route editor map" height={480}>
      {mode === "draw" && <DrawLine onDrawn={props.onDrawn} colour={colourHex(colour)} />}
      {mode === "edit" && coordinates.length >= 2 && <EditLine coordinates={coordinates} boundaries={boundaries} colour={colour} onEdited={props.onEdited} />}
      {mode === "view" && coordinates.length >= 2 && <SectionsView coordinates={coordinates} boundaries={boundaries} colour={colour} onToggleBoundary={props.onToggleBoundary} />}
    </MapFrame>
  );
}
