import { z } from "zod";
import { MAX_REPLY_LENGTH } from "@/lib/limits/text";
import { safeText } from "@/lib/validation/fields";

/** A volunteer's answer to a reviewer's question on one of their sightings. */
export const replySchema = z.object({
  sightingId: z.uuid({ message: "Choose the sighting you are answering about." }),
  message: safeText(MAX_REPLY_LENGTH, z.string({ message: "Write a reply." })).min(1, { message: "Write a reply." }),
});
export type ReplyInput = z.infer<typeof replySchema>;
