import { NextResponse } from "next/server";
import { route } from "@/lib/http/route";
import { changeRoute } from "@/lib/queries/transects";
import { routeChangeSchema } from "../../../../../network/transects/schema";
import { parseId, WRITERS } from "../../params";

/** A new route version from a date (or a correction of the latest, on its own date). */
export const POST = route<typeof routeChangeSchema, undefined, { id: string }>(
  { roles: WRITERS, body: routeChangeSchema, bodyLimit: "routeFile" },
  async ({ actor, body, params }) => {
    const result = await changeRoute(actor, parseId(params.id), body);
    return NextResponse.json({ version: result }, { status: result.unchanged ? 200 : 201 });
  },
);
