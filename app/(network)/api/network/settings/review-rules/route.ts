import { route } from "@/lib/http/route";
import { reviewRules, setReviewRules } from "@/lib/queries/review-rules";
import { WRITERS } from "../../transects/params";
import { reviewRulesSchema } from "./schema";

// Organisers only: the settings page reads and saves the rules here.
export const GET = route({ roles: WRITERS }, async () => reviewRules());

export const PUT = route({ roles: WRITERS, body: reviewRulesSchema }, async ({ actor, body }) => setReviewRules(actor, body));
