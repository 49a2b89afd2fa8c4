import { z } from "zod";

export const signInSchema = z.object({
  email: z.email({ message: "Enter the e-mail address you were invited with." }).max(320),
  password: z.string().min(1, { message: "Enter your password." }).max(200),
  from: z.string().optional(),
});

export type SignInInput = z.infer<typeof signInSchema>;
