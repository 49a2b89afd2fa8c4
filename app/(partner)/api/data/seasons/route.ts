import { route } from "@/lib/http/route";
import { verifiedDataBySeason } from "@/lib/queries/partner";

export const GET = route({ roles: ["partner"] }, async () => ({ seasons: await verifiedDataBySeason() }));
