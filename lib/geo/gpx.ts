import { gpx } from "@tmcw/togeojson";
import { DOMParser } from "@xmldom/xmldom";
import { readPosition } from "./positions";
import { refused, type Checked, type SectionDraft } from "./types";

// A transect route from GPX 1.1: each track segment (<trkseg>) or route (<rte>) becomes a
// section, in file order; waypoints are ignored. XML is read with @xmldom/xmldom and turned into
// GeoJSON by @tmcw/togeojson. togeojson quietly drops points whose lat/lon it cannot read, so
// every point is checked here first and a bad one refuses the file.

const POINT_TAGS = ["trkpt", "rtept"] as const;

type XmlElement = { getAttribute(name: string): string | null };

function pointProblems(doc: { getElementsByTagName(tag: string): ArrayLike<XmlElement> }): string[] {
  const errors: string[] = [];
  for (const tag of POINT_TAGS) {
    const points = doc.getElementsByTagName(tag);
    for (let i = 0; i < points.length && errors.length < 5; i++) {
      const el = points[i]!;
      const where = `<${tag}> ${i + 1}`;
      const lat = el.getAttribute("lat");
      const lon = el.getAttribute("lon");
      const numeric = (v: string | null) => (v !== null && /^\s*[-+]?(\d+\.?\d*|\.\d+)([eE][-+]?\d+)?\s*$/.test(v) ? Number(v) : NaN);
      const read = readPosition([numeric(lon), numeric(lat)], where);
      if ("error" in read) errors.push(lat === null || lon === null ? `${where}: it needs both lat and lon attributes.` : read.error);
    }
  }
  return errors;
}

/** Sections read from GPX text (positions checked again by buildRoute). */
export function sectionsFromGpx(text: string): Checked<SectionDraft[]> {
  const problems: string[] = [];
  let doc: ReturnType<DOMParser["parseFromString"]>;
  try {
    doc = new DOMParser({ onError: (level, message) => void (level !== "warning" && problems.push(message)) }).parseFromString(text, "text/xml");
  } catch {
    return refused("The file is not GPX: it is not well-formed XML.");
  }
  if (problems.length > 0) return refused("The file is not GPX: it is not well-formed XML.");
  const root = doc.documentElement;
  if (!root || root.localName !== "gpx") return refused(`The file is XML but not GPX: its root element is <${root?.localName ?? "none"}>, not <gpx>.`);
  const bad = pointProblems(doc as never);
  if (bad.length) return refused(...bad);

  const drafts: SectionDraft[] = [];
  for (const feature of gpx(doc as never).features) {
    const geometry = feature.geometry;
    if (geometry?.type === "LineString") drafts.push({ coordinates: geometry.coordinates as SectionDraft["coordinates"] });
    else if (geometry?.type === "MultiLineString") for (const line of geometry.coordinates) drafts.push({ coordinates: line as SectionDraft["coordinates"] });
  }
  const points = POINT_TAGS.reduce((n, tag) => n + doc.getElementsByTagName(tag).length, 0);
  if (drafts.length === 0 && points === 1) return refused("The route has only one point: a route needs at least two.");
  if (drafts.length === 0) return refused("The GPX file has no track or route with at least two points (waypoints alone are not a route).");
  return { ok: true, value: drafts, warnings: [] };
}
