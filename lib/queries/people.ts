import "server-only";
import { createHash, randomBytes } from "node:crypto";
import { and, asc, eq, gt, isNull, ne, sql } from "drizzle-orm";
import { db } from "@/db/client";
import { invitations, users, type Role } from "@/db/schema";
import type { Actor } from "@/lib/auth/guard";
import { limitTokenCheck } from "@/lib/auth/invitation-limit";
import { hashPassword } from "@/lib/auth/password";
import { roleLabel } from "@/lib/auth/roles";
import { env } from "@/lib/env";
import { conflict, invalid, notFound } from "@/lib/errors";
import { enqueueEmails } from "@/lib/mail/queue";

const INVITATION_DAYS = 14;

export function hashToken(token: string): string {
  return createHash("sha256").update(token).digest("hex");
}

export function listPeople() {
  return db()
    .select({ id: users.id, name: users.name, email: users.email, role: users.role, active: users.active, lastSignInAt: users.lastSignInAt })
    .from(users)
    .orderBy(asc(users.role), asc(users.name));
}

export function pendingInvitations() {
  return db()
    .select({ id: invitations.id, name: invitations.name, email: invitations.email, role: invitations.role, expiresAt: invitations.expiresAt })
    .from(invitations)
    .where(and(isNull(invitations.acceptedAt), gt(invitations.expiresAt, new Date())))
    .orderBy(asc(invitations.createdAt));
}

/**
 * Creates an invitation and queues its e-mail in one transaction. Returns the invitation's id and
 * its token: the token travels in the e-mail's link and in this return value, and only its hash
 * is stored.
 */
export async function invitePerson(actor: Actor, input: { name: string; email: string; role: Role }) {
  const email = input.email.trim().toLowerCase();
  const token = randomBytes(32).toString("base64url");
  return db().transaction(async (tx) => {
    const [existing] = await tx.select({ id: users.id }).from(users).where(eq(sql`lower(${users.email})`, email)).limit(1);
    if (existing) throw conflict("Someone with that e-mail is already in the network.");
    // A fresh invitation replaces any earlier unanswered one for the same address.
    await tx.delete(invitations).where(and(eq(sql`lower(${invitations.email})`, email), isNull(invitations.acceptedAt)));
    const [row] = await tx
      .insert(invitations)
      .values({ email, name: input.name, role: input.role, tokenHash: hashToken(token), invitedById: actor.id, expiresAt: new Date(Date.now() + INVITATION_DAYS * 86_400_000) })
      .returning({ id: invitations.id });
    const link = `${env().APP_URL}/invitation/${token}`;
    await enqueueEmails(tx, [
      {
        to: email,
        subject: "You are invited to record with Turnstone",
        text: `Hello ${input.name},\n\n${actor.name} has invited you to join the network as ${roleLabel[input.role].toLowerCase()}.\n\nChoose your password here (the link works for ${INVITATION_DAYS} days):\n${link}\n`,
        purpose: "invitation",
      },
    ]);
    return { id: row!.id, token };
  });
}

/**
 * The open invitation a token names, or null. A token that names none counts against the client's
 * address, which may then have to wait (a 429 AppError; lib/auth/invitation-limit.ts).
 */
export function findOpenInvitation(token: string, clientAddress: string) {
  return limitTokenCheck(clientAddress, async () => {
    const [row] = await db()
      .select()
      .from(invitations)
      .where(and(eq(invitations.tokenHash, hashToken(token)), isNull(invitations.acceptedAt), gt(invitations.expiresAt, new Date())))
      .limit(1);
    return row ?? null;
  });
}

/** Turns an invitation into an account; the invitation can be used once. */
export async function acceptInvitation(token: string, password: string, clientAddress: string) {
  // The token first (a sha256 and an indexed lookup, limited per address): bcrypt's deliberate
  // cost is spent only for a real invitation.
  if (!(await findOpenInvitation(token, clientAddress))) throw notFound("That invitation");
  const passwordHash = await hashPassword(password);
  return db().transaction(async (tx) => {
    // Checked again as it is used, so two acceptances at once cannot both succeed.
    const [invite] = await tx
      .update(invitations)
      .set({ acceptedAt: new Date() })
      .where(and(eq(invitations.tokenHash, hashToken(token)), isNull(invitations.acceptedAt), gt(invitations.expiresAt, new Date())))
      .returning();
    if (!invite) throw notFound("That invitation");
    const [existing] = await tx.select({ id: users.id }).from(users).where(eq(sql`lower(${users.email})`, invite.email.toLowerCase())).limit(1);
    if (existing) throw conflict("An account with that e-mail already exists. Sign in instead.");
    const [user] = await tx
      .insert(users)
      .values({ email: invite.email, name: invite.name, role: invite.role, passwordHash, invitedById: invite.invitedById })
      .returning({ id: users.id, email: users.email });
    return user!;
  });
}

/** Organisers set roles; the last active organiser cannot demote or deactivate themselves away. */
export async function updatePerson(actor: Actor, input: { userId: string; role: Role; active: boolean }) {
  return db().transaction(async (tx) => {
    const [target] = await tx.select().from(users).where(eq(users.id, input.userId)).limit(1).for("update");
    if (!target) throw notFound("That person");
    const losesOrganiser = target.role === "organiser" && (input.role !== "organiser" || !input.active);
    if (losesOrganiser) {
      const [others] = await tx
        .select({ n: sql<number>`count(*)`.mapWith(Number) })
        .from(users)
        .where(and(eq(users.role, "organiser"), eq(users.active, true), ne(users.id, target.id)));
      if ((others?.n ?? 0) === 0) throw invalid({ role: ["The network needs at least one active organiser."] });
    }
    await tx.update(users).set({ role: input.role, active: input.active, updatedAt: new Date() }).where(eq(users.id, target.id));
    return { id: target.id, changedBy: actor.id };
  });
}
