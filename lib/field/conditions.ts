export type ConditionsRules = {
  minTemperatureC: number | null;
  maxWindBeaufort: number | null;
  earliestStartTime: string | null;
  latestStartTime: string | null;
};

export type Conditions = { temperatureC: number | null; windBeaufort: number | null; startTime: string | null };

/** The network's conditions rules are advice: breaking one warns, it never blocks a visit. */
export function conditionWarnings(rules: ConditionsRules, c: Conditions): string[] {
  const warnings: string[] = [];
  if (rules.minTemperatureC != null && c.temperatureC != null && c.temperatureC < rules.minTemperatureC) {
    warnings.push(`It is below ${rules.minTemperatureC} °C: counts may be low and not comparable with other walks.`);
  }
  if (rules.maxWindBeaufort != null && c.windBeaufort != null && c.windBeaufort > rules.maxWindBeaufort) {
    warnings.push(`Wind above force ${rules.maxWindBeaufort}: the network's walks are usually made in lighter wind.`);
  }
  if (c.startTime && rules.earliestStartTime && c.startTime < rules.earliestStartTime) {
    warnings.push(`Walks usually start after ${rules.earliestStartTime}.`);
  }
  if (c.startTime && rules.latestStartTime && c.startTime > rules.latestStartTime) {
    warnings.push(`Walks usually start before ${rules.latestStartTime}.`);
  }
  return warnings;
}
