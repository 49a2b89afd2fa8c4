import { z } from "zod";
import { MAX_RETURN_PATH_LENGTH } from "@/lib/auth/return-path";
import { MAX_EMAIL_LENGTH, MAX_PASSWORD_LENGTH } from "@/lib/limits/text";

export const signInSchema = z.object({
  email: z.email({ message: "Enter the e-mail address you were invited with." }).max(MAX_EMAIL_LENGTH),
  password: z.string().min(1, { message: "Enter your password." }).max(MAX_PASSWORD_LENGTH),
  // Checked by safeReturnPath; an unusable one is dropped (the role's home), never an error to show.
  from: z.string().max(MAX_RETURN_PATH_LENGTH).optional().catch(undefined),
});

export type SignInInput = z.infer<typeof signInSchema>;
