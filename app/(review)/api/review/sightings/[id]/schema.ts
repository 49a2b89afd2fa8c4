import { z } from "zod";
import { invalid } from "@/lib/errors";
import { fieldErrorsOf } from "@/lib/validation";

const params = z.object({ id: z.uuid({ message: "That is not a sighting's id." }) });

/** The path's id, or a 400 naming it (an id that is well-formed but unknown is a 404 later). */
export function sightingIdParams(raw: unknown): z.infer<typeof params> {
  const parsed = params.safeParse(raw);
  if (!parsed.success) throw invalid(fieldErrorsOf(parsed.error));
  return parsed.data;
}
