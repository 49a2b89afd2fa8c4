import { MAX_SECTION_HABITAT } from "./limits";
import { refused, type Checked, type SectionDraft } from "./types";
import { unsafeTextProblems } from "@/lib/validation/text";

// A transect route from GeoJSON (RFC 7946): a LineString (one section), a MultiLineString (one
// line per section), a Feature holding either, or a FeatureCollection of line features (one per
// section, in walking order). A feature's "habitat" property becomes its section's habitat.

const isObject = (v: unknown): v is Record<string, unknown> => typeof v === "object" && v !== null && !Array.isArray(v);

function habitatOf(properties: unknown, where: string, errors: string[]): string | null {
  const value = isObject(properties) ? properties.habitat : undefined;
  if (value === undefined || value === null) return null;
  if (typeof value !== "string") {
    errors.push(`${where}: the habitat property must be text.`);
    return null;
  }
  const text = value.trim();
  if (text.length > MAX_SECTION_HABITAT) errors.push(`${where}: the habitat must be at most ${MAX_SECTION_HABITAT} characters.`);
  for (const problem of unsafeTextProblems(text)) errors.push(`${where}: habitat: ${problem}`);
  return text || null;
}

const WRONG_TYPE = "The GeoJSON must be a LineString or MultiLineString (or a Feature or FeatureCollection of them); points and polygons are not routes.";

/** Lines of one geometry, unchecked: positions are read by buildRoute. */
function linesOf(geometry: unknown): unknown[][] | null {
  if (!isObject(geometry)) return null;
  if (geometry.type === "LineString") return [geometry.coordinates as unknown[]];
  if (geometry.type === "MultiLineString") return Array.isArray(geometry.coordinates) ? (geometry.coordinates as unknown[][]) : [geometry.coordinates as unknown[]];
  return null;
}

/** Sections read from parsed GeoJSON (positions still to be checked by buildRoute). */
export function sectionsFromGeoJson(data: unknown): Checked<SectionDraft[]> {
  if (!isObject(data) || typeof data.type !== "string") return refused("The file is JSON but not GeoJSON: it has no \"type\".");
  if (data.crs !== undefined && !/CRS84|EPSG::?4326/i.test(JSON.stringify(data.crs))) {
    // The 2008 GeoJSON format allowed other systems; RFC 7946 §4 fixes WGS84 longitude/latitude.
    return refused("The file names a coordinate system other than WGS84: export it as longitude and latitude in degrees (RFC 7946).");
  }
  const errors: string[] = [];
  let drafts: SectionDraft[] = [];
  if (data.type === "FeatureCollection") {
    const features = Array.isArray(data.features) ? data.features : null;
    if (!features || features.length === 0) return refused("The FeatureCollection holds no features.");
    const lines = features.map((f, i) => {
      const where = `Feature ${i + 1}`;
      const geometryLines = isObject(f) && f.type === "Feature" ? linesOf(f.geometry) : null;
      if (!geometryLines) {
        errors.push(`${where}: ${WRONG_TYPE}`);
        return [];
      }
      const habitat = habitatOf(f.properties, where, errors);
      return geometryLines.map((coordinates) => ({ coordinates, habitat }) as SectionDraft);
    });
    if (features.length > 1 && lines.some((l) => l.length > 1)) {
      errors.push("Give either one feature per section or one MultiLineString with a line per section, not both.");
    }
    drafts = lines.flat();
  } else if (data.type === "Feature") {
    const lines = linesOf(data.geometry);
    if (!lines) return refused(WRONG_TYPE);
    const habitat = habitatOf(data.properties, "The feature", errors);
    drafts = lines.map((coordinates) => ({ coordinates, habitat }) as SectionDraft);
  } else {
    const lines = linesOf(data);
    if (!lines) return refused(WRONG_TYPE);
    drafts = lines.map((coordinates) => ({ coordinates }) as SectionDraft);
  }
  if (errors.length) return refused(...errors.slice(0, 10));
  return { ok: true, value: drafts, warnings: [] };
}
