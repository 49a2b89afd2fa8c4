import { NextResponse } from "next/server";
import { REVIEWERS } from "@/lib/auth/roles";
import { route } from "@/lib/http/route";
import { reviewAction } from "@/lib/queries/review-actions";
import { sightingIdParams } from "../schema";
import { reviewActionSchema } from "./schema";

/**
 * Confirm, ask, set aside, correct or reopen one sighting. 409 with who changed it (and the row as
 * it now stands) when it changed since the revision sent; 404 for an unknown sighting.
 */
export const POST = route<typeof reviewActionSchema, undefined, { id: string }>({ roles: REVIEWERS, body: reviewActionSchema }, async ({ actor, body, params }) => {
  const outcome = await reviewAction(actor, sightingIdParams(params).id, body);
  return outcome.ok ? outcome.result : NextResponse.json(outcome.conflict, { status: 409 });
});
