import { describe, expect, it } from "vitest";
import { lengthMetres } from "@/lib/geo/length";
import { MAX_ROUTE_POINTS, MAX_SECTIONS } from "@/lib/geo/limits";
import { buildRoute, sectionLines, splitAt } from "@/lib/geo/sections";
import type { Position } from "@/lib/geo/types";

const errorsOf = (result: ReturnType<typeof buildRoute>) => (result.ok ? [] : result.errors).join(" ");
// 0.0001° of latitude is 11.1 m on turf's sphere (see geo-length.test.ts).
const north = (lat: number): Position => [-1.3, 51 + lat];

describe("sections of a route", () => {
  it("joins sections that follow each other into one route, measuring each", () => {
    const result = buildRoute([{ coordinates: [north(0), north(0.001)], habitat: " reeds " }, { coordinates: [north(0.001), north(0.002), north(0.003)] }]);
    if (!result.ok) throw new Error(result.errors.join("; "));
    expect(result.value.route.coordinates).toEqual([north(0), north(0.001), north(0.002), north(0.003)]);
    expect(result.value.sections).toEqual([
      { number: 1, from: 0, to: 1, lengthMetres: 111, habitat: "reeds" },
      { number: 2, from: 1, to: 3, lengthMetres: 222, habitat: null },
    ]);
    expect(result.value.lengthMetres).toBe(Math.round(lengthMetres(result.value.route.coordinates)));
  });

  it("keeps a joint a few metres apart as the start of the later section (GPS segments rarely meet exactly)", () => {
    const result = buildRoute([{ coordinates: [north(0), north(0.001)] }, { coordinates: [north(0.00103), north(0.002)] }]);
    expect(result.ok && result.value.route.coordinates).toEqual([north(0), north(0.001), north(0.00103), north(0.002)]);
    expect(result.ok && result.value.sections.map((s) => [s.from, s.to])).toEqual([[0, 1], [1, 3]]);
  });

  it("refuses sections that leave a gap or overlap", () => {
    expect(errorsOf(buildRoute([{ coordinates: [north(0), north(0.001)] }, { coordinates: [north(0.0015), north(0.002)] }]))).toMatch(
      /Section 2 starts 56 m from the end of section 1: sections must cover the route without gaps/,
    );
    expect(errorsOf(buildRoute([{ coordinates: [north(0), north(0.002)] }, { coordinates: [north(0.001), north(0.003)] }]))).toMatch(
      /Section 2 starts inside section 1: sections must not overlap/,
    );
  });

  it("refuses a section of one point, no sections, and too many sections", () => {
    expect(errorsOf(buildRoute([{ coordinates: [north(0), north(0.001)] }, { coordinates: [north(0.001)] }]))).toMatch(/Section 2 has only one point/);
    expect(errorsOf(buildRoute([]))).toMatch(/no line/);
    const many = Array.from({ length: MAX_SECTIONS + 1 }, (_, i) => ({ coordinates: [north(i * 0.001), north((i + 1) * 0.001)] }));
    expect(errorsOf(buildRoute(many))).toMatch(/at most 50/);
    expect(buildRoute(many.slice(0, MAX_SECTIONS)).ok).toBe(true);
  });

  it("refuses a route longer than 50 km and accepts one just under", () => {
    // 0.45° of latitude = 50.04 km; 0.449° = 49.93 km.
    expect(errorsOf(buildRoute([{ coordinates: [north(0), north(0.45)] }]))).toMatch(/The route is 50 km long; a transect route can be at most 50 km/);
    expect(buildRoute([{ coordinates: [north(0), north(0.449)] }]).ok).toBe(true);
  });

  it("refuses more points than a phone should download", () => {
    const points = Array.from({ length: MAX_ROUTE_POINTS + 1 }, (_, i) => north(i * 0.00001));
    expect(errorsOf(buildRoute([{ coordinates: points }]))).toMatch(/20,001 points; at most 20,000/);
  });

  it("warns, without refusing, when the route crosses itself", () => {
    const figureOfEight: Position[] = [[-1.3, 51], [-1.299, 51.001], [-1.299, 51], [-1.3, 51.001]];
    const result = buildRoute([{ coordinates: figureOfEight }]);
    expect(result.ok).toBe(true);
    expect(result.ok && result.warnings).toEqual([expect.stringMatching(/crosses or touches itself in one place\. Loops are common/)]);
    const loop: Position[] = [[-1.3, 51], [-1.299, 51], [-1.299, 51.001], [-1.3, 51]];
    expect(buildRoute([{ coordinates: loop }])).toMatchObject({ ok: true, warnings: [] });
  });
});

describe("splitting a drawn line", () => {
  const line: Position[] = [north(0), north(0.001), north(0.002), north(0.003), north(0.004)];

  it("cuts at the chosen vertices, each boundary shared by both sections, and rebuilds the same route", () => {
    const drafts = splitAt(line, [3, 1, 3, 0, 4, 9], ["a", "b"]);
    expect(drafts).toEqual([
      { coordinates: line.slice(0, 2), habitat: "a" },
      { coordinates: line.slice(1, 4), habitat: "b" },
      { coordinates: line.slice(3), habitat: null },
    ]);
    const built = buildRoute(drafts);
    if (!built.ok) throw new Error(built.errors.join("; "));
    expect(built.value.route.coordinates).toEqual(line);
    expect(sectionLines(built.value.route, built.value.sections)).toEqual(drafts.map((d) => d.coordinates));
  });

  it("gives one section without cuts", () => {
    expect(splitAt(line, [])).toEqual([{ coordinates: line, habitat: null }]);
  });
});
