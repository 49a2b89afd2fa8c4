import "server-only";
import { createHash, randomBytes } from "node:crypto";
import { and, asc, desc, eq, gt, inArray, isNull, ne, sql, type SQL } from "drizzle-orm";
import { db, type Transaction } from "@/db/client";
import { invitations, sightings, transectAssignments, transects, users, visits, type Role } from "@/db/schema";
import type { Actor } from "@/lib/auth/guard";
import { limitTokenCheck } from "@/lib/auth/invitation-limit";
import { hashPassword } from "@/lib/auth/password";
import { normaliseRoles, rolesInWords } from "@/lib/auth/roles";
import { env } from "@/lib/env";
import { conflict, invalid, notFound } from "@/lib/errors";
import { enqueueEmails } from "@/lib/mail/queue";
import { logChange } from "./change-log";
import { walkSourceColumns } from "./person-walks";
import { currentSeason } from "./seasons";

const INVITATION_DAYS = 14;

export function hashToken(token: string): string {
  return createHash("sha256").update(token).digest("hex");
}

/** `WHERE` for "this person holds the role" (uses the roles GIN index). */
export function holdsRole(role: Role): SQL {
  return sql`${users.roles} @> array[${role}]::role[]`;
}

/** Everyone, with their roles and the transects they are assigned to. Erased people come last. */
export async function listPeople() {
  const [people, assigned] = await Promise.all([
    db()
      .select({ id: users.id, name: users.name, email: users.email, roles: users.roles, active: users.active, erased: sql<boolean>`${users.erasedAt} is not null`, lastSignInAt: users.lastSignInAt })
      .from(users)
      .orderBy(sql`${users.erasedAt} is not null`, asc(users.name)),
    db()
      .select({ userId: transectAssignments.userId, id: transects.id, code: transects.code })
      .from(transectAssignments)
      .innerJoin(transects, eq(transects.id, transectAssignments.transectId))
      .orderBy(asc(transects.code)),
  ]);
  const byUser = new Map<string, { id: string; code: string }[]>();
  for (const a of assigned) byUser.set(a.userId, [...(byUser.get(a.userId) ?? []), { id: a.id, code: a.code }]);
  return people.map((p) => ({ ...p, transects: byUser.get(p.id) ?? [] }));
}
export type PersonRow = Awaited<ReturnType<typeof listPeople>>[number];

/** One person, their transects and their walks this season (newest first). */
export async function personDetail(id: string) {
  const [person] = await db()
    .select({ id: users.id, name: users.name, email: users.email, roles: users.roles, active: users.active, erased: sql<boolean>`${users.erasedAt} is not null`, pseudonym: users.pseudonym, lastSignInAt: users.lastSignInAt })
    .from(users)
    .where(eq(users.id, id))
    .limit(1);
  if (!person) throw notFound("That person");
  const season = await currentSeason();
  const [assigned, walks] = await Promise.all([
    db()
      .select({ id: transects.id, code: transects.code, name: transects.name, active: transects.active })
      .from(transectAssignments)
      .innerJoin(transects, eq(transects.id, transectAssignments.transectId))
      .where(eq(transectAssignments.userId, id))
      .orderBy(asc(transects.code)),
    season
      ? db()
          .select({
            id: visits.id,
            date: visits.visitDate,
            transectCode: transects.code,
            completeList: visits.completeList,
            sightings: sql<number>`count(${sightings.id})`.mapWith(Number),
            waiting: sql<number>`count(${sightings.id}) filter (where ${sightings.status} in ('pending', 'queried'))`.mapWith(Number),
            ...walkSourceColumns,
          })
          .from(visits)
          .innerJoin(transects, eq(transects.id, visits.transectId))
          .leftJoin(sightings, eq(sightings.visitId, visits.id))
          .where(and(eq(visits.volunteerId, id), eq(visits.seasonId, season.id)))
          .groupBy(visits.id, transects.code)
          .orderBy(desc(visits.visitDate), desc(visits.startTime))
      : Promise.resolve([]),
  ]);
  return { person, transects: assigned, season: season ? { id: season.id, name: season.name } : null, walks };
}
export type PersonDetail = Awaited<ReturnType<typeof personDetail>>;

export function pendingInvitations() {
  return db()
    .select({ id: invitations.id, name: invitations.name, email: invitations.email, roles: invitations.roles, expiresAt: invitations.expiresAt })
    .from(invitations)
    .where(and(isNull(invitations.acceptedAt), gt(invitations.expiresAt, new Date())))
    .orderBy(asc(invitations.createdAt));
}

/**
 * Creates an invitation and queues its e-mail in one transaction, with its change-log row.
 * Returns the invitation's id and its token: the token travels in the e-mail's link and in this
 * return value, and only its hash is stored.
 */
export async function invitePerson(actor: Actor, input: { name: string; email: string; roles: Role[] }) {
  const email = input.email.trim().toLowerCase();
  const roles = normaliseRoles(input.roles);
  if (roles.length === 0) throw invalid({ roles: ["Choose at least one role."] });
  const token = randomBytes(32).toString("base64url");
  return db().transaction(async (tx) => {
    const [existing] = await tx.select({ id: users.id }).from(users).where(eq(sql`lower(${users.email})`, email)).limit(1);
    if (existing) throw conflict("Someone with that e-mail is already in the network.");
    // A fresh invitation replaces any earlier unanswered one for the same address.
    await tx.delete(invitations).where(and(eq(sql`lower(${invitations.email})`, email), isNull(invitations.acceptedAt)));
    const [row] = await tx
      .insert(invitations)
      .values({ email, name: input.name, roles, tokenHash: hashToken(token), invitedById: actor.id, expiresAt: new Date(Date.now() + INVITATION_DAYS * 86_400_000) })
      .returning({ id: invitations.id });
    const link = `${env().APP_URL}/invitation/${token}`;
    await enqueueEmails(tx, [
      {
        to: email,
        subject: "You are invited to record with Turnstone",
        text: `Hello ${input.name},\n\n${actor.name} has invited you to join the network as ${rolesInWords(roles)}.\n\nChoose your password here (the link works for ${INVITATION_DAYS} days):\n${link}\n`,
        purpose: "invitation",
      },
    ]);
    await logChange(tx, actor, {
      entity: "person",
      entityId: `invitation:${row!.id}`,
      action: "invite",
      summary: `Invited ${input.name} as ${rolesInWords(roles)}`,
      after: { name: input.name, email, roles },
    });
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

/** Turns an invitation into an account with the invited roles; the invitation can be used once. */
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
      .values({ email: invite.email, name: invite.name, roles: normaliseRoles(invite.roles), passwordHash, invitedById: invite.invitedById })
      .returning({ id: users.id, email: users.email });
    // Ties the invitation's log row to the person it became (history by person id).
    await logChange(tx, { id: user!.id }, { entity: "person", entityId: user!.id, action: "join", summary: `${invite.name} accepted their invitation`, after: { invitation: invite.id } });
    return user!;
  });
}

/** Serialises every change that could take away an organiser, so two at once cannot leave none. */
export async function lockOrganisers(tx: Transaction): Promise<void> {
  await tx.execute(sql`select pg_advisory_xact_lock(hashtext('turnstone:organisers'))`);
}

/** Refuses (400) when the person is the network's last active organiser. Call under lockOrganisers. */
export async function keepAnOrganiser(tx: Transaction, userId: string, field = "roles"): Promise<void> {
  const [others] = await tx
    .select({ n: sql<number>`count(*)`.mapWith(Number) })
    .from(users)
    .where(and(holdsRole("organiser"), eq(users.active, true), ne(users.id, userId)));
  if ((others?.n ?? 0) === 0) throw invalid({ [field]: ["The network needs at least one active organiser."] });
}

/**
 * Organisers change a person's roles or whether they may sign in; one transaction with its
 * change-log row. The last active organiser keeps that role and stays active.
 */
export async function updatePerson(actor: Actor, input: { userId: string; roles?: Role[]; active?: boolean }) {
  return db().transaction(async (tx) => {
    await lockOrganisers(tx);
    const [target] = await tx.select().from(users).where(eq(users.id, input.userId)).limit(1).for("update");
    if (!target) throw notFound("That person");
    if (target.erasedAt) throw conflict("This person's data was erased; they cannot be changed or brought back.");
    const roles = input.roles ? normaliseRoles(input.roles) : target.roles;
    const active = input.active ?? target.active;
    if (roles.length === 0) throw invalid({ roles: ["Choose at least one role."] });
    const wasOrganiser = target.active && target.roles.includes("organiser");
    if (wasOrganiser && (!roles.includes("organiser") || !active)) await keepAnOrganiser(tx, target.id, roles.includes("organiser") ? "active" : "roles");
    const before = { roles: target.roles, active: target.active };
    const after = { roles, active };
    if (JSON.stringify(before) === JSON.stringify(after)) return { id: target.id, roles, active };
    await tx.update(users).set({ roles, active, updatedAt: new Date() }).where(eq(users.id, target.id));
    const what = [
      before.active !== active ? (active ? "reactivated" : "deactivated") : null,
      JSON.stringify(before.roles) !== JSON.stringify(roles) ? `roles now ${rolesInWords(roles)}` : null,
    ].filter(Boolean);
    await logChange(tx, actor, { entity: "person", entityId: target.id, action: "update", summary: `${target.name}: ${what.join(", ")}`, before, after });
    return { id: target.id, roles, active };
  });
}

export type AssignmentChange = { transectId?: string; userId?: string; add: string[]; remove: string[] };

/**
 * Assigns volunteers to transects from either side, inside the caller's transaction, with one
 * change-log row per pair (entity "assignment", id the person's, so a person's assignment history is
 * `?entity=assignment&id=<userId>`; the transect is in the row's values). With `transectId`, `add`/`remove` are people's ids; with `userId`,
 * they are transects' ids. Only active volunteers are assigned, only to transects in use;
 * removing a pair that is not there, or adding one that is, changes nothing. The phone picks the
 * change up with its next reference download (lib/queries/field.ts reads assignments each time).
 */
export async function setAssignments(tx: Transaction, actor: Actor, change: AssignmentChange): Promise<{ added: number; removed: number }> {
  if (Boolean(change.transectId) === Boolean(change.userId)) throw invalid({ _: ["Name either a transect or a person."] });
  const pairs = (ids: string[]) => [...new Set(ids)].map((other) => (change.transectId ? { transectId: change.transectId, userId: other } : { transectId: other, userId: change.userId! }));
  const adding = pairs(change.add);
  const removing = pairs(change.remove);
  const userIds = [...new Set([...adding, ...removing].map((p) => p.userId))];
  const transectIds = [...new Set([...adding, ...removing].map((p) => p.transectId))];
  if (userIds.length === 0 || transectIds.length === 0) return { added: 0, removed: 0 };

  const people = await tx.select({ id: users.id, name: users.name, roles: users.roles, active: users.active }).from(users).where(inArray(users.id, userIds));
  const places = await tx.select({ id: transects.id, code: transects.code, active: transects.active }).from(transects).where(inArray(transects.id, transectIds));
  const person = new Map(people.map((p) => [p.id, p]));
  const place = new Map(places.map((t) => [t.id, t]));
  for (const id of userIds) if (!person.has(id)) throw notFound("That person");
  for (const id of transectIds) if (!place.has(id)) throw notFound("That transect");
  for (const p of adding) {
    const who = person.get(p.userId)!;
    if (!who.active || !who.roles.includes("volunteer")) throw invalid({ add: [`${who.name} is not an active volunteer recorder.`] });
    if (!place.get(p.transectId)!.active) throw invalid({ add: [`${place.get(p.transectId)!.code} is retired: nobody records on it.`] });
  }

  const added = adding.length
    ? await tx.insert(transectAssignments).values(adding.map((p) => ({ ...p, assignedById: actor.id }))).onConflictDoNothing().returning({ transectId: transectAssignments.transectId, userId: transectAssignments.userId })
    : [];
  const removed = [];
  for (const p of removing) {
    const gone = await tx
      .delete(transectAssignments)
      .where(and(eq(transectAssignments.transectId, p.transectId), eq(transectAssignments.userId, p.userId)))
      .returning({ transectId: transectAssignments.transectId, userId: transectAssignments.userId });
    removed.push(...gone);
  }
  const entry = (p: { transectId: string; userId: string }, action: "assign" | "unassign") => {
    const who = person.get(p.userId)!.name;
    const code = place.get(p.transectId)!.code;
    return logChange(tx, actor, {
      entity: "assignment",
      entityId: p.userId,
      action,
      summary: action === "assign" ? `Assigned ${who} to ${code}` : `Took ${who} off ${code}`,
      before: action === "assign" ? null : { transectId: p.transectId, transect: code, userId: p.userId },
      after: action === "assign" ? { transectId: p.transectId, transect: code, userId: p.userId } : null,
    });
  };
  for (const p of added) await entry(p, "assign");
  for (const p of removed) await entry(p, "unassign");
  return { added: added.length, removed: removed.length };
}
