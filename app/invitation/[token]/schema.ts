import { z } from "zod";

export const acceptSchema = z
  .object({
    token: z.string().min(20).max(200),
    password: z.string().min(10, { message: "Use at least 10 characters." }).max(200),
    confirm: z.string(),
  })
  .refine((v) => v.password === v.confirm, { message: "The two passwords differ.", path: ["confirm"] });
export type AcceptInput = z.infer<typeof acceptSchema>;
