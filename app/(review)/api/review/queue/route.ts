import { z } from "zod";
import { REVIEWERS } from "@/lib/auth/roles";
import { route } from "@/lib/http/route";
import { reviewQueuePage } from "@/lib/queries/review-queue";

// The first review API, kept for the scripts that read it: the newest waiting sightings as
// `records`. The queue's full API is GET /api/review/sightings.
const query = z.object({ limit: z.coerce.number().int().min(1).max(100).default(50) });

export const GET = route({ roles: REVIEWERS, query }, async ({ query }) => {
  const page = await reviewQueuePage({ status: "waiting", sort: "date", dir: "desc", page: 1, pageSize: query.limit });
  return { records: page.rows };
});
