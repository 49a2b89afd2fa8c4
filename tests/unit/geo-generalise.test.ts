import { describe, expect, it } from "vitest";
import { generalise } from "@/lib/geo/generalise";

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
