import "server-only";
import { z } from "zod";
import { invalid } from "@/lib/errors";
import { fieldErrorsOf } from "@/lib/validation";

const photoIdParam = z.uuid({ message: "The photo id must be a UUID." });

export const photoViewQuery = z.object({
  size: z.enum(["thumbnail", "display"], { message: "size must be thumbnail or display." }).default("display"),
});

/** Route segments are input too: a malformed id is a 400 with a field message, not a 500. */
export function parsePhotoId(raw: string | undefined): string {
  const parsed = photoIdParam.safeParse(raw);
  if (!parsed.success) throw invalid({ id: fieldErrorsOf(parsed.error)._ ?? ["The photo id must be a UUID."] });
  return parsed.data;
}
