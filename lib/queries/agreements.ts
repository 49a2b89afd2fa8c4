import "server-only";
import { and, desc, eq, inArray, sql } from "drizzle-orm";
import { db, type Database, type Transaction } from "@/db/client";
import { agreementAcceptances, recorderAgreements, users } from "@/db/schema";
import type { RecordLicence } from "@/lib/agreement/licences";
import type { Actor } from "@/lib/auth/guard";
import { hasRole } from "@/lib/auth/roles";
import { conflict, forbidden, invalid } from "@/lib/errors";
import { logChange } from "./change-log";

// The recorder agreement: an organiser writes it, every change is a new version, and each
// volunteer accepts the current version (at first sign-in and again after each change) with two
// answers of their own: named in published data or shown under their pseudonym, and the
// newsletter. users.publish_name and users.newsletter hold the answers as they stand; exports
// and the newsletter read those (recorderCredits, setNewsletterPreference).

export async function currentAgreement() {
  const [row] = await db().select().from(recorderAgreements).orderBy(desc(recorderAgreements.version)).limit(1);
  return row ?? null;
}

/** Every version, newest first, with how many people accepted each. */
export function agreementVersions() {
  return db()
    .select({
      version: recorderAgreements.version,
      body: recorderAgreements.body,
      licence: recorderAgreements.licence,
      createdAt: recorderAgreements.createdAt,
      createdBy: users.name,
      accepted: sql<number>`(select count(distinct a.user_id) from ${agreementAcceptances} a where a.version = ${recorderAgreements.version})`.mapWith(Number),
    })
    .from(recorderAgreements)
    .leftJoin(users, eq(users.id, recorderAgreements.createdById))
    .orderBy(desc(recorderAgreements.version));
}

/** A new version from the organiser's text and licence; one transaction with its change-log row. */
export async function publishAgreement(actor: Actor, input: { body: string; licence: RecordLicence }) {
  return db().transaction(async (tx) => {
    // One version number at a time.
    await tx.execute(sql`select pg_advisory_xact_lock(hashtext('turnstone:recorder-agreement'))`);
    const [latest] = await tx.select().from(recorderAgreements).orderBy(desc(recorderAgreements.version)).limit(1);
    if (latest && latest.body === input.body && latest.licence === input.licence) throw invalid({ body: ["This is the current version already: change the text or the licence."] });
    const version = (latest?.version ?? 0) + 1;
    await tx.insert(recorderAgreements).values({ version, body: input.body, licence: input.licence, createdById: actor.id });
    await logChange(tx, actor, {
      entity: "agreement",
      entityId: String(version),
      action: latest ? "new-version" : "create",
      summary: `Recorder agreement version ${version} (${input.licence})`,
      before: latest ? { version: latest.version, licence: latest.licence, body: latest.body } : null,
      after: { version, licence: input.licence, body: input.body },
    });
    return { version };
  });
}

/** Whether this person must accept the current agreement before recording (volunteers only, once per version). */
export async function needsAgreement(actor: Actor): Promise<boolean> {
  if (!hasRole(actor, "volunteer")) return false;
  const [row] = await db().execute<{ needed: boolean }>(sql`
    select exists (
      select 1 from ${recorderAgreements} ra
      where ra.version = (select max(version) from ${recorderAgreements})
        and not exists (select 1 from ${agreementAcceptances} aa where aa.user_id = ${actor.id} and aa.version = ra.version)
    ) as needed`);
  return Boolean(row?.needed);
}

/**
 * Stores an acceptance of the current version with the recorder's answers, and makes those
 * answers the ones that stand. A version other than the current one (it changed while they
 * read it) is refused with 409, so nobody accepts text they were not shown.
 */
export async function acceptAgreement(actor: Actor, input: { version: number; publishName: boolean; newsletter: boolean }) {
  if (!hasRole(actor, "volunteer")) throw forbidden("The recorder agreement is for volunteer recorders.");
  return db().transaction(async (tx) => {
    const [latest] = await tx.select({ version: recorderAgreements.version }).from(recorderAgreements).orderBy(desc(recorderAgreements.version)).limit(1);
    if (!latest) throw conflict("There is no recorder agreement to accept yet.");
    if (latest.version !== input.version) throw conflict("The agreement has changed since this page opened. Read the new version and answer again.");
    const [row] = await tx
      .insert(agreementAcceptances)
      .values({ userId: actor.id, version: input.version, publishName: input.publishName, newsletter: input.newsletter })
      .returning({ acceptedAt: agreementAcceptances.acceptedAt });
    await tx.update(users).set({ publishName: input.publishName, updatedAt: new Date() }).where(eq(users.id, actor.id));
    await setNewsletterPreference(tx, actor.id, input.newsletter);
    return { version: input.version, acceptedAt: row!.acceptedAt.toISOString() };
  });
}

/**
 * The newsletter preference: the recorder agreement's answer and the newsletter's one-click
 * unsubscribe both set it here, so the latest choice wins.
 */
export async function setNewsletterPreference(tx: Database | Transaction, userId: string, wants: boolean): Promise<void> {
  await tx.update(users).set({ newsletter: wants, updatedAt: new Date() }).where(eq(users.id, userId));
}

/** A person's acceptances, newest first (their account page and their data download). */
export function acceptancesOf(userId: string) {
  return db()
    .select({ version: agreementAcceptances.version, licence: recorderAgreements.licence, publishName: agreementAcceptances.publishName, newsletter: agreementAcceptances.newsletter, acceptedAt: agreementAcceptances.acceptedAt })
    .from(agreementAcceptances)
    .innerJoin(recorderAgreements, eq(recorderAgreements.version, agreementAcceptances.version))
    .where(eq(agreementAcceptances.userId, userId))
    .orderBy(desc(agreementAcceptances.acceptedAt));
}

/**
 * How published data names each recorder: their name when they said so, else their pseudonym
 * (the same one erasure leaves behind). Anyone not asked yet is shown by pseudonym.
 */
export async function recorderCredits(userIds: string[]): Promise<Map<string, string>> {
  if (userIds.length === 0) return new Map();
  const rows = await db()
    .select({ id: users.id, credit: sql<string>`case when ${users.publishName} and ${users.erasedAt} is null then ${users.name} else ${users.pseudonym} end` })
    .from(users)
    .where(inArray(users.id, [...new Set(userIds)]));
  return new Map(rows.map((r) => [r.id, r.credit]));
}

/** The people who want the newsletter now (active, not erased). */
export function newsletterRecipients() {
  return db()
    .select({ id: users.id, name: users.name, email: users.email })
    .from(users)
    .where(and(eq(users.newsletter, true), eq(users.active, true), sql`${users.erasedAt} is null`));
}
