import { describe, expect, it } from "vitest";
import { DEFAULT_WARNING_RULES, warningRulesSchema, type WarningRules } from "@/lib/review/warning-rules";
import { sightingWarningKinds, sightingWarnings, warningFilters, warningLabel } from "@/lib/review/warnings";
import { otherWarningCases, otherWarningRules, sightingWarningCases } from "./review-rule-cases";

// The warnings on one sighting at their boundaries (lib/review/warnings.ts). The thresholds'
// defaults are our own choice, not a published method's: more than 3 times the earlier highest
// count and at least 10; a first record counts where the transect has 2 earlier seasons of
// checked sightings. The SQL twin is held to these in tests/integration/review-rules-sql.test.ts.

describe("sighting warnings: the default thresholds", () => {
  it("are 3 times and at least 10, and 2 earlier seasons", () => {
    expect(DEFAULT_WARNING_RULES).toEqual({ countFactor: 3, countMinimum: 10, firstRecordMinSeasons: 2 });
    expect(warningRulesSchema.parse(DEFAULT_WARNING_RULES)).toEqual(DEFAULT_WARNING_RULES);
  });

  it.each(sightingWarningCases)("%s", (_what, facts, warnings) => {
    expect(sightingWarningKinds(DEFAULT_WARNING_RULES, facts)).toEqual(warnings);
  });
});

describe("sighting warnings: a network's own thresholds", () => {
  it.each(otherWarningCases)("%s", (_what, facts, warnings) => {
    expect(sightingWarningKinds(otherWarningRules, facts)).toEqual(warnings);
  });
});

describe("sighting warnings: the thresholds' schema", () => {
  const fieldsOf = (over: Partial<WarningRules>) => {
    const r = warningRulesSchema.safeParse({ ...DEFAULT_WARNING_RULES, ...over });
    return r.success ? [] : r.error.issues.map((i) => i.path.join("."));
  };

  it("takes a factor from 1 to 100 (fractions too), a whole minimum from 1 and whole seasons from 1 to 50", () => {
    for (const countFactor of [1, 2.5, 100]) expect(fieldsOf({ countFactor }), String(countFactor)).toEqual([]);
    for (const countFactor of [0.99, 100.1, Number.NaN]) expect(fieldsOf({ countFactor }), String(countFactor)).toEqual(["countFactor"]);
    for (const countMinimum of [1, 100_000]) expect(fieldsOf({ countMinimum })).toEqual([]);
    for (const countMinimum of [0, 100_001, 9.5]) expect(fieldsOf({ countMinimum }), String(countMinimum)).toEqual(["countMinimum"]);
    for (const firstRecordMinSeasons of [1, 50]) expect(fieldsOf({ firstRecordMinSeasons })).toEqual([]);
    for (const firstRecordMinSeasons of [0, 51, 1.5]) expect(fieldsOf({ firstRecordMinSeasons }), String(firstRecordMinSeasons)).toEqual(["firstRecordMinSeasons"]);
  });

  it("needs every threshold", () => {
    const { countMinimum: _m, ...rest } = DEFAULT_WARNING_RULES;
    expect(warningRulesSchema.safeParse(rest).success).toBe(false);
  });
});

describe("sighting warnings: the words", () => {
  it("label every kind, and the walk-rules filter", () => {
    expect(warningFilters).toEqual([...sightingWarnings, "walk_rules"]);
    for (const kind of warningFilters) expect(warningLabel[kind], kind).toMatch(/^[A-Z][a-z]/);
    expect(new Set(Object.values(warningLabel)).size).toBe(warningFilters.length);
  });
});
