import { route } from "@/lib/http/route";
import { seasonGraceDays, setSeasonGraceDays } from "@/lib/queries/seasons";
import { graceDaysSchema } from "../../../../network/seasons/schema";
import { READERS, WRITERS } from "../../transects/params";

export const GET = route({ roles: READERS }, async () => ({ graceDays: await seasonGraceDays() }));

export const PUT = route({ roles: WRITERS, body: graceDaysSchema }, async ({ actor, body }) => setSeasonGraceDays(actor, body.graceDays));
