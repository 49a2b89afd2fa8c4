import { route } from "@/lib/http/route";
import { acceptSafety } from "@/lib/queries/safety";
import { safetyAcceptanceSchema } from "./schema";

// Idempotent: the first acknowledgement is kept and every resend answers it.
export const POST = route({ roles: ["volunteer"], body: safetyAcceptanceSchema }, async ({ actor, body }) => ({
  safetyAcceptedAt: (await acceptSafety(actor, body.acceptedAt)).toISOString(),
}));
