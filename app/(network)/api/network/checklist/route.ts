import { REVIEWERS } from "@/lib/auth/roles";
import { route } from "@/lib/http/route";
import { listChecklist } from "@/lib/queries/checklist";

/** The whole checklist with tags, synonyms, aggregates and sighting counts. */
export const GET = route({ roles: REVIEWERS }, async () => ({ entries: await listChecklist() }));
