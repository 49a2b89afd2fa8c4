import { z } from "zod";
import { REVIEWERS } from "@/lib/auth/roles";
import { route } from "@/lib/http/route";
import { speciesChoices } from "@/lib/queries/review-detail";

const query = z.object({ q: z.string().trim().max(100, { message: "At most 100 characters." }).default("") });

/** Checklist entries to correct a sighting to, aggregates with their members. */
export const GET = route({ roles: REVIEWERS, query }, async ({ query }) => ({ species: await speciesChoices(query.q) }));
