// The numbers a volunteer records and the ranges they may take: the sync contract, the phone's
// forms and the database's check constraints all read them from here. Zod-free and
// dependency-free: the phone's bundle imports it.

/** A closed range: min and max are both allowed. */
export type Range = { readonly min: number; readonly max: number };

/** Individuals of one species counted in one sighting. The cap is our choice: more is a typing slip. */
export const SIGHTING_COUNT: Range = { min: 0, max: 100_000 };

/** Sections of a transect, numbered from 1. Our choice: a walk of up to 50 stretches. */
export const SECTIONS: Range = { min: 1, max: 50 };

/** Wind on the Beaufort scale, forces 0 (calm) to 12 (hurricane force): lib/field/beaufort.ts. */
export const BEAUFORT_FORCE: Range = { min: 0, max: 12 };

/** Cloud cover in whole percent. */
export const CLOUD_COVER_PERCENT: Range = { min: 0, max: 100 };

/** Share of a walk spent in sunshine, in whole percent. */
export const SUNSHINE_PERCENT: Range = { min: 0, max: 100 };

/** Air temperature in °C: wider than any walk's weather, narrow enough to catch a slip. Our choice. */
export const TEMPERATURE_C: Range = { min: -40, max: 60 };

/** A phone's position accuracy in metres: beyond 100 km it is no position at all. Our choice. */
export const ACCURACY_METRES: Range = { min: 0, max: 100_000 };

export const inRange = (value: number, range: Range) => value >= range.min && value <= range.max;
