import { randomUUID } from "node:crypto";
import { PgDialect, getTableConfig, type PgTable } from "drizzle-orm/pg-core";
import { describe, expect, it } from "vitest";
import { analysisRuns, sightings, transectRouteVersions, transectSections, transects, visits } from "@/db/schema";
import { beaufortScale } from "@/lib/field/beaufort";
import { startVisitSchema } from "@/lib/field/visit-form";
import { ALPHA, OFFLINE_MAX_PERMUTATIONS, PERMUTATIONS, isAlpha, isPermutationCount } from "@/lib/limits/analysis";
import { BEAUFORT_FORCE, CLOUD_COVER_PERCENT, SECTIONS, SIGHTING_COUNT, TEMPERATURE_C, type Range } from "@/lib/limits/counts";
import { MAX_CO_RECORDERS_LENGTH, MAX_SIGHTING_NOTE_LENGTH, MAX_VISIT_NOTES_LENGTH } from "@/lib/limits/text";
import { sightingPayload, visitPayload } from "@/lib/sync/contract";

// Each limit lives in one module under lib/limits; the zod schemas on both sides of the phone and
// the database's check constraints must say the same. (tests/integration/limits-db.test.ts
// inserts the boundary values into PostgreSQL itself.)

const visit = (over: Record<string, unknown> = {}) => ({
  id: randomUUID(), transectId: randomUUID(), visitDate: "2026-05-14", startTime: "10:30", clientUpdatedAt: "2026-05-14T11:50:00.000Z", ...over,
});
const sighting = (over: Record<string, unknown> = {}) => ({
  id: randomUUID(), visitId: randomUUID(), speciesId: randomUUID(), count: 3, clientUpdatedAt: "2026-05-14T11:00:00.000Z", ...over,
});
const startForm = (over: Record<string, unknown> = {}) => ({
  transectId: randomUUID(), visitDate: "2026-05-14", startTime: "10:30", temperatureC: "", windBeaufort: "", cloudCoverPercent: "", sky: "", coRecorders: "", ...over,
});

type Schema = { safeParse: (v: unknown) => { success: boolean } };
/** The values a schema takes at a range's edges, and refuses just past them (by `step`). */
function edges(schema: Schema, make: (value: number) => unknown, range: Range, step = 1) {
  return {
    atMin: schema.safeParse(make(range.min)).success,
    atMax: schema.safeParse(make(range.max)).success,
    belowMin: schema.safeParse(make(range.min - step)).success,
    aboveMax: schema.safeParse(make(range.max + step)).success,
  };
}
const agrees = { atMin: true, atMax: true, belowMin: false, aboveMax: false };

describe("the limits as the issue and the field's conventions state them", () => {
  it("permutations in the app run from 0 to 99,999 and alpha lies strictly between 0 and 1", () => {
    expect([PERMUTATIONS.min, PERMUTATIONS.max]).toEqual([0, 99_999]);
    expect([isPermutationCount(0), isPermutationCount(99_999), isPermutationCount(100_000), isPermutationCount(-1), isPermutationCount(2.5)]).toEqual([true, true, false, false, false]);
    expect([isAlpha(0), isAlpha(1e-9), isAlpha(0.05), isAlpha(0.999), isAlpha(1)]).toEqual([false, true, true, true, false]);
    // The command line's offline cap is higher, and only there.
    expect(OFFLINE_MAX_PERMUTATIONS).toBeGreaterThan(PERMUTATIONS.max);
    expect(isPermutationCount(OFFLINE_MAX_PERMUTATIONS, OFFLINE_MAX_PERMUTATIONS)).toBe(true);
  });

  it("the Beaufort scale's forces are the range the forms and the database allow", () => {
    // The Beaufort scale runs from force 0 (calm) to 12 (hurricane force): WMO, common practice.
    expect(beaufortScale.map((b) => b.force)).toEqual(Array.from({ length: BEAUFORT_FORCE.max - BEAUFORT_FORCE.min + 1 }, (_, i) => BEAUFORT_FORCE.min + i));
    expect([BEAUFORT_FORCE.min, BEAUFORT_FORCE.max]).toEqual([0, 12]);
    expect([CLOUD_COVER_PERCENT.min, CLOUD_COVER_PERCENT.max]).toEqual([0, 100]); // percent
  });
});

describe("the sync contract and the start-walk form take exactly the module's ranges", () => {
  it("counts, sections, wind, cloud and temperature in the sync contract", () => {
    expect(edges(sightingPayload, (count) => sighting({ count }), SIGHTING_COUNT)).toEqual(agrees);
    expect(edges(sightingPayload, (section) => sighting({ section }), SECTIONS)).toEqual(agrees);
    expect(edges(visitPayload, (windBeaufort) => visit({ windBeaufort }), BEAUFORT_FORCE)).toEqual(agrees);
    expect(edges(visitPayload, (cloudCoverPercent) => visit({ cloudCoverPercent }), CLOUD_COVER_PERCENT)).toEqual(agrees);
    expect(edges(visitPayload, (temperatureC) => visit({ temperatureC }), TEMPERATURE_C, 0.1)).toEqual(agrees);
  });

  it("wind, cloud and temperature in the phone's start-walk form, typed as text", () => {
    expect(edges(startVisitSchema, (v) => startForm({ windBeaufort: String(v) }), BEAUFORT_FORCE)).toEqual(agrees);
    expect(edges(startVisitSchema, (v) => startForm({ cloudCoverPercent: String(v) }), CLOUD_COVER_PERCENT)).toEqual(agrees);
    expect(edges(startVisitSchema, (v) => startForm({ temperatureC: String(v) }), TEMPERATURE_C, 0.1)).toEqual(agrees);
  });

  it("text lengths: notes, co-recorders and sighting notes", () => {
    const long = (n: number) => "x".repeat(n);
    const lengths = (schema: Schema, make: (text: string) => unknown, max: number) => [schema.safeParse(make(long(max))).success, schema.safeParse(make(long(max + 1))).success];
    expect(lengths(visitPayload, (notes) => visit({ notes }), MAX_VISIT_NOTES_LENGTH)).toEqual([true, false]);
    expect(lengths(visitPayload, (coRecorders) => visit({ coRecorders }), MAX_CO_RECORDERS_LENGTH)).toEqual([true, false]);
    expect(lengths(startVisitSchema, (coRecorders) => startForm({ coRecorders }), MAX_CO_RECORDERS_LENGTH)).toEqual([true, false]);
    expect(lengths(sightingPayload, (note) => sighting({ note }), MAX_SIGHTING_NOTE_LENGTH)).toEqual([true, false]);
  });
});

describe("the database's check constraints say the module's numbers", () => {
  const dialect = new PgDialect();
  const checkText = (table: PgTable, name: string) => {
    const found = getTableConfig(table).checks.find((c) => c.name === name);
    if (!found) throw new Error(`no check ${name}`);
    return dialect.sqlToQuery(found.value).sql;
  };

  it("analysis runs: permutations and alpha", () => {
    expect(checkText(analysisRuns, "analysis_runs_permutations")).toBe(`"analysis_runs"."permutations" between ${PERMUTATIONS.min} and ${PERMUTATIONS.max}`);
    expect(checkText(analysisRuns, "analysis_runs_alpha")).toBe(`"analysis_runs"."alpha" > ${ALPHA.above} and "analysis_runs"."alpha" < ${ALPHA.below}`);
    const columns = getTableConfig(analysisRuns).columns;
    expect(columns.find((c) => c.name === "permutations")!.default).toBe(PERMUTATIONS.default);
    expect(columns.find((c) => c.name === "alpha")!.default).toBe(ALPHA.default);
  });

  it("visits, sightings and transects", () => {
    expect(checkText(visits, "visits_wind_beaufort")).toBe(`"visits"."wind_beaufort" is null or "visits"."wind_beaufort" between ${BEAUFORT_FORCE.min} and ${BEAUFORT_FORCE.max}`);
    expect(checkText(visits, "visits_cloud_percent")).toBe(`"visits"."cloud_cover_percent" is null or "visits"."cloud_cover_percent" between ${CLOUD_COVER_PERCENT.min} and ${CLOUD_COVER_PERCENT.max}`);
    expect(checkText(visits, "visits_temperature_plausible")).toBe(`"visits"."temperature_c" is null or "visits"."temperature_c" between ${TEMPERATURE_C.min} and ${TEMPERATURE_C.max}`);
    expect(checkText(sightings, "sightings_count_nonnegative")).toBe(`"sightings"."count" >= ${SIGHTING_COUNT.min}`);
    expect(checkText(sightings, "sightings_section_positive")).toBe(`"sightings"."section" is null or "sightings"."section" >= ${SECTIONS.min}`);
    expect(checkText(transects, "transects_sections_positive")).toBe(`"transects"."section_count" between ${SECTIONS.min} and ${SECTIONS.max}`);
    expect(checkText(transectRouteVersions, "transect_route_versions_sections")).toBe(`"transect_route_versions"."section_count" between ${SECTIONS.min} and ${SECTIONS.max}`);
    expect(checkText(transectSections, "transect_sections_number")).toBe(`"transect_sections"."number" between ${SECTIONS.min} and ${SECTIONS.max}`);
  });
});
