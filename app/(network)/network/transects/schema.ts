import { z } from "zod";
import { MAX_ROUTE_POINTS, MAX_SECTION_HABITAT, MAX_SECTIONS } from "@/lib/geo/limits";
import { recordDate, safeText } from "@/lib/validation/fields";

// One set of schemas for the organiser's transect forms and the route handlers behind them.
// Positions are [longitude, latitude] (RFC 7946 §3.1.1); lengths are never sent, the server
// measures them (lib/geo).

const position = z.tuple(
  [
    z.number({ message: "Longitude must be a number." }).min(-180, { message: "Longitude must be between −180 and 180." }).max(180, { message: "Longitude must be between −180 and 180." }),
    z.number({ message: "Latitude must be a number." }).min(-90, { message: "Latitude must be between −90 and 90." }).max(90, { message: "Latitude must be between −90 and 90." }),
  ],
  { message: "A position is [longitude, latitude]." },
);

export const sectionDraftSchema = z.object({
  coordinates: z
    .array(position, { message: "A section's coordinates are a list of positions." })
    .min(2, { message: "A section needs at least two points." })
    .max(MAX_ROUTE_POINTS, { message: `At most ${MAX_ROUTE_POINTS.toLocaleString("en-GB")} points.` }),
  habitat: safeText(MAX_SECTION_HABITAT).nullish(),
});

export const routeFileSchema = z.object({
  fileName: safeText(255).pipe(z.string().min(1, { message: "Choose a file." })),
  text: z.string({ message: "The file's text is missing." }),
});
export type RouteFileInput = z.infer<typeof routeFileSchema>;

/** A route as sections (drawn or edited on the map) or as a GeoJSON/GPX file read by the server. */
export const routeInputSchema = z
  .object({
    sections: z.array(sectionDraftSchema).min(1, { message: "Draw the route or import a file." }).max(MAX_SECTIONS, { message: `At most ${MAX_SECTIONS} sections.` }).optional(),
    file: routeFileSchema.optional(),
  })
  .refine((r) => (r.sections === undefined) !== (r.file === undefined), { message: "Give the route either as sections or as a file." });
export type RouteInput = z.infer<typeof routeInputSchema>;

const code = safeText(20)
  .transform((v) => v.toUpperCase())
  .pipe(z.string().regex(/^[A-Z0-9][A-Z0-9-]{1,19}$/, { message: "2 to 20 letters, digits or hyphens, e.g. CHK-07." }));

const details = {
  code,
  name: safeText(120).pipe(z.string().min(2, { message: "Enter a name of at least 2 characters." })),
  habitatGroupId: z.uuid({ message: "Choose a habitat group." }),
  sensitive: z.boolean({ message: "Say whether the route is sensitive." }),
  coastal: z.boolean({ message: "Say whether the route is coastal." }),
};
const accessNotes = safeText(1000)
  .nullable()
  .transform((v) => v || null);

export const createTransectSchema = z.object({ ...details, accessNotes: accessNotes.optional().transform((v) => v ?? null), route: routeInputSchema });
export type CreateTransectInput = z.input<typeof createTransectSchema>;
export type CreateTransectValues = z.output<typeof createTransectSchema>;

export const transectPatchSchema = z
  .object({ ...details, accessNotes })
  .partial()
  .refine((v) => Object.values(v).some((x) => x !== undefined), { message: "Change at least one field." });
export type TransectPatch = z.output<typeof transectPatchSchema>;

export const routeChangeSchema = z.object({
  route: routeInputSchema,
  validFrom: recordDate("Choose the first day the new route is walked (YYYY-MM-DD)."),
});
export type RouteChangeValues = z.output<typeof routeChangeSchema>;
