import { z } from "zod";

/** A recorder's acceptance of one version, with their own two answers (neither chosen for them). */
export const acceptanceSchema = z.object({
  version: z.number({ message: "Which version is this?" }).int().min(1),
  publishName: z.boolean({ message: "Choose how published data shows you." }),
  newsletter: z.boolean({ message: "Say whether you want the newsletter." }),
});
