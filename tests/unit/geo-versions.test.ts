import { describe, expect, it } from "vitest";
import { changedBetween, versionOn } from "@/lib/geo/versions";

const versions = [
  { version: 1, validFrom: "2025-03-01", sectionCount: 6 },
  { version: 2, validFrom: "2026-05-10", sectionCount: 4 },
  { version: 3, validFrom: "2026-07-01", sectionCount: 5 },
];
const s2025 = { startsOn: "2025-04-01", endsOn: "2025-09-30" };
const s2026 = { startsOn: "2026-04-01", endsOn: "2026-09-30" };
const s2027 = { startsOn: "2027-04-01", endsOn: "2027-09-30" };

describe("route versions by date", () => {
  it("gives each date the latest version valid from that day or before", () => {
    expect(versionOn(versions, "2026-05-09")?.version).toBe(1);
    expect(versionOn(versions, "2026-05-10")?.version).toBe(2);
    expect(versionOn(versions, "2026-06-30")?.sectionCount).toBe(4);
    expect(versionOn(versions, "2026-08-01")?.version).toBe(3);
  });

  it("measures walks from before the first version against the first (an imported earlier season)", () => {
    expect(versionOn(versions, "2019-06-01")?.version).toBe(1);
    expect(versionOn([], "2026-06-01")).toBeNull();
  });

  it("does not depend on the order versions are listed in", () => {
    expect(versionOn([...versions].reverse(), "2026-06-01")?.version).toBe(2);
  });

  it("flags a route that changed between two seasons, in either order, and not one that stayed put", () => {
    expect(changedBetween(versions, s2025, s2026)).toBe(true);
    expect(changedBetween(versions, s2026, s2025)).toBe(true);
    expect(changedBetween(versions, s2026, s2027)).toBe(true); // changed during 2026
    expect(changedBetween([versions[0]!, { version: 2, validFrom: "2026-01-15", sectionCount: 4 }], s2026, s2027)).toBe(false);
    expect(changedBetween([versions[0]!], s2025, s2026)).toBe(false);
  });

  it("does not count the first version's own date as a change", () => {
    expect(changedBetween([{ version: 1, validFrom: "2025-06-01", sectionCount: 5 }], s2025, s2026)).toBe(false);
  });
});
