import { sectionsFromGeoJson } from "./geojson";
import { sectionsFromGpx } from "./gpx";
import { MAX_ROUTE_FILE_BYTES } from "./limits";
import { buildRoute } from "./sections";
import { refused, type BuiltRoute, type Checked } from "./types";

// A route file as the organiser's browser sends it (its name and its text): the name says what
// it must be, and the content must be that. Server-side only (it parses XML).

export type RouteFile = { fileName: string; text: string };

const kinds = { geojson: "GeoJSON", json: "GeoJSON", gpx: "GPX" } as const;

const mb = (bytes: number) => `${(bytes / 1024 / 1024).toLocaleString("en-GB", { maximumFractionDigits: 1 })} MB`;

export function routeFileKind(fileName: string): "GeoJSON" | "GPX" | null {
  const extension = /\.([a-z]+)$/i.exec(fileName.trim())?.[1]?.toLowerCase();
  return extension && extension in kinds ? kinds[extension as keyof typeof kinds] : null;
}

/** Reads, checks and measures a route file; nothing is stored here. */
export function readRouteFile({ fileName, text }: RouteFile): Checked<BuiltRoute> {
  const bytes = new TextEncoder().encode(text).byteLength;
  if (bytes > MAX_ROUTE_FILE_BYTES) return refused(`The file is ${mb(bytes)}; route files can be at most ${mb(MAX_ROUTE_FILE_BYTES)}.`);
  const kind = routeFileKind(fileName);
  if (!kind) return refused("Choose a GeoJSON (.geojson or .json) or GPX (.gpx) file.");
  const body = text.replace(/^\uFEFF/, "").trimStart();
  let sections;
  if (kind === "GeoJSON") {
    if (body.startsWith("<")) return refused(`${fileName} is named as GeoJSON but is XML: is it a GPX file?`);
    let data: unknown;
    try {
      data = JSON.parse(body);
    } catch {
      return refused(`${fileName} is named as GeoJSON but is not valid JSON.`);
    }
    sections = sectionsFromGeoJson(data);
  } else {
    if (!body.startsWith("<")) return refused(`${fileName} is named as GPX but is not XML${body.startsWith("{") ? ": is it a GeoJSON file?" : "."}`);
    sections = sectionsFromGpx(body);
  }
  if (!sections.ok) return sections;
  return buildRoute(sections.value);
}
