import { z } from "zod";
import { roles } from "@/lib/auth/roles";

export const inviteSchema = z.object({
  name: z.string().trim().min(2, { message: "Enter the person's name." }).max(120),
  email: z.email({ message: "Enter a valid e-mail address." }).max(320),
  role: z.enum(roles, { message: "Choose a role." }),
});
export type InviteInput = z.infer<typeof inviteSchema>;

export const updatePersonSchema = z.object({
  userId: z.uuid(),
  role: z.enum(roles, { message: "Choose a role." }),
  active: z.boolean(),
});
