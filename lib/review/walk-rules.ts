import { z } from "zod";
import { BEAUFORT_FORCE, SUNSHINE_PERCENT, TEMPERATURE_C } from "../limits/counts";

// The conditions a walk should be made in, as one network's editable settings
// (network_settings.walk_rules). Breaking one never refuses a walk: the phone warns the
// volunteer, and the review queue marks the walk so that analyses can choose to leave it out.
//
// The defaults are the published transect-walk method's rules AS WE REMEMBER THEM (from memory,
// not checked against the method's text: organisers should compare them with the scheme they
// follow): walk between 10:45 and 15:45 local time, the whole walk inside that window; at least
// 13 °C with at least 60 % sunshine, or at least 17 °C in any sun; wind at most Beaufort force 5;
// no rain. The database applies the same rules in SQL (walk_rule_breaches in drizzle/0008, kept
// equal to this module by tests/integration/review-rules-sql.test.ts).

const time = z.string().regex(/^([01]\d|2[0-3]):[0-5]\d$/, "Use a 24-hour time such as 10:45");
const between = (what: string, min: number, max: number) => `${what} must be between ${min} and ${max}`;
const temperature = z
  .number({ error: "Enter a temperature in °C" })
  .min(TEMPERATURE_C.min, { message: between("A temperature", TEMPERATURE_C.min, TEMPERATURE_C.max) })
  .max(TEMPERATURE_C.max, { message: between("A temperature", TEMPERATURE_C.min, TEMPERATURE_C.max) });
const wholeNumber = (what: string, min: number, max: number) =>
  z
    .number({ error: `Enter ${what.toLowerCase()} as a whole number` })
    .int({ message: `Enter ${what.toLowerCase()} as a whole number` })
    .min(min, { message: between(what, min, max) })
    .max(max, { message: between(what, min, max) });

export const walkRulesSchema = z
  .object({
    /** The walk starts at or after this local time. */
    windowStart: time,
    /** ...and ends at or before this one. */
    windowEnd: time,
    /** Below this, no walk (°C). */
    coolMinimumC: temperature,
    /** Between coolMinimumC and warmEnoughC, at least this share of the walk in sunshine. */
    coolSunshinePercent: wholeNumber("The share of sunshine", SUNSHINE_PERCENT.min, SUNSHINE_PERCENT.max),
    /** At or above this, any sunshine will do (°C). */
    warmEnoughC: temperature,
    maxWindBeaufort: wholeNumber("The wind force", BEAUFORT_FORCE.min, BEAUFORT_FORCE.max),
    /** Whether light or heavy rain is allowed during a walk. */
    rainAllowed: z.boolean({ error: "Say whether rain is allowed" }),
  })
  .refine((r) => !/^\d\d:\d\d$/.test(r.windowStart) || !/^\d\d:\d\d$/.test(r.windowEnd) || r.windowStart < r.windowEnd, {
    path: ["windowEnd"],
    message: "The window must end after it starts",
  })
  .refine((r) => r.coolMinimumC <= r.warmEnoughC, { path: ["warmEnoughC"], message: "Must be at least the lowest temperature" });

export type WalkRules = z.infer<typeof walkRulesSchema>;

export const DEFAULT_WALK_RULES: WalkRules = {
  windowStart: "10:45",
  windowEnd: "15:45",
  coolMinimumC: 13,
  coolSunshinePercent: 60,
  warmEnoughC: 17,
  maxWindBeaufort: 5,
  rainAllowed: false,
};

export const walkBreaches = ["outside_hours", "too_cool", "too_windy", "rain"] as const;
export type WalkBreach = (typeof walkBreaches)[number];

export type WalkConditions = {
  startTime: string | null;
  endTime: string | null;
  temperatureC: number | null;
  sunshinePercent: number | null;
  windBeaufort: number | null;
  rain: "none" | "light" | "heavy" | null;
};

const hhmm = (t: string) => t.slice(0, 5);

/**
 * The rules a walk broke. What was not recorded breaks nothing: an older phone's walk without
 * sunshine is judged on temperature alone (below coolMinimumC only), a walk without an end time
 * on its start.
 */
export function walkRuleBreaches(rules: WalkRules, walk: WalkConditions): WalkBreach[] {
  const out: WalkBreach[] = [];
  const start = walk.startTime ? hhmm(walk.startTime) : null;
  const end = walk.endTime ? hhmm(walk.endTime) : null;
  if ((start && (start < rules.windowStart || start > rules.windowEnd)) || (end && end > rules.windowEnd)) out.push("outside_hours");
  const t = walk.temperatureC;
  if (t != null && (t < rules.coolMinimumC || (t < rules.warmEnoughC && walk.sunshinePercent != null && walk.sunshinePercent < rules.coolSunshinePercent))) out.push("too_cool");
  if (walk.windBeaufort != null && walk.windBeaufort > rules.maxWindBeaufort) out.push("too_windy");
  if (!rules.rainAllowed && (walk.rain === "light" || walk.rain === "heavy")) out.push("rain");
  return out;
}

/** Words for screens, one sentence each, with the network's own numbers. */
export function walkBreachText(rules: WalkRules, breach: WalkBreach): string {
  switch (breach) {
    case "outside_hours":
      return `Walked outside ${rules.windowStart}–${rules.windowEnd}`;
    case "too_cool":
      return `Cooler than the rules allow (${rules.coolMinimumC} °C with ${rules.coolSunshinePercent} % sun, or ${rules.warmEnoughC} °C)`;
    case "too_windy":
      return `Wind above force ${rules.maxWindBeaufort}`;
    case "rain":
      return "Rain during the walk";
  }
}
