import { z } from "zod";
import { REVIEWERS } from "@/lib/auth/roles";
import { route } from "@/lib/http/route";
import { reviewQueue } from "@/lib/queries/review";

const query = z.object({ limit: z.coerce.number().int().min(1).max(500).default(50) });

export const GET = route({ roles: REVIEWERS, query }, async ({ query }) => ({ records: await reviewQueue(query.limit) }));
