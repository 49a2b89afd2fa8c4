import { z } from "zod";
import { RECORD_LICENCES } from "@/lib/agreement/licences";
import { safeText } from "@/lib/validation/fields";

/** The agreement's text: long enough for a page of terms, short enough to read on a phone. Our choice. */
export const MAX_AGREEMENT_LENGTH = 20_000;

export const agreementSchema = z.object({
  body: safeText(MAX_AGREEMENT_LENGTH).pipe(z.string().trim().min(20, { message: "Write the agreement: how the network uses sightings (at least 20 characters)." })),
  licence: z.enum(RECORD_LICENCES, { message: "Choose the licence sightings are published under." }),
});
export type AgreementInput = z.input<typeof agreementSchema>;
export type AgreementValues = z.output<typeof agreementSchema>;
