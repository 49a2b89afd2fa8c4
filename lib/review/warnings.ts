import type { WarningRules } from "./warning-rules";

// Warnings on one sighting, for the reviewer; none of them refuses or hides a sighting. The
// database keeps them in sightings.warnings (drizzle/0008, sighting_warning_kinds) so the queue can
// filter by kind through an index; this module states the same rules for tests and screens.
//
// - outside_months: the walk's month is not one of the species' usual months of activity
//   (species.active_months; a species with none listed is never flagged).
// - first_on_transect: no checked sighting of the species on this transect in any earlier
//   season, where the transect has at least firstRecordMinSeasons earlier seasons with checked
//   sightings (a new transect would otherwise flag everything).
// - count_above_usual: the count is more than countFactor times the highest checked count of
//   the species on this transect in earlier seasons, and at least countMinimum. Counts are single
//   sightings, as entered (a tally of several entries is judged entry by entry).
// - sensitive_no_photo: a sensitive species with no photo that was not refused.
// "Checked" means accepted by a reviewer; "earlier" means a season that started before the
// sighting's own.

export const sightingWarnings = ["outside_months", "first_on_transect", "count_above_usual", "sensitive_no_photo"] as const;
export type SightingWarning = (typeof sightingWarnings)[number];

/** The queue's warning filter: one sighting warning, or "walk_rules" for a walk outside the walk rules. */
export const warningFilters = [...sightingWarnings, "walk_rules"] as const;
export type WarningFilter = (typeof warningFilters)[number];

export type SightingFacts = {
  month: number;
  activeMonths: readonly number[];
  count: number;
  sensitive: boolean;
  hasPhoto: boolean;
  /** Earlier seasons of this transect with checked sightings of anything. */
  earlierSeasons: number;
  /** The species' highest checked count on this transect in earlier seasons; null if never. */
  earlierMaxCount: number | null;
};

export function sightingWarningKinds(rules: WarningRules, f: SightingFacts): SightingWarning[] {
  const out: SightingWarning[] = [];
  if (f.activeMonths.length > 0 && !f.activeMonths.includes(f.month)) out.push("outside_months");
  if (f.earlierMaxCount === null && f.earlierSeasons >= rules.firstRecordMinSeasons) out.push("first_on_transect");
  if (f.earlierMaxCount !== null && f.count > rules.countFactor * f.earlierMaxCount && f.count >= rules.countMinimum) out.push("count_above_usual");
  if (f.sensitive && !f.hasPhoto) out.push("sensitive_no_photo");
  return out;
}

export const warningLabel: Record<WarningFilter, string> = {
  outside_months: "Outside its usual months",
  first_on_transect: "First on this transect",
  count_above_usual: "Far above earlier counts",
  sensitive_no_photo: "Sensitive species without a photo",
  walk_rules: "Walk outside the walk rules",
};
