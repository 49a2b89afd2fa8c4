import { z } from "zod";

// The thresholds behind the review queue's warnings on single sightings, editable by organisers
// (network_settings.warning_rules). The rules themselves are in lib/review/warnings.ts.

export const warningRulesSchema = z.object({
  /** A count is far above usual when it is more than this many times the earlier highest... */
  countFactor: z
    .number({ error: "Enter how many times the earlier highest count" })
    .min(1, { message: "The factor must be between 1 and 100" })
    .max(100, { message: "The factor must be between 1 and 100" }),
  /** ...and at least this many. */
  countMinimum: z
    .number({ error: "Enter the smallest count as a whole number" })
    .int({ message: "Enter the smallest count as a whole number" })
    .min(1, { message: "The smallest count must be between 1 and 100,000" })
    .max(100_000, { message: "The smallest count must be between 1 and 100,000" }),
  /** "First on this transect" counts only where the transect has this many earlier seasons of checked sightings. */
  firstRecordMinSeasons: z
    .number({ error: "Enter the number of earlier seasons as a whole number" })
    .int({ message: "Enter the number of earlier seasons as a whole number" })
    .min(1, { message: "The earlier seasons must be between 1 and 50" })
    .max(50, { message: "The earlier seasons must be between 1 and 50" }),
});

export type WarningRules = z.infer<typeof warningRulesSchema>;

// Our own choice, stated on the settings page: more than 3 times the previous highest count and
// at least 10; two earlier seasons before a transect's "first" means anything.
export const DEFAULT_WARNING_RULES: WarningRules = { countFactor: 3, countMinimum: 10, firstRecordMinSeasons: 2 };
