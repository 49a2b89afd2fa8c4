import { z } from "zod";
import { BEAUFORT_FORCE, CLOUD_COVER_PERCENT, SECTIONS, SIGHTING_COUNT, SUNSHINE_PERCENT, TEMPERATURE_C } from "@/lib/limits/counts";
import { MAX_VISIT_NOTES_LENGTH } from "@/lib/limits/text";
import { rainValues, skyValues } from "@/lib/sync/protocol";
import { recordDate, safeText } from "@/lib/validation/fields";

// A walk a reviewer or organiser types in for a volunteer who recorded on paper: the form
// (react-hook-form) and POST /api/review/paper-walks check it with this same schema.

/** Our choice: a paper walk sheet with more lines than this is more than one walk. */
export const MAX_PAPER_SIGHTINGS = 300;

const blankToNull = (v: unknown) => (v === "" || v === null || v === undefined || (typeof v === "number" && Number.isNaN(v)) ? null : v);
const optionalNumber = (schema: z.ZodNumber) => z.preprocess((v) => { const b = blankToNull(v); return b === null ? null : Number(b); }, schema.nullable());
const clock = /^([01]\d|2[0-3]):[0-5]\d$/;
const beaufort = `Beaufort force runs from ${BEAUFORT_FORCE.min} to ${BEAUFORT_FORCE.max}.`;
const cloud = `Cloud cover is ${CLOUD_COVER_PERCENT.min}-${CLOUD_COVER_PERCENT.max}%.`;
const sunshine = `Sunshine is a whole number from ${SUNSHINE_PERCENT.min} to ${SUNSHINE_PERCENT.max}% of the walk.`;
const countMessage = `A whole number from ${SIGHTING_COUNT.min} to ${SIGHTING_COUNT.max}.`;
const sectionMessage = `A section number from ${SECTIONS.min} to ${SECTIONS.max}.`;

export const paperSightingSchema = z.object({
  speciesId: z.uuid({ message: "Choose a species from the checklist." }),
  count: z.preprocess((v) => (blankToNull(v) === null ? undefined : Number(v)), z.number({ message: countMessage }).int({ message: countMessage }).min(SIGHTING_COUNT.min, { message: countMessage }).max(SIGHTING_COUNT.max, { message: countMessage })),
  section: optionalNumber(z.number({ message: sectionMessage }).int({ message: sectionMessage }).min(SECTIONS.min, { message: sectionMessage }).max(SECTIONS.max, { message: sectionMessage })),
});

export const paperWalkSchema = z
  .object({
    volunteerId: z.uuid({ message: "Choose the volunteer who walked it." }),
    transectId: z.uuid({ message: "Choose the transect." }),
    visitDate: recordDate("Enter the date of the walk."),
    startTime: z.string({ message: "Enter the start time, like 10:30." }).regex(clock, { message: "Enter the start time, like 10:30." }),
    endTime: z.preprocess(blankToNull, z.string().regex(clock, { message: "Enter the end time, like 11:45." }).nullable()),
    temperatureC: optionalNumber(z.number({ message: "Temperature must be a number." }).min(TEMPERATURE_C.min, { message: `That is colder than ${TEMPERATURE_C.min} °C.` }).max(TEMPERATURE_C.max, { message: `That is hotter than ${TEMPERATURE_C.max} °C.` })),
    windBeaufort: optionalNumber(z.number({ message: beaufort }).int({ message: beaufort }).min(BEAUFORT_FORCE.min, { message: beaufort }).max(BEAUFORT_FORCE.max, { message: beaufort })),
    cloudCoverPercent: optionalNumber(z.number({ message: cloud }).int({ message: cloud }).min(CLOUD_COVER_PERCENT.min, { message: cloud }).max(CLOUD_COVER_PERCENT.max, { message: cloud })),
    sky: z.preprocess(blankToNull, z.enum(skyValues, { message: "Choose the sky from the list." }).nullable()),
    // Optional, as on the phone: a sheet without them is judged on the other conditions.
    sunshinePercent: optionalNumber(z.number({ message: sunshine }).int({ message: sunshine }).min(SUNSHINE_PERCENT.min, { message: sunshine }).max(SUNSHINE_PERCENT.max, { message: sunshine })),
    rain: z.preprocess(blankToNull, z.enum(rainValues, { message: "Choose no rain, light or heavy." }).nullable()),
    // No default: whether every species seen was written down is never guessed (absences depend on it).
    completeList: z.enum(["yes", "no"], { message: "Say whether every species seen was written down." }),
    notes: z.preprocess(blankToNull, safeText(MAX_VISIT_NOTES_LENGTH).nullable()),
    sightings: z.array(paperSightingSchema).max(MAX_PAPER_SIGHTINGS, { message: `At most ${MAX_PAPER_SIGHTINGS} sightings on one walk.` }),
  })
  .refine((v) => !v.endTime || v.endTime >= v.startTime, { message: "The walk cannot end before it starts.", path: ["endTime"] });

export type PaperWalkInput = z.input<typeof paperWalkSchema>;
export type PaperWalkValues = z.output<typeof paperWalkSchema>;
