import { route } from "@/lib/http/route";
import { listChecklist } from "@/lib/queries/checklist";
import { CHECKLIST_READERS } from "../../../network/checklist/schema";

/** The whole checklist with tags, synonyms, aggregates and sighting counts. */
export const GET = route({ roles: CHECKLIST_READERS }, async () => ({ entries: await listChecklist() }));
