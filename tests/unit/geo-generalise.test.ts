import { describe, expect, it } from "vitest";
import { generalise } from "@/lib/geo/generalise";
import { thinForOverview } from "@/lib/geo/thin";

describe("a sensitive route's generalised form", () => {
  it("keeps only the centre of the route's extent, to 0.1°", () => {
    const route = { type: "LineString" as const, coordinates: [[-1.2631, 51.0812], [-1.2402, 51.0977]] as [number, number][] };
    expect(generalise(route)).toEqual({ type: "generalised", centre: [-1.3, 51.1], precisionDegrees: 0.1 });
  });

  it("gives the same answer for every route in the same 0.1° cell, so the path cannot be read back", () => {
    const a = generalise({ type: "LineString", coordinates: [[-1.26, 51.08], [-1.27, 51.09]] });
    const b = generalise({ type: "LineString", coordinates: [[-1.27, 51.09], [-1.25, 51.07], [-1.26, 51.12]] });
    expect(a.centre).toEqual(b.centre);
  });
});

describe("routes thinned for the overview map", () => {
  it("keeps both ends and at most the asked number of points, and leaves short routes alone", () => {
    const line = Array.from({ length: 1001 }, (_, i) => [i, 0] as [number, number]);
    const thin = thinForOverview(line, 11);
    expect(thin).toEqual(Array.from({ length: 11 }, (_, i) => [i * 100, 0]));
    expect(thinForOverview(line.slice(0, 5), 11)).toEqual(line.slice(0, 5));
  });
});
