import { z } from "zod";
import { normaliseRoles, roles } from "@/lib/auth/roles";
import { MAX_EMAIL_LENGTH, MAX_PERSON_NAME_LENGTH, MIN_PERSON_NAME_LENGTH } from "@/lib/limits/text";
import { safeText } from "@/lib/validation/fields";

/** One or more roles; repeats dropped, in the usual order. */
export const roleListSchema = z
  .array(z.enum(roles, { message: "Choose a role." }), { message: "Choose at least one role." })
  .min(1, { message: "Choose at least one role." })
  .max(roles.length)
  .transform(normaliseRoles);

export const inviteSchema = z.object({
  name: safeText(MAX_PERSON_NAME_LENGTH).pipe(z.string().min(MIN_PERSON_NAME_LENGTH, { message: "Enter the person's name." })),
  email: z.email({ message: "Enter a valid e-mail address." }).max(MAX_EMAIL_LENGTH),
  roles: roleListSchema,
});
export type InviteInput = z.input<typeof inviteSchema>;

export const personPatchSchema = z
  .object({ roles: roleListSchema.optional(), active: z.boolean().optional() })
  .refine((p) => p.roles !== undefined || p.active !== undefined, { message: "Say what to change: roles or active.", path: ["_"] });
export type PersonPatch = z.input<typeof personPatchSchema>;

const ids = z.array(z.uuid({ message: "Not a known id." })).max(500);

/** Assignments from either side: ids of people (on a transect) or of transects (for a person). */
export const assignmentsSchema = z
  .object({ add: ids.default([]), remove: ids.default([]) })
  .refine((a) => !a.add.some((id) => a.remove.includes(id)), { message: "The same one cannot be added and removed at once.", path: ["add"] });
export type AssignmentsInput = z.input<typeof assignmentsSchema>;

/** Erasure is confirmed by typing the person's pseudonym, so it is never one stray click. */
export const erasureSchema = z.object({ confirm: z.string().max(40) });
