import { REVIEWERS } from "@/lib/auth/roles";
import { route } from "@/lib/http/route";
import { createPaperWalk } from "@/lib/queries/paper-walks";
import { paperWalkSchema } from "../../../review/paper-walks/schema";

/** A walk recorded on paper, entered by a reviewer or organiser for the volunteer. */
export const POST = route({ roles: REVIEWERS, body: paperWalkSchema }, async ({ actor, body }) => ({ created: await createPaperWalk(actor, body) }));
