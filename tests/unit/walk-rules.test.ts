import { describe, expect, it } from "vitest";
import { DEFAULT_WALK_RULES, walkBreachText, walkBreaches, walkRuleBreaches, walkRulesSchema, type WalkRules } from "@/lib/review/walk-rules";
import { otherRuleCases, otherRules, walkRuleCases } from "./review-rule-cases";

// The walk rules at their boundaries. The defaults are the published transect-walk method's rules
// as remembered (from memory, not checked against the method's text, as lib/review/walk-rules.ts
// says): 10:45 to 15:45, the whole walk inside; at least 13 °C with at least 60 % sunshine, or
// at least 17 °C in any sun; wind at most Beaufort force 5; no rain. The same cases run through
// the SQL twin in tests/integration/review-rules-sql.test.ts (./review-rule-cases.ts).

describe("walk rules: the defaults", () => {
  it("are the method's rules as remembered (from memory: check against the scheme the network follows)", () => {
    expect(DEFAULT_WALK_RULES).toEqual({
      windowStart: "10:45",
      windowEnd: "15:45",
      coolMinimumC: 13,
      coolSunshinePercent: 60,
      warmEnoughC: 17,
      maxWindBeaufort: 5,
      rainAllowed: false,
    });
    expect(walkRulesSchema.parse(DEFAULT_WALK_RULES)).toEqual(DEFAULT_WALK_RULES);
  });

  it.each(walkRuleCases)("%s", (_what, conditions, breaches) => {
    expect(walkRuleBreaches(DEFAULT_WALK_RULES, conditions)).toEqual(breaches);
  });
});

describe("walk rules: a network's own", () => {
  it.each(otherRuleCases)("%s", (_what, conditions, breaches) => {
    expect(walkRuleBreaches(otherRules, conditions)).toEqual(breaches);
  });
});

describe("walk rules: the settings' schema", () => {
  const ok = (over: Partial<WalkRules>) => walkRulesSchema.safeParse({ ...DEFAULT_WALK_RULES, ...over });
  const fieldsOf = (over: Partial<WalkRules>) => {
    const r = ok(over);
    return r.success ? [] : r.error.issues.map((i) => i.path.join("."));
  };

  it("takes 24-hour times HH:MM only", () => {
    for (const t of ["00:00", "09:05", "23:58"]) expect(ok({ windowStart: t, windowEnd: "23:59" }).success, t).toBe(true);
    for (const t of ["9:05", "24:00", "10:60", "10:45:00", "", "ten"]) expect(fieldsOf({ windowStart: t }), t).toContain("windowStart");
  });

  it("needs the window to end after it starts, and the warm threshold at least the cool one", () => {
    expect(fieldsOf({ windowStart: "15:45", windowEnd: "15:45" })).toEqual(["windowEnd"]);
    expect(fieldsOf({ windowStart: "15:46", windowEnd: "15:45" })).toEqual(["windowEnd"]);
    expect(ok({ windowStart: "15:44", windowEnd: "15:45" }).success).toBe(true);
    expect(fieldsOf({ coolMinimumC: 17.1, warmEnoughC: 17 })).toEqual(["warmEnoughC"]);
    expect(ok({ coolMinimumC: 17, warmEnoughC: 17 }).success).toBe(true);
  });

  it("keeps numbers inside the recorded ranges (lib/limits/counts.ts)", () => {
    expect(ok({ coolSunshinePercent: 0 }).success).toBe(true);
    expect(ok({ coolSunshinePercent: 100 }).success).toBe(true);
    expect(fieldsOf({ coolSunshinePercent: 101 })).toEqual(["coolSunshinePercent"]);
    expect(fieldsOf({ coolSunshinePercent: 59.5 })).toEqual(["coolSunshinePercent"]);
    expect(ok({ maxWindBeaufort: 0 }).success).toBe(true);
    expect(ok({ maxWindBeaufort: 12 }).success).toBe(true);
    expect(fieldsOf({ maxWindBeaufort: 13 })).toEqual(["maxWindBeaufort"]);
    expect(fieldsOf({ maxWindBeaufort: 4.5 })).toEqual(["maxWindBeaufort"]);
    expect(ok({ coolMinimumC: -40, warmEnoughC: 60 }).success).toBe(true);
    expect(fieldsOf({ coolMinimumC: -41 })).toEqual(["coolMinimumC"]);
    expect(fieldsOf({ warmEnoughC: 61 })).toEqual(["warmEnoughC"]);
  });

  it("needs every rule: a missing one or the old settings' shape is refused", () => {
    const { rainAllowed: _r, ...noRain } = DEFAULT_WALK_RULES;
    expect(walkRulesSchema.safeParse(noRain).success).toBe(false);
    expect(walkRulesSchema.safeParse({ minTemperatureC: 13, maxWindBeaufort: 5, earliestStartTime: "10:00", latestStartTime: "16:30" }).success).toBe(false);
  });
});

describe("walk rules: the words", () => {
  it("name the network's own numbers for every breach", () => {
    expect(walkBreaches.map((b) => walkBreachText(otherRules, b))).toEqual([
      "Walked outside 09:30–17:00",
      "Cooler than the rules allow (11 °C with 40 % sun, or 15.5 °C)",
      "Wind above force 4",
      "Rain during the walk",
    ]);
  });
});

describe("the rules' own messages (what the settings page and a 400 show)", () => {
  it("names the field and its range instead of a library's wording", async () => {
    const { walkRulesSchema, DEFAULT_WALK_RULES } = await import("@/lib/review/walk-rules");
    const { warningRulesSchema, DEFAULT_WARNING_RULES } = await import("@/lib/review/warning-rules");
    const walk = walkRulesSchema.safeParse({ ...DEFAULT_WALK_RULES, coolSunshinePercent: 101, maxWindBeaufort: 2.5, windowStart: "9" });
    const messages = Object.fromEntries((walk.error?.issues ?? []).map((i) => [i.path.join("."), i.message]));
    expect(messages).toEqual({
      coolSunshinePercent: "The share of sunshine must be between 0 and 100",
      maxWindBeaufort: "Enter the wind force as a whole number",
      windowStart: "Use a 24-hour time such as 10:45",
    });
    const warning = warningRulesSchema.safeParse({ ...DEFAULT_WARNING_RULES, countMinimum: 0, firstRecordMinSeasons: 51 });
    expect(warning.error?.issues.map((i) => i.message)).toEqual(["The smallest count must be between 1 and 100,000", "The earlier seasons must be between 1 and 50"]);
  });
});
