import { NextResponse } from "next/server";
import { route } from "@/lib/http/route";
import { createSeason, seasonsOverview } from "@/lib/queries/seasons";
import { seasonSchema } from "../../../network/seasons/schema";
import { READERS, WRITERS } from "../transects/params";

/** Every season with its phase and walks, and the grace days after closing. */
export const GET = route({ roles: READERS }, async () => seasonsOverview());

export const POST = route({ roles: WRITERS, body: seasonSchema }, async ({ actor, body }) =>
  NextResponse.json({ season: await createSeason(actor, body) }, { status: 201 }),
);
