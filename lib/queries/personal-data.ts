import "server-only";
import { and, asc, eq, inArray, isNotNull, sql } from "drizzle-orm";
import { db, type Transaction } from "@/db/client";
import {
  emailOutbox,
  invitations,
  networkChanges,
  photos,
  signInAttempts,
  sightings,
  species,
  transectAssignments,
  transects,
  users,
  verificationEvents,
  visits,
} from "@/db/schema";
import type { Actor } from "@/lib/auth/guard";
import { conflict, invalid, notFound } from "@/lib/errors";
import { asJsonText, wholePattern, withoutName } from "@/lib/people/erasure-text";
import { REVIEWER } from "@/lib/review/words";
import { acceptancesOf } from "./agreements";
import { logChange } from "./change-log";
import { walkSourceColumns } from "./person-walks";
import { keepAnOrganiser, lockOrganisers } from "./people";

// A person's own data, as European volunteers expect (GDPR Art. 15 access and Art. 17 erasure):
// they can download everything Turnstone holds about them, and an organiser can erase them.

/** Everything Turnstone holds about one person, as one JSON document (their account page's download). */
export async function personalData(userId: string) {
  const [profile] = await db()
    .select({
      id: users.id,
      name: users.name,
      email: users.email,
      roles: users.roles,
      pseudonym: users.pseudonym,
      active: users.active,
      namedInPublishedData: users.publishName,
      newsletter: users.newsletter,
      acceptedSafetyAt: users.acceptedSafetyAt,
      lastSignInAt: users.lastSignInAt,
      createdAt: users.createdAt,
    })
    .from(users)
    .where(eq(users.id, userId));
  if (!profile) throw notFound("That person");

  const [agreement, assigned, walks, ownMessages, changes] = await Promise.all([
    acceptancesOf(userId),
    db()
      .select({ transect: transects.code, name: transects.name, since: transectAssignments.createdAt })
      .from(transectAssignments)
      .innerJoin(transects, eq(transects.id, transectAssignments.transectId))
      .where(eq(transectAssignments.userId, userId))
      .orderBy(asc(transects.code)),
    db()
      .select({
        id: visits.id,
        transect: transects.code,
        date: visits.visitDate,
        startTime: visits.startTime,
        endTime: visits.endTime,
        temperatureC: visits.temperatureC,
        windBeaufort: visits.windBeaufort,
        cloudCoverPercent: visits.cloudCoverPercent,
        sky: visits.sky,
        sunshinePercent: visits.sunshinePercent,
        rain: visits.rain,
        walkedWith: visits.coRecorders,
        completeList: visits.completeList,
        notes: visits.notes,
        submittedAt: visits.submittedAt,
        ...walkSourceColumns,
      })
      .from(visits)
      .innerJoin(transects, eq(transects.id, visits.transectId))
      .where(eq(visits.volunteerId, userId))
      .orderBy(asc(visits.visitDate), asc(visits.startTime)),
    // Messages this person wrote anywhere (a reviewer's questions, a recorder's replies).
    db()
      .select({ at: verificationEvents.createdAt, sightingId: verificationEvents.sightingId, action: verificationEvents.action, message: verificationEvents.message })
      .from(verificationEvents)
      .where(and(eq(verificationEvents.actorId, userId), isNotNull(verificationEvents.message)))
      .orderBy(asc(verificationEvents.createdAt)),
    db()
      .select({ at: networkChanges.createdAt, entity: networkChanges.entity, action: networkChanges.action, summary: networkChanges.summary })
      .from(networkChanges)
      .where(eq(networkChanges.actorId, userId))
      .orderBy(asc(networkChanges.createdAt)),
  ]);

  const visitIds = walks.map((w) => w.id);
  const [seen, conversation, pictures] = visitIds.length
    ? await Promise.all([
        db()
          .select({
            id: sightings.id,
            visitId: sightings.visitId,
            scientificName: species.scientificName,
            vernacularName: species.vernacularName,
            count: sightings.count,
            section: sightings.section,
            latitude: sightings.latitude,
            longitude: sightings.longitude,
            accuracyMetres: sightings.accuracyMetres,
            note: sightings.note,
            status: sightings.status,
          })
          .from(sightings)
          .innerJoin(species, eq(species.id, sightings.speciesId))
          .where(inArray(sightings.visitId, visitIds))
          .orderBy(asc(sightings.createdAt)),
        // The conversation on their sightings; a reviewer is named by role only (their name is theirs).
        db()
          .select({ sightingId: verificationEvents.sightingId, at: verificationEvents.createdAt, fromYou: sql<boolean>`${verificationEvents.actorId} = ${userId}`, action: verificationEvents.action, message: verificationEvents.message })
          .from(verificationEvents)
          .innerJoin(sightings, eq(sightings.id, verificationEvents.sightingId))
          .where(inArray(sightings.visitId, visitIds))
          .orderBy(asc(verificationEvents.createdAt)),
        db().select({ sightingId: photos.sightingId, id: photos.id, status: photos.status, createdAt: photos.createdAt }).from(photos).where(eq(photos.uploadedById, userId)),
      ])
    : [[], [], []];

  const talk = new Map<string, { at: Date; from: string; action: string; message: string | null }[]>();
  for (const c of conversation) talk.set(c.sightingId, [...(talk.get(c.sightingId) ?? []), { at: c.at, from: c.fromYou ? "you" : `a ${REVIEWER}`, action: c.action, message: c.message }]);
  const photosOf = new Map<string, { id: string; status: string; createdAt: Date }[]>();
  for (const p of pictures) if (p.sightingId) photosOf.set(p.sightingId, [...(photosOf.get(p.sightingId) ?? []), { id: p.id, status: p.status, createdAt: p.createdAt }]);
  const bySighting = new Map<string, unknown[]>();
  for (const s of seen) {
    const { visitId, ...rest } = s;
    bySighting.set(visitId, [...(bySighting.get(visitId) ?? []), { ...rest, photos: photosOf.get(s.id) ?? [], conversation: talk.get(s.id) ?? [] }]);
  }

  return {
    about: "Everything Turnstone holds about you in this network: your profile, agreement answers, transects, walks with their sightings and conversations, and messages and changes you made.",
    exportedAt: new Date().toISOString(),
    profile,
    recorderAgreement: agreement,
    transects: assigned,
    walks: walks.map((w) => ({ ...w, sightings: bySighting.get(w.id) ?? [] })),
    messagesYouWrote: ownMessages,
    networkChangesYouMade: changes,
  };
}

/** What a message by an erased person says instead (the audit trail keeps the row). */
export const ERASED_MESSAGE = "[removed at this person's request]";

/** Tables whose words are the checklist's (scientific and common names), never a person's. */
const NOT_SCANNED = new Set(["users", "invitations", "species", "species_synonyms", "species_tags", "species_tag_links", "species_aggregate_members", "species_merges"]);

/**
 * Erases a person on request, in one transaction: their name and e-mail go everywhere they
 * appear (their own row, invitations, sign-in attempts, mail to them, which is deleted from the
 * queue, and any text or JSON column of any other table, where their name becomes their
 * pseudonym), their own free text (walk notes, sighting notes, their messages in the review trail)
 * is removed, and their name leaves other people's "walked with" lines. Their walks and sightings
 * stay for the science under the pseudonym, the audit trails keep their rows, and the erasure is
 * logged without the erased data. The organiser confirms by typing the pseudonym.
 */
export async function erasePerson(actor: Actor, userId: string, confirm: string) {
  return db().transaction(async (tx) => {
    await lockOrganisers(tx);
    const [target] = await tx.select().from(users).where(eq(users.id, userId)).limit(1).for("update");
    if (!target) throw notFound("That person");
    if (target.erasedAt) throw conflict("This person's data has already been erased.");
    if (target.id === actor.id) throw invalid({ confirm: ["Another organiser must erase you, so the network is never left without one by accident."] });
    if (confirm.trim().toLowerCase() !== target.pseudonym.toLowerCase()) throw invalid({ confirm: [`Type ${target.pseudonym} to confirm.`] });
    if (target.active && target.roles.includes("organiser")) await keepAnOrganiser(tx, target.id, "confirm");

    const email = target.email.toLowerCase();
    const invited = await tx.select({ name: invitations.name }).from(invitations).where(eq(sql`lower(${invitations.email})`, email));
    const names = [...new Set([target.name, ...invited.map((i) => i.name)].map((n) => n.trim()).filter((n) => n.length > 0))];

    // Their own free text.
    const own = tx.select({ id: visits.id }).from(visits).where(eq(visits.volunteerId, target.id));
    await tx.update(visits).set({ notes: null }).where(and(eq(visits.volunteerId, target.id), isNotNull(visits.notes)));
    await tx.update(sightings).set({ note: null }).where(and(inArray(sightings.visitId, own), isNotNull(sightings.note)));
    // The review history is append-only (drizzle/0008) except for this: the law's erasure of the words a person wrote.
    await tx.execute(sql`select set_config('turnstone.erasing', 'on', true)`);
    await tx.update(verificationEvents).set({ message: ERASED_MESSAGE }).where(and(eq(verificationEvents.actorId, target.id), isNotNull(verificationEvents.message)));

    // Their name in other people's "walked with" lines.
    for (const name of names) {
      const listed = await tx
        .select({ id: visits.id, coRecorders: visits.coRecorders })
        .from(visits)
        .where(sql`${visits.coRecorders} ~* ${wholePattern(name)}`)
        .for("update");
      for (const v of listed) await tx.update(visits).set({ coRecorders: withoutName(v.coRecorders, name) }).where(eq(visits.id, v.id));
    }

    // Where they can be reached or recognised by their address.
    await tx.delete(emailOutbox).where(eq(sql`lower(${emailOutbox.toAddress})`, email));
    await tx.delete(invitations).where(eq(sql`lower(${invitations.email})`, email));
    await tx.delete(signInAttempts).where(eq(signInAttempts.emailKey, email));

    await tx
      .update(users)
      .set({
        name: target.pseudonym,
        email: `erased-${target.id}@erased.invalid`, // RFC 2606: .invalid never receives mail
        passwordHash: null,
        active: false,
        publishName: false,
        newsletter: false,
        erasedAt: new Date(),
        updatedAt: new Date(),
      })
      .where(eq(users.id, target.id));

    await scrubEverywhere(tx, [...names, email], target.pseudonym);

    await logChange(tx, actor, {
      entity: "person",
      entityId: target.id,
      action: "erase",
      summary: `Erased the personal data of ${target.pseudonym} on request`,
      after: { pseudonym: target.pseudonym },
    });
    return { id: target.id, pseudonym: target.pseudonym };
  });
}

/**
 * Replaces each string, as a whole (any letter case), with the pseudonym in every text and JSON
 * column of every other table of the schema, so whatever mentions them (a log row, a checker's
 * message, a stored e-mail to someone else, an imported recorder's name) shows the pseudonym.
 * The pseudonym holds no quote or backslash, so a JSON document stays valid.
 */
async function scrubEverywhere(tx: Transaction, strings: string[], pseudonym: string): Promise<void> {
  const columns = await tx.execute<{ table_name: string; column_name: string; data_type: string }>(sql`
    select c.table_name, c.column_name, c.data_type
    from information_schema.columns c
    join information_schema.tables t on t.table_schema = c.table_schema and t.table_name = c.table_name and t.table_type = 'BASE TABLE'
    where c.table_schema = current_schema() and c.data_type in ('text', 'character varying', 'jsonb', 'json')
    order by c.table_name, c.column_name`);
  for (const c of columns) {
    if (NOT_SCANNED.has(c.table_name)) continue;
    const column = sql.identifier(c.column_name);
    const table = sql.identifier(c.table_name);
    for (const s of strings) {
      if (c.data_type === "jsonb" || c.data_type === "json") {
        const pattern = wholePattern(asJsonText(s));
        await tx.execute(sql`update ${table} set ${column} = regexp_replace(${column}::text, ${pattern}, ${pseudonym}, 'gi')::${sql.raw(c.data_type)} where ${column}::text ~* ${pattern}`);
      } else {
        const pattern = wholePattern(s);
        await tx.execute(sql`update ${table} set ${column} = regexp_replace(${column}, ${pattern}, ${pseudonym}, 'gi') where ${column} ~* ${pattern}`);
      }
    }
  }
}
