import { NextResponse } from "next/server";
import { route } from "@/lib/http/route";
import { createHabitatGroup, listHabitatGroups } from "@/lib/queries/habitat-groups";
import { habitatGroupSchema } from "../../../network/habitats/schema";
import { READERS, WRITERS } from "../transects/params";

export const GET = route({ roles: READERS }, async () => ({ habitatGroups: await listHabitatGroups() }));

export const POST = route({ roles: WRITERS, body: habitatGroupSchema }, async ({ actor, body }) =>
  NextResponse.json({ habitatGroup: await createHabitatGroup(actor, body) }, { status: 201 }),
);
