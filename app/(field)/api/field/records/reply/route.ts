import { NextResponse } from "next/server";
import { route } from "@/lib/http/route";
import { replyToQuestion } from "@/lib/queries/records";
import { replySchema } from "./schema";

export const POST = route({ roles: ["volunteer"], body: replySchema }, async ({ actor, body }) =>
  NextResponse.json(await replyToQuestion(actor, body), { status: 201 }),
);
