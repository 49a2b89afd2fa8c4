import "server-only";
import { eq, sql } from "drizzle-orm";
import { db } from "@/db/client";
import { users } from "@/db/schema";
import type { Actor } from "@/lib/auth/guard";

// A volunteer's acknowledgement of the fieldwork safety notice belongs to them, not to a phone:
// kept in users.accepted_safety_at, so a second volunteer on a shared phone is still shown it.

/** When this volunteer acknowledged the safety notice, or null if they have not. */
export async function safetyAcceptedAt(actor: Actor): Promise<Date | null> {
  const [row] = await db().select({ at: users.acceptedSafetyAt }).from(users).where(eq(users.id, actor.id));
  return row?.at ?? null;
}

/**
 * Records the acknowledgement made on the phone at `acceptedAt` (sent later when it had no
 * signal). The first one is kept, so resends change nothing; a phone clock running ahead of the
 * server's is taken as the server's now. Returns the stored time.
 */
export async function acceptSafety(actor: Actor, acceptedAt: string): Promise<Date> {
  const [row] = await db()
    .update(users)
    .set({ acceptedSafetyAt: sql`coalesce(${users.acceptedSafetyAt}, least(${acceptedAt}::timestamptz, now()))` })
    .where(eq(users.id, actor.id))
    .returning({ at: users.acceptedSafetyAt });
  return row!.at!;
}
