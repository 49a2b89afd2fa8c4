import { NextResponse } from "next/server";
import { route } from "@/lib/http/route";
import { createTransect, listTransects } from "@/lib/queries/transects";
import { createTransectSchema } from "../../../network/transects/schema";
import { READERS, WRITERS } from "./params";

export const GET = route({ roles: READERS }, async ({ actor }) => listTransects(actor));

// The route may come as a GeoJSON or GPX file's text: the route-file body cap.
export const POST = route({ roles: WRITERS, body: createTransectSchema, bodyLimit: "routeFile" }, async ({ actor, body }) =>
  NextResponse.json({ transect: await createTransect(actor, body) }, { status: 201 }),
);
