import { z } from "zod";
import { SEASON_GRACE_DAYS } from "@/lib/limits/seasons";
import { safeText } from "@/lib/validation/fields";

// One schema each for the organiser's season forms and the route handlers behind them.

const day = z.iso.date({ message: "Use a date like 2027-04-01." });
const name = safeText(60).pipe(z.string().min(2, { message: "Enter a name of at least 2 characters, e.g. 2027 season." }));
const walks = (what: string) =>
  z.number({ message: `${what} is a whole number.` }).int({ message: `${what} is a whole number.` }).min(1, { message: `${what} is at least 1.` }).max(100, { message: `${what} is at most 100.` });
const targetVisits = walks("Target walks per transect");
const minVisits = walks("Minimum walks to compare");

const ordered = (v: { startsOn?: string; endsOn?: string }) => !v.startsOn || !v.endsOn || v.endsOn >= v.startsOn;
const orderMessage = { message: "The season cannot end before it starts.", path: ["endsOn"] };
const minWithinTarget = (v: { targetVisits?: number; minVisits?: number }) => v.targetVisits === undefined || v.minVisits === undefined || v.minVisits <= v.targetVisits;
const minMessage = { message: "The minimum cannot be more than the target.", path: ["minVisits"] };

export const seasonSchema = z
  .object({ name, startsOn: day, endsOn: day, targetVisits, minVisits })
  .refine(ordered, orderMessage)
  .refine(minWithinTarget, minMessage);
export type SeasonInput = z.input<typeof seasonSchema>;
export type SeasonValues = z.output<typeof seasonSchema>;

export const seasonPatchSchema = z
  .object({ name, startsOn: day, endsOn: day, targetVisits, minVisits })
  .partial()
  .refine((v) => Object.values(v).some((x) => x !== undefined), { message: "Change at least one field." })
  .refine(ordered, orderMessage);
export type SeasonPatch = z.output<typeof seasonPatchSchema>;

export const graceDaysSchema = z.object({
  graceDays: z
    .number({ message: "Enter a number of days." })
    .int({ message: "Enter a whole number of days." })
    .min(SEASON_GRACE_DAYS.min, { message: `At least ${SEASON_GRACE_DAYS.min} days.` })
    .max(SEASON_GRACE_DAYS.max, { message: `At most ${SEASON_GRACE_DAYS.max} days.` }),
});
export type GraceDaysInput = z.input<typeof graceDaysSchema>;
export type GraceDaysValues = z.output<typeof graceDaysSchema>;
