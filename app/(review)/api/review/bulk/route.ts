import { REVIEWERS } from "@/lib/auth/roles";
import { route } from "@/lib/http/route";
import { bulkReview } from "@/lib/queries/review-actions";
import { bulkSchema } from "./schema";

/** Many sightings in one transaction; those changed since listed, decided, or (to confirm) warned are skipped and listed. */
export const POST = route({ roles: REVIEWERS, body: bulkSchema, bodyLimit: "reviewBulk" }, async ({ actor, body }) => bulkReview(actor, body));
