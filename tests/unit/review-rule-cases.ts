import type { WalkConditions, WalkRules } from "@/lib/review/walk-rules";
import type { WarningRules } from "@/lib/review/warning-rules";
import type { SightingFacts, SightingWarning } from "@/lib/review/warnings";

// Boundary cases of the review rules, shared by the unit tests of the TypeScript rules
// (tests/unit/walk-rules.test.ts, sighting-warnings.test.ts) and the test that runs the same
// cases through their SQL twins (tests/integration/review-rules-sql.test.ts). The walk rules'
// defaults are the published transect-walk method's rules as remembered (from memory, not
// checked against the method's text, as lib/review/walk-rules.ts says).

const nothing: WalkConditions = { startTime: null, endTime: null, temperatureC: null, sunshinePercent: null, windBeaufort: null, rain: null };
const walk = (over: Partial<WalkConditions>): WalkConditions => ({ ...nothing, ...over });

/** Boundary cases under DEFAULT_WALK_RULES: [what, conditions, breaches]. */
export const walkRuleCases: [string, WalkConditions, string[]][] = [
  ["nothing recorded breaks nothing", nothing, []],
  // The window: a start at 10:45 exactly is inside, 10:44 outside; an end at 15:45 inside, 15:46 outside.
  ["start 10:45 exactly", walk({ startTime: "10:45" }), []],
  ["start 10:44", walk({ startTime: "10:44" }), ["outside_hours"]],
  ["start 10:45:00 with seconds", walk({ startTime: "10:45:00" }), []],
  ["start 10:44:59 with seconds", walk({ startTime: "10:44:59" }), ["outside_hours"]],
  ["end 15:45 exactly", walk({ startTime: "14:00", endTime: "15:45" }), []],
  ["end 15:46", walk({ startTime: "14:00", endTime: "15:46" }), ["outside_hours"]],
  // Times are judged to the minute, as the phone records them.
  ["end 15:45:59 (still the minute 15:45)", walk({ startTime: "14:00:00", endTime: "15:45:59" }), []],
  ["start 15:45 exactly, no end recorded", walk({ startTime: "15:45" }), []],
  ["start 15:46, no end recorded", walk({ startTime: "15:46" }), ["outside_hours"]],
  ["end recorded without a start", walk({ endTime: "16:00" }), ["outside_hours"]],
  ["whole day 10:45-15:45", walk({ startTime: "10:45", endTime: "15:45" }), []],
  ["early start and late end: one breach", walk({ startTime: "09:00", endTime: "17:00" }), ["outside_hours"]],
  // Temperature and sunshine.
  ["13 °C with 60 % sun", walk({ temperatureC: 13, sunshinePercent: 60 }), []],
  ["13 °C with 59 % sun", walk({ temperatureC: 13, sunshinePercent: 59 }), ["too_cool"]],
  ["12.9 °C with full sun", walk({ temperatureC: 12.9, sunshinePercent: 100 }), ["too_cool"]],
  ["12.9 °C, sunshine not recorded", walk({ temperatureC: 12.9 }), ["too_cool"]],
  ["13 °C, sunshine not recorded (an older phone)", walk({ temperatureC: 13 }), []],
  ["16.9 °C with 60 % sun", walk({ temperatureC: 16.9, sunshinePercent: 60 }), []],
  ["16.9 °C with 0 % sun", walk({ temperatureC: 16.9, sunshinePercent: 0 }), ["too_cool"]],
  ["17 °C with 0 % sun", walk({ temperatureC: 17, sunshinePercent: 0 }), []],
  ["30 °C with 0 % sun", walk({ temperatureC: 30, sunshinePercent: 0 }), []],
  ["sunshine alone breaks nothing", walk({ sunshinePercent: 0 }), []],
  ["-5 °C", walk({ temperatureC: -5, sunshinePercent: 100 }), ["too_cool"]],
  // Wind.
  ["force 5", walk({ windBeaufort: 5 }), []],
  ["force 6", walk({ windBeaufort: 6 }), ["too_windy"]],
  ["force 0", walk({ windBeaufort: 0 }), []],
  ["force 12", walk({ windBeaufort: 12 }), ["too_windy"]],
  // Rain.
  ["no rain", walk({ rain: "none" }), []],
  ["rain not recorded", walk({ rain: null }), []],
  ["light rain", walk({ rain: "light" }), ["rain"]],
  ["heavy rain", walk({ rain: "heavy" }), ["rain"]],
  // Everything at once, in the order of walkBreaches.
  [
    "every rule broken",
    { startTime: "08:00", endTime: "16:30", temperatureC: 12, sunshinePercent: 10, windBeaufort: 7, rain: "heavy" },
    ["outside_hours", "too_cool", "too_windy", "rain"],
  ],
  ["every rule kept", { startTime: "11:00", endTime: "12:30", temperatureC: 15, sunshinePercent: 80, windBeaufort: 3, rain: "none" }, []],
];

/** Another network's rules, so nothing passes only because it matches the defaults. */
export const otherRules: WalkRules = {
  windowStart: "09:30",
  windowEnd: "17:00",
  coolMinimumC: 11,
  coolSunshinePercent: 40,
  warmEnoughC: 15.5,
  maxWindBeaufort: 4,
  rainAllowed: true,
};

export const otherRuleCases: [string, WalkConditions, string[]][] = [
  ["start 09:30", walk({ startTime: "09:30" }), []],
  ["start 09:29", walk({ startTime: "09:29" }), ["outside_hours"]],
  ["end 17:00", walk({ startTime: "16:00", endTime: "17:00" }), []],
  ["end 17:01", walk({ startTime: "16:00", endTime: "17:01" }), ["outside_hours"]],
  ["start 10:44 (outside the defaults only)", walk({ startTime: "10:44", endTime: "16:30" }), []],
  ["11 °C with 40 % sun", walk({ temperatureC: 11, sunshinePercent: 40 }), []],
  ["11 °C with 39 % sun", walk({ temperatureC: 11, sunshinePercent: 39 }), ["too_cool"]],
  ["10.9 °C", walk({ temperatureC: 10.9, sunshinePercent: 100 }), ["too_cool"]],
  ["15.4 °C with 0 % sun", walk({ temperatureC: 15.4, sunshinePercent: 0 }), ["too_cool"]],
  ["15.5 °C with 0 % sun", walk({ temperatureC: 15.5, sunshinePercent: 0 }), []],
  ["force 4", walk({ windBeaufort: 4 }), []],
  ["force 5", walk({ windBeaufort: 5 }), ["too_windy"]],
  ["heavy rain allowed", walk({ rain: "heavy" }), []],
];

// Sightings. The warning thresholds' defaults are our own choice (lib/review/warning-rules.ts):
// more than 3 times the earlier highest count and at least 10; "first on this transect" only
// where the transect has at least 2 earlier seasons of checked sightings.
const plain: SightingFacts = { month: 7, activeMonths: [], count: 1, sensitive: false, hasPhoto: false, earlierSeasons: 0, earlierMaxCount: null };
const sighting = (over: Partial<SightingFacts>): SightingFacts => ({ ...plain, ...over });

/** Boundary cases under DEFAULT_WARNING_RULES: [what, facts, warnings]. */
export const sightingWarningCases: [string, SightingFacts, SightingWarning[]][] = [
  ["a plain sighting on a new transect", plain, []],
  // Count far above usual: more than 3 times the earlier highest, and at least 10.
  ["15 where the highest was 5: 3 times exactly", sighting({ earlierSeasons: 2, earlierMaxCount: 5, count: 15 }), []],
  ["16 where the highest was 5: just above 3 times", sighting({ earlierSeasons: 2, earlierMaxCount: 5, count: 16 }), ["count_above_usual"]],
  ["9 where the highest was 2: above 3 times, below the minimum", sighting({ earlierSeasons: 2, earlierMaxCount: 2, count: 9 }), []],
  ["10 where the highest was 2: the minimum", sighting({ earlierSeasons: 2, earlierMaxCount: 2, count: 10 }), ["count_above_usual"]],
  ["9 where the highest was 3: 3 times exactly and below the minimum", sighting({ earlierSeasons: 2, earlierMaxCount: 3, count: 9 }), []],
  ["10 where the highest was 3", sighting({ earlierSeasons: 2, earlierMaxCount: 3, count: 10 }), ["count_above_usual"]],
  ["10 where the highest was 0", sighting({ earlierSeasons: 2, earlierMaxCount: 0, count: 10 }), ["count_above_usual"]],
  ["0 where the highest was 0", sighting({ earlierSeasons: 2, earlierMaxCount: 0, count: 0 }), []],
  ["500 where it was never seen: first, not 'above usual'", sighting({ earlierSeasons: 2, earlierMaxCount: null, count: 500 }), ["first_on_transect"]],
  ["500 where it was never seen, on a new transect", sighting({ earlierSeasons: 0, earlierMaxCount: null, count: 500 }), []],
  // First on this transect: only with at least 2 earlier seasons of checked sightings.
  ["never seen, 1 earlier season", sighting({ earlierSeasons: 1 }), []],
  ["never seen, 2 earlier seasons", sighting({ earlierSeasons: 2 }), ["first_on_transect"]],
  ["never seen, 5 earlier seasons", sighting({ earlierSeasons: 5 }), ["first_on_transect"]],
  ["seen before, 5 earlier seasons", sighting({ earlierSeasons: 5, earlierMaxCount: 1 }), []],
  // Outside the usual months.
  ["May for a June-August species", sighting({ activeMonths: [6, 7, 8], month: 5 }), ["outside_months"]],
  ["June for a June-August species", sighting({ activeMonths: [6, 7, 8], month: 6 }), []],
  ["August for a June-August species", sighting({ activeMonths: [6, 7, 8], month: 8 }), []],
  ["September for a June-August species", sighting({ activeMonths: [6, 7, 8], month: 9 }), ["outside_months"]],
  ["any month for a species without listed months", sighting({ activeMonths: [], month: 1 }), []],
  // Sensitive species without a photo.
  ["sensitive without a photo", sighting({ sensitive: true, hasPhoto: false }), ["sensitive_no_photo"]],
  ["sensitive with a photo", sighting({ sensitive: true, hasPhoto: true }), []],
  ["not sensitive, without a photo", sighting({ sensitive: false, hasPhoto: false }), []],
  [
    "every warning at once (first record and far above usual exclude each other)",
    sighting({ activeMonths: [6], month: 10, sensitive: true, earlierSeasons: 3, earlierMaxCount: null }),
    ["outside_months", "first_on_transect", "sensitive_no_photo"],
  ],
  [
    "every warning but the first record",
    sighting({ activeMonths: [6], month: 10, sensitive: true, earlierSeasons: 3, earlierMaxCount: 4, count: 13 }),
    ["outside_months", "count_above_usual", "sensitive_no_photo"],
  ],
];

/** Another network's thresholds: a fractional factor, a low minimum, one earlier season enough. */
export const otherWarningRules: WarningRules = { countFactor: 2.5, countMinimum: 3, firstRecordMinSeasons: 1 };

export const otherWarningCases: [string, SightingFacts, SightingWarning[]][] = [
  ["10 where the highest was 4: 2.5 times exactly", sighting({ earlierSeasons: 1, earlierMaxCount: 4, count: 10 }), []],
  ["11 where the highest was 4", sighting({ earlierSeasons: 1, earlierMaxCount: 4, count: 11 }), ["count_above_usual"]],
  ["3 where the highest was 1: the minimum", sighting({ earlierSeasons: 1, earlierMaxCount: 1, count: 3 }), ["count_above_usual"]],
  ["2 where the highest was 0: below the minimum", sighting({ earlierSeasons: 1, earlierMaxCount: 0, count: 2 }), []],
  ["never seen, 1 earlier season", sighting({ earlierSeasons: 1 }), ["first_on_transect"]],
  ["never seen, no earlier season", sighting({ earlierSeasons: 0 }), []],
];
