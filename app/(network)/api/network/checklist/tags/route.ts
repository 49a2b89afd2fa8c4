import { NextResponse } from "next/server";
import { REVIEWERS } from "@/lib/auth/roles";
import { route } from "@/lib/http/route";
import { createTag, listTags } from "@/lib/queries/checklist-tags";
import { tagSchema } from "../../../../network/checklist/schema";

export const GET = route({ roles: REVIEWERS }, async () => ({ tags: await listTags() }));

export const POST = route({ roles: ["organiser"], body: tagSchema }, async ({ actor, body }) => NextResponse.json({ tag: await createTag(actor, body) }, { status: 201 }));
