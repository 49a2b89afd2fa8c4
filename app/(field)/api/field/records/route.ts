import { route } from "@/lib/http/route";
import { myRecords } from "@/lib/queries/records";

export const GET = route({ roles: ["volunteer"] }, async ({ actor }) => ({ visits: await myRecords(actor) }));
