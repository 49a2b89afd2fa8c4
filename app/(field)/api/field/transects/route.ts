import { route } from "@/lib/http/route";
import { assignedTransects } from "@/lib/queries/field";

export const GET = route({ roles: ["volunteer"] }, async ({ actor }) => assignedTransects(actor));
