import { z } from "zod";
import { MAX_INVITATION_TOKEN_LENGTH, MAX_PASSWORD_LENGTH, MIN_INVITATION_TOKEN_LENGTH, MIN_PASSWORD_LENGTH } from "@/lib/limits/text";

export const acceptSchema = z
  .object({
    token: z.string().min(MIN_INVITATION_TOKEN_LENGTH).max(MAX_INVITATION_TOKEN_LENGTH),
    password: z.string().min(MIN_PASSWORD_LENGTH, { message: `Use at least ${MIN_PASSWORD_LENGTH} characters.` }).max(MAX_PASSWORD_LENGTH),
    confirm: z.string(),
  })
  .refine((v) => v.password === v.confirm, { message: "The two passwords differ.", path: ["confirm"] });
export type AcceptInput = z.infer<typeof acceptSchema>;
