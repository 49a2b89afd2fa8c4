import "server-only";
import { randomBytes } from "node:crypto";
import { and, eq, isNotNull, isNull, sql } from "drizzle-orm";
import { db, type Transaction } from "@/db/client";
import { invitations, users } from "@/db/schema";
import { env } from "@/lib/env";
import { conflict } from "@/lib/errors";
import { hashToken, holdsRole } from "@/lib/queries/people";

/** How long the printed link works: whoever runs the set-up opens it straight away. */
export const FIRST_ORGANISER_LINK_HOURS = 24;

/**
 * An invitation must name who sent it (invitations.invited_by_id), and the network's first
 * organiser has nobody to invite them: this account stands for the set-up command. It has no
 * password (signing in needs one: auth.ts) and is inactive, so nobody can sign in as it. The
 * ".invalid" top-level domain can never receive mail (RFC 2606).
 */
export const SETUP_ACCOUNT = { email: "setup-command@turnstone.invalid", name: "Set-up command" } as const;

/**
 * Creates a one-time invitation for an organiser and returns its link. Refused when the network
 * already has an organiser who can sign in (they invite people from the app's People page),
 * unless `force`: the way back in when every organiser has lost access.
 */
export async function inviteFirstOrganiser(input: { name: string; email: string; force: boolean }) {
  const email = input.email.trim().toLowerCase();
  const token = randomBytes(32).toString("base64url");
  const expiresAt = new Date(Date.now() + FIRST_ORGANISER_LINK_HOURS * 3_600_000);
  await db().transaction(async (tx) => {
    // One set-up at a time, so two runs cannot both see no organiser.
    await tx.execute(sql`select pg_advisory_xact_lock(hashtext('turnstone:first-organiser'))`);
    const organisers = await tx
      .select({ email: users.email })
      .from(users)
      .where(and(holdsRole("organiser"), eq(users.active, true), isNotNull(users.passwordHash)));
    if (organisers.length > 0 && !input.force) {
      throw conflict(
        `The network already has an organiser (${organisers.map((o) => o.email).join(", ")}), who invites people from People in the app. Pass --force to create another one here anyway.`,
      );
    }
    const [existing] = await tx.select({ id: users.id }).from(users).where(eq(sql`lower(${users.email})`, email)).limit(1);
    if (existing) throw conflict("Someone with that e-mail is already in the network.");
    const invitedById = await setupAccountId(tx);
    // A fresh invitation replaces any earlier unanswered one for the same address.
    await tx.delete(invitations).where(and(eq(sql`lower(${invitations.email})`, email), isNull(invitations.acceptedAt)));
    await tx.insert(invitations).values({ email, name: input.name, roles: ["organiser"], tokenHash: hashToken(token), invitedById, expiresAt });
  });
  return { link: `${env().APP_URL}/invitation/${token}`, expiresAt };
}

async function setupAccountId(tx: Transaction): Promise<string> {
  await tx.insert(users).values({ ...SETUP_ACCOUNT, roles: ["organiser"], active: false, passwordHash: null }).onConflictDoNothing();
  const [row] = await tx.select({ id: users.id }).from(users).where(eq(sql`lower(${users.email})`, SETUP_ACCOUNT.email)).limit(1);
  return row!.id;
}
