import { readFileSync } from "node:fs";
import { describe, expect, it } from "vitest";
import { lengthMetres } from "@/lib/geo/length";
import { MAX_ROUTE_FILE_BYTES } from "@/lib/geo/limits";
import { readRouteFile } from "@/lib/geo/route-file";

const fixture = (name: string) => readFileSync(new URL(`../fixtures/routes/${name}`, import.meta.url), "utf8");
const errorsOf = (result: ReturnType<typeof readRouteFile>) => (result.ok ? [] : result.errors).join(" ");

describe("route files: GeoJSON (RFC 7946)", () => {
  it("reads a FeatureCollection with one feature per section, their habitats and lengths", () => {
    const result = readRouteFile({ fileName: "three-sections.geojson", text: fixture("three-sections.geojson") });
    if (!result.ok) throw new Error(result.errors.join("; "));
    const { route, sections, lengthMetres: total } = result.value;
    expect(route.coordinates).toHaveLength(6);
    expect(sections.map((s) => [s.from, s.to, s.habitat])).toEqual([[0, 2, "grazed chalk grassland"], [2, 4, "scrub edge"], [4, 5, null]]);
    expect(sections[2]!.lengthMetres).toBe(Math.round(lengthMetres([[-1.2755, 51.0921], [-1.2741, 51.0929]])));
    expect(total).toBe(Math.round(lengthMetres(route.coordinates)));
    expect(result.warnings).toEqual([]);
  });

  it("reads a bare LineString as one section and a MultiLineString as one section per line", () => {
    const one = readRouteFile({ fileName: "r.json", text: JSON.stringify({ type: "LineString", coordinates: [[-1.3, 51], [-1.3, 51.001, 40]] }) });
    expect(one.ok && one.value.sections).toHaveLength(1);
    const multi = readRouteFile({
      fileName: "r.geojson",
      text: JSON.stringify({ type: "Feature", properties: { habitat: "dune slack" }, geometry: { type: "MultiLineString", coordinates: [[[-1.3, 51], [-1.3, 51.001]], [[-1.3, 51.001], [-1.3, 51.002]]] } }),
    });
    expect(multi.ok && multi.value.sections.map((s) => s.habitat)).toEqual(["dune slack", "dune slack"]);
  });

  it("refuses points, polygons and JSON that is not GeoJSON", () => {
    expect(errorsOf(readRouteFile({ fileName: "p.geojson", text: JSON.stringify({ type: "Point", coordinates: [-1.3, 51] }) }))).toMatch(/points and polygons are not routes/);
    expect(errorsOf(readRouteFile({ fileName: "p.geojson", text: JSON.stringify({ type: "Polygon", coordinates: [[[-1, 51], [-1, 52], [0, 52], [-1, 51]]] }) }))).toMatch(/not routes/);
    expect(errorsOf(readRouteFile({ fileName: "p.geojson", text: "[1, 2]" }))).toMatch(/not GeoJSON/);
    expect(errorsOf(readRouteFile({ fileName: "p.geojson", text: JSON.stringify({ type: "FeatureCollection", features: [] }) }))).toMatch(/no features/);
  });

  it("refuses coordinates in another system (the 2008 format's crs member)", () => {
    const text = JSON.stringify({ type: "LineString", crs: { type: "name", properties: { name: "urn:ogc:def:crs:EPSG::27700" } }, coordinates: [[445000, 120000], [445100, 120100]] });
    expect(errorsOf(readRouteFile({ fileName: "bng.geojson", text }))).toMatch(/other than WGS84/);
  });

  it("refuses coordinates out of range and a route of one point", () => {
    expect(errorsOf(readRouteFile({ fileName: "r.geojson", text: JSON.stringify({ type: "LineString", coordinates: [[-1.3, 51], [181, 51]] }) }))).toMatch(/longitude 181 is outside −180 to 180/);
    expect(errorsOf(readRouteFile({ fileName: "r.geojson", text: JSON.stringify({ type: "LineString", coordinates: [[-1.3, 91], [-1.3, 51]] }) }))).toMatch(/latitude 91 is outside −90 to 90/);
    expect(errorsOf(readRouteFile({ fileName: "r.geojson", text: JSON.stringify({ type: "LineString", coordinates: [[-1.3, 51]] }) }))).toMatch(/only one point/);
    expect(errorsOf(readRouteFile({ fileName: "r.geojson", text: JSON.stringify({ type: "LineString", coordinates: [[-1.3, 51], [-1.3, 51]] }) }))).toMatch(/only one point/);
  });
});

describe("route files: GPX 1.1", () => {
  it("reads each track segment as a section and ignores waypoints and elevations", () => {
    const result = readRouteFile({ fileName: "two-segments.gpx", text: fixture("two-segments.gpx") });
    if (!result.ok) throw new Error(result.errors.join("; "));
    expect(result.value.route.coordinates).toEqual([[-1.318, 51.041], [-1.3171, 51.0416], [-1.3165, 51.0423], [-1.3152, 51.0431]]);
    expect(result.value.sections.map((s) => [s.from, s.to])).toEqual([[0, 2], [2, 3]]);
  });

  it("reads a <rte> as a route", () => {
    const text = `<gpx xmlns="http://www.topografix.com/GPX/1/1"><rte><rtept lat="51.04" lon="-1.31"/><rtept lat="51.041" lon="-1.309"/></rte></gpx>`;
    expect(readRouteFile({ fileName: "r.GPX", text }).ok).toBe(true);
  });

  it("refuses a point that is out of range or unreadable (togeojson would silently drop it)", () => {
    const point = (lat: string, lon: string) => `<gpx><trk><trkseg><trkpt lat="51.04" lon="-1.31"/><trkpt lat="${lat}" lon="${lon}"/><trkpt lat="51.05" lon="-1.3"/></trkseg></trk></gpx>`;
    expect(errorsOf(readRouteFile({ fileName: "r.gpx", text: point("95", "-1.31") }))).toMatch(/<trkpt> 2: latitude 95 is outside −90 to 90/);
    expect(errorsOf(readRouteFile({ fileName: "r.gpx", text: point("51.04", "-200") }))).toMatch(/longitude -200 is outside/);
    expect(errorsOf(readRouteFile({ fileName: "r.gpx", text: point("north", "-1.31") }))).toMatch(/must be numbers/);
  });

  it("refuses XML that is broken or not GPX, and a GPX with only waypoints or one point", () => {
    expect(errorsOf(readRouteFile({ fileName: "r.gpx", text: "<gpx><trk>" }))).toMatch(/not well-formed XML/);
    expect(errorsOf(readRouteFile({ fileName: "r.gpx", text: "<kml><Document/></kml>" }))).toMatch(/root element is <kml>/);
    expect(errorsOf(readRouteFile({ fileName: "r.gpx", text: `<gpx><wpt lat="51" lon="-1"/></gpx>` }))).toMatch(/no track or route/);
    expect(errorsOf(readRouteFile({ fileName: "r.gpx", text: `<gpx><trk><trkseg><trkpt lat="51" lon="-1"/></trkseg></trk></gpx>` }))).toMatch(/only one point/);
  });
});

describe("route files: what the name says and the size", () => {
  it("refuses a file that is not what its name says", () => {
    expect(errorsOf(readRouteFile({ fileName: "route-is-xml.geojson", text: fixture("route-is-xml.geojson") }))).toMatch(/named as GeoJSON but is XML/);
    expect(errorsOf(readRouteFile({ fileName: "route-is-json.gpx", text: fixture("route-is-json.gpx") }))).toMatch(/named as GPX but is not XML: is it a GeoJSON file/);
    expect(errorsOf(readRouteFile({ fileName: "broken.geojson", text: '{"type": "LineString", ' }))).toMatch(/not valid JSON/);
  });

  it("refuses other kinds of file by name", () => {
    expect(errorsOf(readRouteFile({ fileName: "route.kml", text: "<kml/>" }))).toMatch(/Choose a GeoJSON .* or GPX/);
    expect(errorsOf(readRouteFile({ fileName: "route", text: "{}" }))).toMatch(/Choose a GeoJSON/);
  });

  it("refuses a file over 10 MB (counted in UTF-8 bytes) before reading it", () => {
    const line = JSON.stringify({ type: "LineString", coordinates: [[-1.3, 51], [-1.3, 51.001]] });
    const text = line + " ".repeat(MAX_ROUTE_FILE_BYTES - line.length + 1);
    expect(errorsOf(readRouteFile({ fileName: "big.geojson", text }))).toMatch(/route files can be at most 10 MB/);
    expect(readRouteFile({ fileName: "big.geojson", text: text.slice(0, -1) }).ok).toBe(true);
    // Two bytes each in UTF-8: half as many characters are already too many.
    expect(errorsOf(readRouteFile({ fileName: "big.geojson", text: line + "é".repeat(MAX_ROUTE_FILE_BYTES / 2) }))).toMatch(/at most 10 MB/);
  });
});
