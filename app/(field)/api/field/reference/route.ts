import { NextResponse } from "next/server";
import { route } from "@/lib/http/route";
import { fieldReference } from "@/lib/queries/field-reference";

export const GET = route({ roles: ["volunteer"] }, async ({ actor }) =>
  NextResponse.json(await fieldReference(actor), { headers: { "Cache-Control": "private, no-cache" } }),
);
