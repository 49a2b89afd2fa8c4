import { z } from "zod";
import { habitatColourKeys } from "@/lib/geo/palette";
import { safeText } from "@/lib/validation/fields";

// One schema for the organiser's habitat group form and the route handlers behind it.

const code = safeText(12)
  .transform((v) => v.toUpperCase())
  .pipe(z.string().regex(/^[A-Z0-9][A-Z0-9-]{1,11}$/, { message: "2 to 12 letters, digits or hyphens, e.g. CHK." }));
const name = safeText(80).pipe(z.string().min(2, { message: "Enter a name of at least 2 characters." }));
const description = safeText(500).transform((v) => v || null);
const colour = z.enum(habitatColourKeys, { message: "Choose one of the palette's colours." });

export const habitatGroupSchema = z.object({ code, name, colour, description: description.nullish().transform((v) => v ?? null) });
export type HabitatGroupInput = z.input<typeof habitatGroupSchema>;
export type HabitatGroupValues = z.output<typeof habitatGroupSchema>;

export const habitatGroupPatchSchema = z
  .object({ code, name, colour, description: description.nullable() })
  .partial()
  .refine((v) => Object.values(v).some((x) => x !== undefined), { message: "Change at least one field." });
export type HabitatGroupPatch = z.output<typeof habitatGroupPatchSchema>;
