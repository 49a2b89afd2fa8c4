import { z } from "zod";
import { skyValues } from "@/lib/sync/protocol";
import { recordDate, safeText } from "@/lib/validation/fields";

const optionalNumber = (schema: z.ZodNumber) =>
  z.preprocess((v) => (v === "" || v === null || v === undefined || Number.isNaN(v) ? null : Number(v)), schema.nullable());

/** The start-of-visit form, checked on the phone with the same limits the server applies. */
export const startVisitSchema = z.object({
  transectId: z.uuid({ message: "Choose a transect." }),
  visitDate: recordDate("Choose the date of the walk."),
  startTime: z.string().regex(/^([01]\d|2[0-3]):[0-5]\d$/, { message: "Enter the start time, like 10:30." }),
  temperatureC: optionalNumber(z.number({ message: "Temperature must be a number." }).min(-40, { message: "That is colder than -40 °C." }).max(60, { message: "That is hotter than 60 °C." })),
  windBeaufort: optionalNumber(z.number().int().min(0).max(12, { message: "Beaufort force runs from 0 to 12." })),
  cloudCoverPercent: optionalNumber(z.number().int().min(0, { message: "Cloud cover is 0-100%." }).max(100, { message: "Cloud cover is 0-100%." })),
  sky: z.preprocess((v) => (v === "" ? null : v), z.enum(skyValues).nullable()),
  coRecorders: z.preprocess((v) => (typeof v === "string" && v.trim() === "" ? null : v), safeText(200).nullable()),
});
export type StartVisitInput = z.input<typeof startVisitSchema>;
export type StartVisitValues = z.output<typeof startVisitSchema>;

export const skyLabel: Record<(typeof skyValues)[number], string> = {
  clear: "Clear, full sun",
  mostly_sunny: "Mostly sunny",
  broken_cloud: "Sun and cloud",
  mostly_cloudy: "Mostly cloudy",
  overcast: "Overcast",
};

export { timeNow, todayLocal } from "./clock";
