import { NextResponse } from "next/server";
import { route } from "@/lib/http/route";
import { createTag, listTags } from "@/lib/queries/checklist-tags";
import { CHECKLIST_READERS, CHECKLIST_WRITERS, tagSchema } from "../../../../network/checklist/schema";

export const GET = route({ roles: CHECKLIST_READERS }, async () => ({ tags: await listTags() }));

export const POST = route({ roles: CHECKLIST_WRITERS, body: tagSchema }, async ({ actor, body }) => NextResponse.json({ tag: await createTag(actor, body) }, { status: 201 }));
