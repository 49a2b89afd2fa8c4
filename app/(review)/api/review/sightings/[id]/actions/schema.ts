import { z } from "zod";
import { SIGHTING_COUNT } from "@/lib/limits/counts";
import { rejectReasonSchema, reviewMessageSchema } from "@/lib/review/reasons";

const revision = z.number({ error: "Send the revision the sighting was shown at." }).int().min(1);
const note = reviewMessageSchema.optional();

/** One review action on one sighting (lib/review/contract.ts ReviewActionInput). */
export const reviewActionSchema = z.discriminatedUnion(
  "action",
  [
    z.object({ action: z.literal("accept"), revision, message: note }),
    z.object({ action: z.literal("query"), revision, message: reviewMessageSchema.pipe(z.string().min(1, { message: "Write the question for the volunteer." })) }),
    z.object({ action: z.literal("reject"), revision, reason: rejectReasonSchema, message: note }),
    z
      .object({
        action: z.literal("edit"),
        revision,
        speciesId: z.uuid({ message: "Choose a species from the checklist." }).optional(),
        count: z.number({ error: "Enter a whole number." }).int({ message: "Enter a whole number." }).min(SIGHTING_COUNT.min).max(SIGHTING_COUNT.max).optional(),
        message: note,
      })
      .refine((e) => e.speciesId !== undefined || e.count !== undefined, { path: ["speciesId"], message: "Choose another species or another count." }),
    z.object({ action: z.literal("reopen"), revision, message: note }),
  ],
  { error: "Choose an action: accept, query, reject, edit or reopen." },
);
