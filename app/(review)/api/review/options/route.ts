import { REVIEWERS } from "@/lib/auth/roles";
import { route } from "@/lib/http/route";
import { queueOptions } from "@/lib/queries/review-detail";

/** What the queue's filters offer: seasons, transects, habitat groups and the people who walked. */
export const GET = route({ roles: REVIEWERS }, async () => queueOptions());
