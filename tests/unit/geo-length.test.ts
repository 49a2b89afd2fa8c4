import { describe, expect, it } from "vitest";
import { lengthMetres } from "@/lib/geo/length";

// Independent values: the arc of 1° on a sphere is πR/180. @turf/length works on the sphere of
// the mean Earth radius, R = 6,371,008.8 m (IUGG mean radius R1, from memory; it is turf's
// `earthRadius` too), so one degree of a meridian is 111,195.08 m and one degree of longitude
// along latitude φ is the same times cos φ for short steps. The haversine formula is written
// out by hand below (as in R. W. Sinnott, "Virtues of the Haversine", Sky & Telescope 68(2), 1984).
const R = 6_371_008.8;
const degree = (Math.PI * R) / 180;

function haversine([lon1, lat1]: [number, number], [lon2, lat2]: [number, number]): number {
  const rad = Math.PI / 180;
  const h = Math.sin(((lat2 - lat1) * rad) / 2) ** 2 + Math.cos(lat1 * rad) * Math.cos(lat2 * rad) * Math.sin(((lon2 - lon1) * rad) / 2) ** 2;
  return 2 * R * Math.asin(Math.sqrt(h));
}

describe("route lengths (@turf/length, geodesic)", () => {
  it("measures 1° along a meridian as about 111.2 km", () => {
    const measured = lengthMetres([[-1.3, 51], [-1.3, 52]]);
    expect(measured).toBeCloseTo(degree, 3);
    expect(Math.round(measured)).toBe(111_195);
  });

  it("measures a degree of longitude at 60° north as half a meridian degree (cos 60° = ½), within the sphere's curvature", () => {
    // Along a parallel the great circle cuts the corner a little: 0.1° steps keep it within 1 m in 55 km.
    const steps: [number, number][] = Array.from({ length: 11 }, (_, i) => [i * 0.1, 60]);
    expect(Math.abs(lengthMetres(steps) - degree / 2)).toBeLessThan(1);
  });

  it("adds up segment by segment as the haversine formula by hand does", () => {
    const line: [number, number][] = [[-1.28, 51.09], [-1.279, 51.0905], [-1.278, 51.0912], [-1.2741, 51.0929]];
    const byHand = line.slice(1).reduce((sum, p, i) => sum + haversine(line[i]!, p), 0);
    expect(lengthMetres(line)).toBeCloseTo(byHand, 6);
    expect(byHand).toBeGreaterThan(300);
  });

  it("gives nothing for fewer than two points", () => {
    expect(lengthMetres([[-1.28, 51.09]])).toBe(0);
  });
});
