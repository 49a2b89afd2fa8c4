import { eq } from "drizzle-orm";
import { beforeAll, beforeEach, describe, expect, it, vi } from "vitest";
import { db } from "@/db/client";
import { networkChanges, transectRouteVersions, transectSections, transects } from "@/db/schema";
import { lengthMetres } from "@/lib/geo/length";
import { MAX_ROUTE_FILE_BYTES } from "@/lib/geo/limits";
import { resetToDemo } from "./support/db";
import { call, demo, details, habitatId, routeFixture, tableCounts, userId } from "./transects-helpers";

// The handlers' own session and role checks run for real; only Auth.js's cookie decoding is replaced.
const session = vi.hoisted(() => ({ userId: null as string | null }));
vi.mock("@/lib/auth/session", () => ({ sessionUserId: async () => session.userId }));

const list = await import("@/app/(network)/api/network/transects/route");
const preview = await import("@/app/(network)/api/network/transects/route-file/route");

describe("creating transects from route files", () => {
  let chalk: string;

  beforeAll(async () => {
    await resetToDemo();
    chalk = await habitatId("CHK");
  });

  beforeEach(async () => {
    session.userId = await userId(demo.organiser);
  });

  it("creates a transect from a GeoJSON file: route, sections with their habitats, lengths from @turf/length, version 1, a change-log row", async () => {
    const { status, json } = await call(list.POST, { body: { ...details(chalk, "geo-01"), route: { file: { fileName: "three-sections.geojson", text: routeFixture("three-sections.geojson") } } } });
    expect(status).toBe(201);
    const id = json.transect.id as string;
    const [row] = await db().select().from(transects).where(eq(transects.id, id));
    expect(row).toMatchObject({ code: "GEO-01", sectionCount: 3, active: true, sensitive: false });
    expect(row!.lengthMetres).toBe(Math.round(lengthMetres(row!.route.coordinates)));
    const versions = await db().select().from(transectRouteVersions).where(eq(transectRouteVersions.transectId, id));
    expect(versions).toHaveLength(1);
    expect(versions[0]).toMatchObject({ version: 1, sectionCount: 3, lengthMetres: row!.lengthMetres, validFrom: new Date().toISOString().slice(0, 10) });
    const sections = await db().select().from(transectSections).where(eq(transectSections.versionId, versions[0]!.id)).orderBy(transectSections.number);
    expect(sections.map((s) => [s.number, s.fromPoint, s.toPoint, s.habitat])).toEqual([[1, 0, 2, "grazed chalk grassland"], [2, 2, 4, "scrub edge"], [3, 4, 5, null]]);
    expect(sections[0]!.lengthMetres).toBe(Math.round(lengthMetres(row!.route.coordinates.slice(0, 3))));
    const log = await db().select().from(networkChanges).where(eq(networkChanges.entityId, id));
    expect(log).toHaveLength(1);
    expect(log[0]).toMatchObject({ entity: "transect", action: "create" });
    expect(log[0]!.after).toMatchObject({ code: "GEO-01", lengthMetres: row!.lengthMetres, sectionCount: 3 });
  });

  it("creates a transect from a GPX file, one section per track segment", async () => {
    const { status, json } = await call(list.POST, { body: { ...details(chalk, "GPX-01"), route: { file: { fileName: "two-segments.gpx", text: routeFixture("two-segments.gpx") } } } });
    expect(status).toBe(201);
    expect(json.transect.sections).toHaveLength(2);
    const [row] = await db().select().from(transects).where(eq(transects.id, json.transect.id));
    expect(row!.route.coordinates).toEqual([[-1.318, 51.041], [-1.3171, 51.0416], [-1.3165, 51.0423], [-1.3152, 51.0431]]);
    expect(row!.lengthMetres).toBe(Math.round(lengthMetres(row!.route.coordinates)));
  });

  it("creates a transect from sections drawn on the map", async () => {
    const sections = [{ coordinates: [[-1.3, 51], [-1.3, 51.001]], habitat: "rides" }, { coordinates: [[-1.3, 51.001], [-1.299, 51.002]] }];
    const { status, json } = await call(list.POST, { body: { ...details(chalk, "DRAW-01"), sensitive: true, route: { sections } } });
    expect(status).toBe(201);
    expect(json.transect).toMatchObject({ code: "DRAW-01", warnings: [] });
    expect(json.transect.sections.map((s: { lengthMetres: number }) => s.lengthMetres)).toEqual([111, Math.round(lengthMetres([[-1.3, 51.001], [-1.299, 51.002]]))]);
  });

  it("creates a route that crosses itself, with a warning", async () => {
    const eight = [[-1.3, 51], [-1.299, 51.001], [-1.299, 51], [-1.3, 51.001]];
    const { status, json } = await call(list.POST, { body: { ...details(chalk, "LOOP-01"), route: { sections: [{ coordinates: eight }] } } });
    expect(status).toBe(201);
    expect(json.transect.warnings).toEqual([expect.stringMatching(/crosses or touches itself/)]);
  });

  it("previews a route file without storing anything", async () => {
    const before = await tableCounts();
    const { status, json } = await call(preview.POST, { body: { fileName: "two-segments.gpx", text: routeFixture("two-segments.gpx") } });
    expect(status).toBe(200);
    expect(json.preview.sections).toHaveLength(2);
    expect(json.preview.sectionLines[1]).toEqual([[-1.3165, 51.0423], [-1.3152, 51.0431]]);
    expect(await tableCounts()).toEqual(before);
  });

  const fileBody = (fileName: string, text: string, code = "BAD-01") => ({ body: { ...details("00000000-0000-4000-8000-000000000000", code), route: { file: { fileName, text } } } });
  const line = (coordinates: unknown) => JSON.stringify({ type: "LineString", coordinates });

  // Each bad kind the issue lists: a clear 400 and nothing written anywhere.
  it.each([
    ["a wrong type (a point)", "p.geojson", JSON.stringify({ type: "Point", coordinates: [-1.3, 51] }), /not routes/],
    ["a polygon", "p.geojson", JSON.stringify({ type: "Polygon", coordinates: [[[-1, 51], [-1, 52], [0, 52], [-1, 51]]] }), /not routes/],
    ["a longitude out of range", "r.geojson", line([[-1.3, 51], [190, 51]]), /longitude 190 is outside/],
    ["a latitude out of range", "r.gpx", `<gpx><trk><trkseg><trkpt lat="-91" lon="-1.3"/><trkpt lat="51" lon="-1.3"/></trkseg></trk></gpx>`, /latitude -91 is outside/],
    ["a route with one point", "r.geojson", line([[-1.3, 51]]), /only one point/],
    ["a route longer than 50 km", "r.geojson", line([[-1.3, 51], [-1.3, 51.3], [-1.3, 51.5]]), /at most 50 km/],
    ["a .gpx that is not GPX XML", "route-is-json.gpx", routeFixture("route-is-json.gpx"), /named as GPX but is not XML/],
    ["a .geojson that is not JSON", "route-is-xml.geojson", routeFixture("route-is-xml.geojson"), /named as GeoJSON but is XML/],
    ["a .geojson that is broken JSON", "r.geojson", "{ \"type\": ", /not valid JSON/],
    ["XML that is not GPX", "r.gpx", "<kml></kml>", /not GPX/],
    ["sections that leave a gap", "r.geojson", JSON.stringify({ type: "MultiLineString", coordinates: [[[-1.3, 51], [-1.3, 51.001]], [[-1.3, 51.002], [-1.3, 51.003]]] }), /without gaps/],
    ["sections that overlap", "r.geojson", JSON.stringify({ type: "MultiLineString", coordinates: [[[-1.3, 51], [-1.3, 51.002]], [[-1.3, 51.001], [-1.3, 51.003]]] }), /must not overlap/],
    ["a file of another kind", "route.kml", "<kml/>", /Choose a GeoJSON/],
  ])("refuses %s and writes nothing", async (_, fileName, text, message) => {
    const before = await tableCounts();
    // A real habitat group, so that only the route is wrong.
    const request = fileBody(fileName, text);
    request.body.habitatGroupId = chalk;
    const { status, json } = await call(list.POST, request);
    expect(status).toBe(400);
    expect(json.error.fields.route.join(" ")).toMatch(message);
    expect(json.error.message).toMatch(message);
    expect(await tableCounts()).toEqual(before);
  });

  it("refuses a file over 10 MB with a clear message and writes nothing", async () => {
    const before = await tableCounts();
    const text = line([[-1.3, 51], [-1.3, 51.001]]) + " ".repeat(MAX_ROUTE_FILE_BYTES);
    const request = fileBody("big.geojson", text);
    request.body.habitatGroupId = chalk;
    const { status, json } = await call(list.POST, request);
    expect(status).toBe(400);
    expect(json.error.fields.route).toEqual([expect.stringMatching(/route files can be at most 10 MB/)]);
    expect(await tableCounts()).toEqual(before);
  });

  it("refuses coordinates out of range in drawn sections with field messages", async () => {
    const before = await tableCounts();
    const { status, json } = await call(list.POST, { body: { ...details(chalk, "BAD-02"), route: { sections: [{ coordinates: [[-1.3, 51], [-1.3, 95]] }] } } });
    expect(status).toBe(400);
    expect(json.error.fields["route.sections.0.coordinates.1.1"]).toEqual(["Latitude must be between −90 and 90."]);
    expect(await tableCounts()).toEqual(before);
  });

  it("refuses a duplicate code, an unknown habitat group and bad details, writing nothing", async () => {
    const before = await tableCounts();
    const route = { sections: [{ coordinates: [[-1.3, 51], [-1.3, 51.001]] }] };
    const dup = await call(list.POST, { body: { ...details(chalk, "chk-01"), route } });
    expect(dup.status).toBe(400);
    expect(dup.json.error.fields.code).toEqual([expect.stringMatching(/Another transect has this code/)]);
    const unknown = await call(list.POST, { body: { ...details("00000000-0000-4000-8000-000000000000", "NEW-99"), route } });
    expect(unknown.json.error.fields.habitatGroupId).toEqual(["That habitat group does not exist."]);
    const bad = await call(list.POST, { body: { ...details(chalk, "a b"), name: "\u0000", route: {} } });
    expect(bad.status).toBe(400);
    expect(Object.keys(bad.json.error.fields).sort()).toEqual(["code", "name", "route"]);
    expect(await tableCounts()).toEqual(before);
  });
});
