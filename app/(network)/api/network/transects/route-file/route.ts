import { route } from "@/lib/http/route";
import { previewRouteFile } from "@/lib/queries/transects";
import { routeFileSchema } from "../../../../network/transects/schema";
import { WRITERS } from "../params";

/** Reads a GeoJSON or GPX route file and answers the route, sections, lengths and warnings; stores nothing. */
export const POST = route({ roles: WRITERS, body: routeFileSchema, bodyLimit: "routeFile" }, async ({ body }) => ({ preview: previewRouteFile(body) }));
