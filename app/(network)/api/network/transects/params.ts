import "server-only";
import { z } from "zod";
import { invalid } from "@/lib/errors";

const idParam = z.uuid({ message: "The id must be a UUID." });

/** Route segments are input too: a malformed id is a 400 with a field message, not a 500. */
export function parseId(raw: string | undefined): string {
  const parsed = idParam.safeParse(raw);
  if (!parsed.success) throw invalid({ id: ["The id must be a UUID."] });
  return parsed.data;
}

/** Reviewers (coordinators) read transects and habitat groups; only organisers change them. */
export const READERS = ["organiser", "coordinator"] as const;
export const WRITERS = ["organiser"] as const;
