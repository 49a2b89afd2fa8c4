import { randomUUID } from "node:crypto";
import { eq, sql } from "drizzle-orm";
import { beforeEach, describe, expect, it, vi } from "vitest";
import { db } from "@/db/client";
import { emailOutbox, networkChanges, signInAttempts, sightings, species, transectAssignments, transects, users, verificationEvents, visits } from "@/db/schema";
import type { Actor } from "@/lib/auth/guard";
import { listChanges } from "@/lib/queries/change-log";
import { acceptInvitation, invitePerson, updatePerson } from "@/lib/queries/people";
import { ERASED_MESSAGE, erasePerson } from "@/lib/queries/personal-data";
import { resetToDemo } from "./support/db";
import { call, demo, userId } from "./transects-helpers";

const session = vi.hoisted(() => ({ userId: null as string | null }));
vi.mock("@/lib/auth/session", () => ({ sessionUserId: async () => session.userId }));
const erasureRoute = await import("@/app/(network)/api/network/people/[id]/erasure/route");

const NAME = "Philippa Quarrendon";
const EMAIL = "philippa.q@example.org";

async function actorFor(email: string): Promise<Actor> {
  const [u] = await db().select().from(users).where(eq(users.email, email));
  return { id: u!.id, roles: u!.roles, name: u!.name, email: u!.email };
}

/**
 * Every place in the database a string occurs: each text, varchar, json, jsonb and array column of
 * every table in the schema, read as text, any letter case (information_schema, PostgreSQL docs 37.17).
 */
async function placesHolding(needle: string): Promise<string[]> {
  const columns = await db().execute<{ table_name: string; column_name: string }>(sql`
    select c.table_name, c.column_name from information_schema.columns c
    join information_schema.tables t on t.table_schema = c.table_schema and t.table_name = c.table_name and t.table_type = 'BASE TABLE'
    where c.table_schema = current_schema() and c.data_type in ('text', 'character varying', 'json', 'jsonb', 'ARRAY', 'USER-DEFINED')`);
  const found: string[] = [];
  for (const c of columns) {
    const [row] = await db().execute<{ n: number }>(
      sql`select count(*)::int as n from ${sql.identifier(c.table_name)} where strpos(lower(${sql.identifier(c.column_name)}::text), lower(${needle})) > 0`,
    );
    if (row!.n > 0) found.push(`${c.table_name}.${c.column_name}`);
  }
  return found;
}

/** A volunteer who joined by invitation, walked, was asked a question, replied, and was listed on someone else's walk. */
async function volunteerWithHistory() {
  const organiser = await actorFor(demo.organiser);
  const checker = await actorFor(demo.coordinator);
  const { token } = await invitePerson(organiser, { name: NAME, email: EMAIL, roles: ["volunteer"] });
  const { id } = await acceptInvitation(token, "a-long-password", "203.0.113.7");
  await updatePerson(organiser, { userId: id, roles: ["volunteer", "coordinator"] });
  const [transect] = await db().select().from(transects).where(eq(transects.active, true)).limit(1);
  await db().insert(transectAssignments).values({ transectId: transect!.id, userId: id });
  const [taxon] = await db().select().from(species).limit(1);
  const walk = randomUUID();
  const seen = randomUUID();
  await db().insert(visits).values({ id: walk, transectId: transect!.id, volunteerId: id, visitDate: "2024-06-01", startTime: "10:00", notes: `Walked by ${NAME}, call me on ${EMAIL}`, completeList: true });
  await db().insert(sightings).values({ id: seen, visitId: walk, speciesId: taxon!.id, count: 3, section: 1, note: "Near the stile, seen by Philippa Quarrendon" });
  await db().insert(verificationEvents).values([
    { sightingId: seen, actorId: checker.id, action: "query", fromStatus: "pending", toStatus: "queried", message: `Thanks ${NAME}: which wing was worn?` },
    { sightingId: seen, actorId: id, action: "reply", message: "The left one, Philippa" },
  ]);
  const other = await actorFor(demo.volunteer);
  const theirWalk = randomUUID();
  await db().insert(visits).values({ id: theirWalk, transectId: transect!.id, volunteerId: other.id, visitDate: "2024-06-02", startTime: "09:00", coRecorders: `${NAME.toUpperCase()} and Sam Ashby` });
  await db().insert(emailOutbox).values({ toAddress: demo.coordinator, subject: `A question from ${NAME}`, textBody: `${NAME} <${EMAIL}> replied.`, purpose: "test" });
  await db().insert(signInAttempts).values({ emailKey: EMAIL, ipKey: "203.0.113.7", succeeded: true });
  return { id, walk, seen, theirWalk, organiser };
}

describe("erasing a person on request", () => {
  beforeEach(async () => {
    await resetToDemo();
    session.userId = null;
  });

  it("leaves no trace of their name or e-mail in any table; sightings and trails keep their rows under the pseudonym", async () => {
    const { id, walk, seen, theirWalk } = await volunteerWithHistory();
    expect((await placesHolding(NAME)).length).toBeGreaterThan(5); // the scan finds what is there
    expect(await placesHolding(EMAIL)).toEqual(expect.arrayContaining(["users.email", "email_outbox.to_address", "network_changes.after", "sign_in_attempts.email_key"]));
    const before = {
      sightings: (await db().select().from(sightings).where(eq(sightings.visitId, walk))).length,
      events: (await db().select().from(verificationEvents).where(eq(verificationEvents.sightingId, seen))).length,
      changes: (await db().select().from(networkChanges)).length,
    };
    const [{ pseudonym }] = (await db().select({ pseudonym: users.pseudonym }).from(users).where(eq(users.id, id))) as [{ pseudonym: string }];

    session.userId = await userId(demo.organiser);
    const answer = await call(erasureRoute.POST, { body: { confirm: pseudonym.toLowerCase() }, params: { id } });
    expect(answer).toMatchObject({ status: 200, json: { erased: { id, pseudonym } } });

    expect(await placesHolding(NAME)).toEqual([]);
    expect(await placesHolding(EMAIL)).toEqual([]);
    expect(await placesHolding("Philippa Quarrendon".split(" ")[1]!)).toEqual([]);

    const [person] = await db().select().from(users).where(eq(users.id, id));
    expect(person).toMatchObject({ name: pseudonym, active: false, passwordHash: null, newsletter: false, publishName: false });
    expect(person!.erasedAt).not.toBeNull();
    expect((await db().select().from(sightings).where(eq(sightings.visitId, walk))).length).toBe(before.sightings);
    const [kept] = await db().select().from(visits).where(eq(visits.id, walk));
    expect(kept).toMatchObject({ volunteerId: id, notes: null, completeList: true });
    const events = await db().select().from(verificationEvents).where(eq(verificationEvents.sightingId, seen)).orderBy(verificationEvents.createdAt);
    expect(events).toHaveLength(before.events);
    expect(events.map((e) => e.message)).toEqual([`Thanks ${pseudonym}: which wing was worn?`, ERASED_MESSAGE]);
    const [theirs] = await db().select().from(visits).where(eq(visits.id, theirWalk));
    expect(theirs!.coRecorders).toBe("Sam Ashby");
    expect(await db().select().from(emailOutbox).where(sql`lower(${emailOutbox.toAddress}) like 'philippa%'`)).toHaveLength(0);

    // The trail keeps its rows, with the person shown by the pseudonym; the erasure's own row holds nothing erased.
    const changes = await db().select().from(networkChanges).orderBy(networkChanges.createdAt);
    expect(changes).toHaveLength(before.changes + 1);
    expect(changes.at(-1)).toMatchObject({ entity: "person", entityId: id, action: "erase", before: null, after: { pseudonym } });
    const history = await listChanges({ entity: "person", entityId: id });
    expect(history.rows.find((r) => r.action === "join")!.actorName).toBe(pseudonym);
  });

  it("refuses a wrong confirmation, someone already erased, erasing oneself, and anyone but an organiser; nothing is written", async () => {
    const { id } = await volunteerWithHistory();
    const organiserId = await userId(demo.organiser);
    for (const who of [demo.volunteer, demo.partner, demo.coordinator]) {
      session.userId = await userId(who);
      expect((await call(erasureRoute.POST, { body: { confirm: "x" }, params: { id } })).status, who).toBe(403);
    }
    session.userId = organiserId;
    const wrong = await call(erasureRoute.POST, { body: { confirm: "Recorder 00000000" }, params: { id } });
    expect(wrong.status).toBe(400);
    expect(wrong.json.error.fields.confirm[0]).toMatch(/^Type Recorder [0-9A-F]{8} to confirm\.$/);
    expect((await call(erasureRoute.POST, { body: { confirm: "x" }, params: { id: "not-a-uuid" } })).status).toBe(400);
    const self = await actorFor(demo.organiser);
    const [me] = await db().select({ pseudonym: users.pseudonym }).from(users).where(eq(users.id, organiserId));
    await expect(erasePerson(self, organiserId, me!.pseudonym)).rejects.toMatchObject({ status: 400 });
    expect(await placesHolding(EMAIL)).toContain("users.email");
    expect((await db().select().from(networkChanges).where(eq(networkChanges.action, "erase")))).toHaveLength(0);

    const [p] = await db().select({ pseudonym: users.pseudonym }).from(users).where(eq(users.id, id));
    await erasePerson(self, id, p!.pseudonym);
    await expect(erasePerson(self, id, p!.pseudonym)).rejects.toMatchObject({ status: 409 });
    await expect(updatePerson(self, { userId: id, active: true })).rejects.toMatchObject({ status: 409 });
  });

  it("the last active organiser cannot be erased", async () => {
    const organiser = await actorFor(demo.organiser);
    const checker = await actorFor(demo.coordinator);
    await updatePerson(organiser, { userId: checker.id, roles: ["coordinator", "organiser"] });
    await updatePerson(checker, { userId: organiser.id, active: false });
    const [p] = await db().select({ pseudonym: users.pseudonym }).from(users).where(eq(users.id, checker.id));
    const third = { ...organiser, id: randomUUID() }; // stands for another organiser's request
    await expect(erasePerson(third, checker.id, p!.pseudonym)).rejects.toMatchObject({ status: 400, fieldErrors: { confirm: [expect.stringMatching(/at least one active organiser/)] } });
  });
});
