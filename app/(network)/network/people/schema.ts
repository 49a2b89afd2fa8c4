import { z } from "zod";
import { roles } from "@/lib/auth/roles";
import { safeText } from "@/lib/validation/fields";

export const inviteSchema = z.object({
  name: safeText(120).pipe(z.string().min(2, { message: "Enter the person's name." })),
  email: z.email({ message: "Enter a valid e-mail address." }).max(320),
  role: z.enum(roles, { message: "Choose a role." }),
});
export type InviteInput = z.infer<typeof inviteSchema>;

export const updatePersonSchema = z.object({
  userId: z.uuid(),
  role: z.enum(roles, { message: "Choose a role." }),
  active: z.boolean(),
});
