import { z } from "zod";
import { BEAUFORT_FORCE, CLOUD_COVER_PERCENT, SUNSHINE_PERCENT, TEMPERATURE_C } from "@/lib/limits/counts";
import { MAX_CO_RECORDERS_LENGTH } from "@/lib/limits/text";
import { rainValues, skyValues } from "@/lib/sync/protocol";
import { recordDate, safeText } from "@/lib/validation/fields";

const optionalNumber = (schema: z.ZodNumber) =>
  z.preprocess((v) => (v === "" || v === null || v === undefined || Number.isNaN(v) ? null : Number(v)), schema.nullable());

const beaufort = `Beaufort force runs from ${BEAUFORT_FORCE.min} to ${BEAUFORT_FORCE.max}.`;
const cloud = `Cloud cover is ${CLOUD_COVER_PERCENT.min}-${CLOUD_COVER_PERCENT.max}%.`;
const sunshine = `Sunshine is a whole number from ${SUNSHINE_PERCENT.min} to ${SUNSHINE_PERCENT.max}% of the walk.`;

/**
 * The start-of-walk form, checked on the phone with the server's limits (lib/limits). Sunshine
 * and rain are optional, like the other conditions: a walk without them is judged on the rest.
 */
export const startVisitSchema = z.object({
  transectId: z.uuid({ message: "Choose a transect." }),
  visitDate: recordDate("Choose the date of the walk."),
  startTime: z.string().regex(/^([01]\d|2[0-3]):[0-5]\d$/, { message: "Enter the start time, like 10:30." }),
  temperatureC: optionalNumber(
    z.number({ message: "Temperature must be a number." })
      .min(TEMPERATURE_C.min, { message: `That is colder than ${TEMPERATURE_C.min} °C.` })
      .max(TEMPERATURE_C.max, { message: `That is hotter than ${TEMPERATURE_C.max} °C.` }),
  ),
  windBeaufort: optionalNumber(z.number().int().min(BEAUFORT_FORCE.min).max(BEAUFORT_FORCE.max, { message: beaufort })),
  cloudCoverPercent: optionalNumber(z.number().int().min(CLOUD_COVER_PERCENT.min, { message: cloud }).max(CLOUD_COVER_PERCENT.max, { message: cloud })),
  sky: z.preprocess((v) => (v === "" ? null : v), z.enum(skyValues).nullable()),
  sunshinePercent: optionalNumber(z.number({ message: sunshine }).int({ message: sunshine }).min(SUNSHINE_PERCENT.min, { message: sunshine }).max(SUNSHINE_PERCENT.max, { message: sunshine })),
  rain: z.preprocess((v) => (v === "" || v === undefined ? null : v), z.enum(rainValues, { message: "Choose no rain, light or heavy." }).nullable()),
  coRecorders: z.preprocess((v) => (typeof v === "string" && v.trim() === "" ? null : v), safeText(MAX_CO_RECORDERS_LENGTH).nullable()),
});
export type StartVisitInput = z.input<typeof startVisitSchema>;
export type StartVisitValues = z.output<typeof startVisitSchema>;

export { rainLabel, skyLabel } from "./weather-words";
export { timeNow, todayLocal } from "./clock";
