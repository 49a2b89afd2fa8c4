import type { z } from "zod";
import type { FieldErrors } from "@/lib/errors";

/** Flattens zod issues into { "field.path": ["message"] } for forms and JSON answers. */
export function fieldErrorsOf(error: z.ZodError): FieldErrors {
  const out: FieldErrors = {};
  for (const issue of error.issues) {
    const key = issue.path.length ? issue.path.join(".") : "_";
    (out[key] ??= []).push(issue.message);
  }
  return out;
}
