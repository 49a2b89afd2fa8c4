import { z } from "zod";
import { plausibleInstant } from "@/lib/validation/fields";

/** The volunteer has read the safety notice: when, by the phone's clock (it may have been offline). */
export const safetyAcceptanceSchema = z.object({
  acceptedAt: plausibleInstant("Give the time the notice was acknowledged, as an ISO 8601 timestamp."),
});
export type SafetyAcceptance = z.infer<typeof safetyAcceptanceSchema>;
