import { REVIEWERS } from "@/lib/auth/roles";
import { route } from "@/lib/http/route";
import { reviewQueuePage } from "@/lib/queries/review-queue";
import { queueQuerySchema } from "@/lib/review/queue-filter";

/** One page of the review queue: the filters, sorting and paging of lib/review/queue-filter.ts. */
export const GET = route({ roles: REVIEWERS, query: queueQuerySchema }, async ({ query }) => reviewQueuePage(query));
