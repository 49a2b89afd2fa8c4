import { walkRuleBreaches, walkRulesSchema, type WalkBreach, type WalkConditions, type WalkRules } from "@/lib/review/walk-rules";

export type ConditionsRules = WalkRules;
export type Conditions = Partial<WalkConditions>;

function advice(rules: WalkRules, breach: WalkBreach): string {
  switch (breach) {
    case "outside_hours":
      return `The network's walks are made between ${rules.windowStart} and ${rules.windowEnd}.`;
    case "too_cool":
      return `Cooler than the walk rules (at least ${rules.coolMinimumC} °C with ${rules.coolSunshinePercent} % sunshine, or ${rules.warmEnoughC} °C): counts may be low and not comparable with other walks.`;
    case "too_windy":
      return `Wind above force ${rules.maxWindBeaufort}: the network's walks are made in lighter wind.`;
    case "rain":
      return "The network's walks are made without rain.";
  }
}

/**
 * The network's walk rules are advice: breaking one warns, it never blocks a walk (reviewers see
 * the same rules on the walk). A reference cached before the walk rules came has rules of another
 * shape: it warns of nothing until the phone next refreshes it.
 */
export function conditionWarnings(rules: unknown, c: Conditions): string[] {
  const parsed = walkRulesSchema.safeParse(rules);
  if (!parsed.success) return [];
  const walk: WalkConditions = {
    startTime: c.startTime ?? null,
    endTime: c.endTime ?? null,
    temperatureC: c.temperatureC ?? null,
    sunshinePercent: c.sunshinePercent ?? null,
    windBeaufort: c.windBeaufort ?? null,
    rain: c.rain ?? null,
  };
  return walkRuleBreaches(parsed.data, walk).map((b) => advice(parsed.data, b));
}
