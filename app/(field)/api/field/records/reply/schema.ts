import { z } from "zod";
import { safeText } from "@/lib/validation/fields";

/** A volunteer's answer to a coordinator's question on one of their sightings. */
export const replySchema = z.object({
  sightingId: z.uuid({ message: "Choose the sighting you are answering about." }),
  message: safeText(1000, z.string({ message: "Write a reply." })).min(1, { message: "Write a reply." }),
});
export type ReplyInput = z.infer<typeof replySchema>;
