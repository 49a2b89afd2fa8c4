import { z } from "zod";

// The thresholds behind the review queue's warnings on single sightings, editable by organisers
// (network_settings.warning_rules). The rules themselves are in lib/review/warnings.ts.

export const warningRulesSchema = z.object({
  /** A count is far above usual when it is more than this many times the earlier highest... */
  countFactor: z.number().min(1).max(100),
  /** ...and at least this many. */
  countMinimum: z.number().int().min(1).max(100_000),
  /** "First on this transect" counts only where the transect has this many earlier seasons of checked sightings. */
  firstRecordMinSeasons: z.number().int().min(1).max(50),
});

export type WarningRules = z.infer<typeof warningRulesSchema>;

// Our own choice, stated on the settings page: more than 3 times the previous highest count and
// at least 10; two earlier seasons before a transect's "first" means anything.
export const DEFAULT_WARNING_RULES: WarningRules = { countFactor: 3, countMinimum: 10, firstRecordMinSeasons: 2 };
