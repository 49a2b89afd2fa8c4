import { describe, expect, it } from "vitest";
import { demoSeasons } from "@/db/seed/demo";
import { DEFAULT_SEASON_GRACE_DAYS } from "@/lib/limits/seasons";
import { contains, overlaps, phaseOf } from "@/lib/seasons/rules";

// The demo's seasons follow the day it is seeded (so the demo and the browser tests keep working
// whatever today is); these seed days cover each side of the fieldwork months and the year's end.
const seedDays = ["2026-12-03", "2027-01-15", "2027-04-02", "2027-09-30", "2027-10-01", "2028-02-29"];

describe("demo seasons placed by the seed day", () => {
  it.each(seedDays)("seeded on %s: the open season contains the day, last year's is closed and frozen, and every walk is past", (day) => {
    const seedDay = new Date(`${day}T09:00:00Z`);
    const [closed, open] = demoSeasons(seedDay);
    expect(open!.status).toBe("open");
    expect(contains(open!, day)).toBe(true);
    expect(phaseOf({ status: "open", closedAt: null }, DEFAULT_SEASON_GRACE_DAYS, seedDay)).toBe("open");

    expect(closed!.status).toBe("closed");
    expect(closed!.year).toBe(open!.year - 1);
    expect(overlaps(closed!, open!)).toBe(false);
    expect(phaseOf({ status: "closed", closedAt: new Date(`${closed!.endsOn}T18:00:00Z`) }, DEFAULT_SEASON_GRACE_DAYS, seedDay)).toBe("frozen");

    // The demo walks once a month, April to September, in each season's year: none after the seed day.
    expect(`${open!.year}-09-30` < day).toBe(true);
    expect(open!.startsOn).toBe(`${open!.year}-04-01`);
    expect(open!.name).toBe(`${open!.year} season`);
  });

  it("gives the same seasons for the same day (the demo stays deterministic)", () => {
    const d = new Date("2026-12-03T09:00:00Z");
    expect(demoSeasons(d)).toEqual(demoSeasons(new Date("2026-12-03T23:00:00Z")));
    expect(demoSeasons(d).map((s) => s.name)).toEqual(["2025 season", "2026 season"]);
  });
});
