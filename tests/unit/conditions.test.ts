import { describe, expect, it } from "vitest";
import { beaufortScale } from "@/lib/field/beaufort";
import { conditionWarnings } from "@/lib/field/conditions";
import { DEFAULT_WALK_RULES, walkRuleBreaches } from "@/lib/review/walk-rules";
import { otherRuleCases, otherRules, walkRuleCases } from "./review-rule-cases";

// The start form's warnings (lib/field/conditions.ts): the network's walk rules as advice to the
// volunteer, never a refusal. The rules are judged by lib/review/walk-rules.ts (its boundaries:
// tests/unit/walk-rules.test.ts); here, that the phone warns exactly when a reviewer would see a
// breach, in words that carry the network's numbers. DEFAULT_WALK_RULES are from memory.

const rules = DEFAULT_WALK_RULES;

describe("conditions warnings on the start form", () => {
  it.each([
    ...walkRuleCases.map(([what, conditions, breaches]) => [`default rules, ${what}`, rules, conditions, breaches] as const),
    ...otherRuleCases.map(([what, conditions, breaches]) => [`other rules, ${what}`, otherRules, conditions, breaches] as const),
  ])(
    "warn once for each rule broken: %s",
    (_what, r, conditions, breaches) => {
      expect(conditionWarnings(r, conditions)).toHaveLength(breaches.length);
      expect(walkRuleBreaches(r, conditions)).toEqual(breaches);
    },
  );

  it("name the network's numbers in each warning", () => {
    const [hours, cool, windy, rain] = conditionWarnings(rules, { startTime: "10:44", temperatureC: 13, sunshinePercent: 59, windBeaufort: 6, rain: "light" });
    expect(hours).toBe("The network's walks are made between 10:45 and 15:45.");
    expect(cool).toBe("Cooler than the walk rules (at least 13 °C with 60 % sunshine, or 17 °C): counts may be low and not comparable with other walks.");
    expect(windy).toBe("Wind above force 5: the network's walks are made in lighter wind.");
    expect(rain).toBe("The network's walks are made without rain.");
    expect(conditionWarnings(otherRules, { startTime: "09:29" })).toEqual(["The network's walks are made between 09:30 and 17:00."]);
  });

  it("say nothing for what was not recorded: a form with only a start time inside the window", () => {
    expect(conditionWarnings(rules, {})).toEqual([]);
    expect(conditionWarnings(rules, { startTime: "11:00" })).toEqual([]);
    expect(conditionWarnings(rules, { startTime: null, temperatureC: null, sunshinePercent: null, windBeaufort: null, rain: null })).toEqual([]);
  });

  it("warn of nothing with rules cached before the walk rules came (another shape), or none at all", () => {
    const bad = { startTime: "03:00", temperatureC: -5, windBeaufort: 12, rain: "heavy" } as const;
    expect(conditionWarnings({ minTemperatureC: 13, maxWindBeaufort: 5, earliestStartTime: "10:00", latestStartTime: "16:30" }, bad)).toEqual([]);
    expect(conditionWarnings(null, bad)).toEqual([]);
    expect(conditionWarnings(undefined, bad)).toEqual([]);
    expect(conditionWarnings({ ...rules, windowEnd: "25:00" }, bad)).toEqual([]);
    expect(conditionWarnings(rules, bad)).toHaveLength(4);
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
