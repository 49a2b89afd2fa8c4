import { describe, expect, it } from "vitest";
import { beaufortScale } from "@/lib/field/beaufort";
import { conditionWarnings } from "@/lib/field/conditions";

const rules = { minTemperatureC: 13, maxWindBeaufort: 5, earliestStartTime: "10:00", latestStartTime: "16:30" };

describe("conditions rules", () => {
  it("warns (never blocks) when it is too cold or too windy", () => {
    expect(conditionWarnings(rules, { temperatureC: 12.5, windBeaufort: 6, startTime: "11:00" })).toHaveLength(2);
    expect(conditionWarnings(rules, { temperatureC: 13, windBeaufort: 5, startTime: "11:00" })).toEqual([]);
  });

  it("warns about start times outside the usual window", () => {
    expect(conditionWarnings(rules, { temperatureC: null, windBeaufort: null, startTime: "09:15" })[0]).toMatch(/after 10:00/);
    expect(conditionWarnings(rules, { temperatureC: null, windBeaufort: null, startTime: "17:00" })[0]).toMatch(/before 16:30/);
  });

  it("says nothing when a value was not recorded or the network sets no rule", () => {
    expect(conditionWarnings(rules, { temperatureC: null, windBeaufort: null, startTime: null })).toEqual([]);
    expect(conditionWarnings({ minTemperatureC: null, maxWindBeaufort: null, earliestStartTime: null, latestStartTime: null }, { temperatureC: -5, windBeaufort: 12, startTime: "03:00" })).toEqual([]);
  });
});

describe("Beaufort scale", () => {
  it("runs from force 0 (calm) to 12 (hurricane force), as the WMO's scale does", () => {
    expect(beaufortScale.map((b) => b.force)).toEqual([0, 1, 2, 3, 4, 5, 6, 7, 8, 9, 10, 11, 12]);
    expect(beaufortScale[0]!.name).toBe("Calm");
    expect(beaufortScale[8]!.name).toBe("Gale");
    expect(beaufortScale[12]!.name).toBe("Hurricane force");
  });
});
