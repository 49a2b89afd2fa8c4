import { z } from "zod";

/** A volunteer's answer to a coordinator's question on one of their sightings. */
export const replySchema = z.object({
  sightingId: z.uuid({ message: "Choose the sighting you are answering about." }),
  message: z
    .string({ message: "Write a reply." })
    .trim()
    .min(1, { message: "Write a reply." })
    .max(1000, { message: "At most 1000 characters." }),
});
export type ReplyInput = z.infer<typeof replySchema>;
