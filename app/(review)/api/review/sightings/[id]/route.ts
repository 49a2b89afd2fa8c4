import { REVIEWERS } from "@/lib/auth/roles";
import { route } from "@/lib/http/route";
import { sightingDetail } from "@/lib/queries/review-detail";
import { sightingIdParams } from "./schema";

/** Everything a reviewer needs beside the queue about one sighting (lib/review/contract.ts SightingDetail). */
export const GET = route<undefined, undefined, { id: string }>({ roles: REVIEWERS }, async ({ params }) => sightingDetail(sightingIdParams(params).id));
