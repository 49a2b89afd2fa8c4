import { and, eq, sql } from "drizzle-orm";
import { beforeEach, describe, expect, it } from "vitest";
import { db } from "@/db/client";
import { emailOutbox, invitations, networkChanges, transectAssignments, transects, users } from "@/db/schema";
import type { Actor } from "@/lib/auth/guard";
import { verifyPassword } from "@/lib/auth/password";
import { fieldReference } from "@/lib/queries/field-reference";
import { acceptInvitation, holdsRole, invitePerson, setAssignments, updatePerson } from "@/lib/queries/people";
import { resetToDemo } from "./support/db";

async function firstWith(role: Actor["roles"][number]): Promise<Actor> {
  const [u] = await db().select().from(users).where(holdsRole(role)).orderBy(users.email).limit(1);
  return { id: u!.id, roles: u!.roles, name: u!.name, email: u!.email };
}
const organiser = () => firstWith("organiser");
const rolesOf = async (id: string) => (await db().select({ roles: users.roles, active: users.active }).from(users).where(eq(users.id, id)))[0]!;
const logFor = (entity: "person" | "assignment", id: string) =>
  db().select().from(networkChanges).where(and(eq(networkChanges.entity, entity), eq(networkChanges.entityId, id)));

describe("inviting people with their roles", () => {
  beforeEach(async () => {
    await resetToDemo();
  });

  it("an invitation, its e-mail and its change-log row are written together; the token is stored only as a hash", async () => {
    const actor = await organiser();
    const { id, token } = await invitePerson(actor, { name: "Nia Holt", email: "Nia.Holt@Example.org", roles: ["coordinator", "volunteer"] });
    const [invite] = await db().select().from(invitations);
    expect(invite!.email).toBe("nia.holt@example.org");
    expect(invite!.roles).toEqual(["volunteer", "coordinator"]); // repeats dropped, usual order
    expect(invite!.tokenHash).not.toContain(token);
    const [mail] = await db().select().from(emailOutbox).where(eq(emailOutbox.toAddress, "nia.holt@example.org"));
    expect(mail!.textBody).toContain(`/invitation/${token}`);
    expect(mail!.textBody).toContain("volunteer recorder and reviewer");
    expect(mail!.status).toBe("queued");
    const [log] = await logFor("person", `invitation:${id}`);
    expect(log).toMatchObject({ action: "invite", actorId: actor.id, after: { roles: ["volunteer", "coordinator"] } });
  });

  it("refuses to invite an e-mail already in the network, in any letter case, or with no role, and writes nothing", async () => {
    const actor = await organiser();
    await expect(invitePerson(actor, { name: "Dup", email: "VOLUNTEER01@harrowmere.example", roles: ["volunteer"] })).rejects.toMatchObject({ status: 409 });
    await expect(invitePerson(actor, { name: "Nobody", email: "nobody@example.org", roles: [] })).rejects.toMatchObject({ status: 400 });
    expect(await db().select().from(emailOutbox)).toHaveLength(0);
    expect(await db().select().from(invitations)).toHaveLength(0);
    expect(await db().select().from(networkChanges)).toHaveLength(0);
  });

  it("accepting creates the account with every invited role, once only", async () => {
    const actor = await organiser();
    const { token } = await invitePerson(actor, { name: "Nia Holt", email: "nia@example.org", roles: ["partner", "volunteer"] });
    await acceptInvitation(token, "a-long-password", "203.0.113.5");
    const [u] = await db().select().from(users).where(eq(sql`lower(${users.email})`, "nia@example.org"));
    expect(u!.roles).toEqual(["volunteer", "partner"]);
    expect(u!.pseudonym).toMatch(/^Recorder [0-9A-F]{8}$/);
    expect(await verifyPassword("a-long-password", u!.passwordHash!)).toBe(true);
    await expect(acceptInvitation(token, "another-password", "203.0.113.5")).rejects.toMatchObject({ status: 404 });
  });
});

describe("changing roles and who may sign in", () => {
  beforeEach(async () => {
    await resetToDemo();
  });

  it("an organiser gives a volunteer a second role, deactivates and reactivates them, each change logged with before and after", async () => {
    const actor = await organiser();
    const vol = await firstWith("volunteer");
    await updatePerson(actor, { userId: vol.id, roles: ["coordinator", "volunteer"] });
    expect(await rolesOf(vol.id)).toEqual({ roles: ["volunteer", "coordinator"], active: true });
    await updatePerson(actor, { userId: vol.id, active: false });
    expect((await rolesOf(vol.id)).active).toBe(false);
    await updatePerson(actor, { userId: vol.id, active: true });
    const log = await logFor("person", vol.id);
    expect(log.map((l) => [l.before, l.after])).toEqual(
      expect.arrayContaining([
        [{ roles: ["volunteer"], active: true }, { roles: ["volunteer", "coordinator"], active: true }],
        [{ roles: ["volunteer", "coordinator"], active: true }, { roles: ["volunteer", "coordinator"], active: false }],
        [{ roles: ["volunteer", "coordinator"], active: false }, { roles: ["volunteer", "coordinator"], active: true }],
      ]),
    );
  });

  it("the last active organiser can neither lose that role nor be deactivated; with a second organiser they can", async () => {
    const actor = await organiser();
    await expect(updatePerson(actor, { userId: actor.id, roles: ["volunteer"] })).rejects.toMatchObject({ status: 400, fieldErrors: { roles: [expect.stringMatching(/at least one active organiser/)] } });
    await expect(updatePerson(actor, { userId: actor.id, active: false })).rejects.toMatchObject({ status: 400, fieldErrors: { active: [expect.any(String)] } });
    await expect(updatePerson(actor, { userId: actor.id, roles: [] })).rejects.toMatchObject({ status: 400 });
    expect(await rolesOf(actor.id)).toEqual({ roles: ["organiser"], active: true });
    expect(await logFor("person", actor.id)).toHaveLength(0);

    // Adding a role keeps organiser: allowed even for the last one.
    await updatePerson(actor, { userId: actor.id, roles: ["organiser", "volunteer"] });
    const other = await firstWith("coordinator");
    await updatePerson(actor, { userId: other.id, roles: ["coordinator", "organiser"] });
    await updatePerson(actor, { userId: actor.id, roles: ["volunteer"] });
    expect((await rolesOf(actor.id)).roles).toEqual(["volunteer"]);
  });

  it("two organisers stepping each other down at once leave one organiser", async () => {
    const a = await organiser();
    const b = await firstWith("coordinator");
    await updatePerson(a, { userId: b.id, roles: ["organiser"] });
    const results = await Promise.allSettled([updatePerson(a, { userId: b.id, roles: ["volunteer"] }), updatePerson(b, { userId: a.id, roles: ["volunteer"] })]);
    expect(results.filter((r) => r.status === "fulfilled")).toHaveLength(1);
    const [n] = await db().select({ n: sql<number>`count(*)`.mapWith(Number) }).from(users).where(and(holdsRole("organiser"), eq(users.active, true)));
    expect(n!.n).toBe(1);
  });
});

describe("assigning volunteers to transects from either side", () => {
  beforeEach(async () => {
    await resetToDemo();
  });

  it("several volunteers per transect and several transects per volunteer; the volunteer's next reference download has the change", async () => {
    const actor = await organiser();
    const vol = await firstWith("volunteer");
    const others = await db().select({ id: users.id }).from(users).where(and(holdsRole("volunteer"), sql`${users.id} <> ${vol.id}`)).limit(2);
    const all = await db().select({ id: transects.id, code: transects.code }).from(transects).where(eq(transects.active, true));
    const before = await fieldReference(vol);
    const mine = new Set(before.transects.map((t) => t.id));
    const notMine = all.filter((t) => !mine.has(t.id)).slice(0, 2);
    expect(notMine).toHaveLength(2);

    // From the person's side: two more transects.
    const added = await db().transaction((tx) => setAssignments(tx, actor, { userId: vol.id, add: notMine.map((t) => t.id), remove: [] }));
    expect(added).toEqual({ added: 2, removed: 0 });
    // From the transect's side: two more volunteers on the first of them, and this volunteer off it again.
    await db().transaction((tx) => setAssignments(tx, actor, { transectId: notMine[0]!.id, add: others.map((o) => o.id), remove: [vol.id] }));

    const onFirst = await db().select({ userId: transectAssignments.userId }).from(transectAssignments).where(eq(transectAssignments.transectId, notMine[0]!.id));
    expect(onFirst.map((a) => a.userId).sort()).toEqual(others.map((o) => o.id).sort());
    const after = await fieldReference(vol);
    expect(after.transects.map((t) => t.id).sort()).toEqual([...mine, notMine[1]!.id].sort());

    const log = await logFor("assignment", vol.id);
    expect(log.map((l) => l.action).sort()).toEqual(["assign", "assign", "unassign"]);
    expect(log.find((l) => l.action === "unassign")!.before).toMatchObject({ transectId: notMine[0]!.id, transect: notMine[0]!.code });
  });

  it("adding a pair twice changes nothing the second time; a partner, a deactivated volunteer or a retired transect is refused and nothing is written", async () => {
    const actor = await organiser();
    const vol = await firstWith("volunteer");
    const partner = await firstWith("partner");
    const [t] = await db().select().from(transects).where(eq(transects.active, true)).limit(1);
    await db().transaction((tx) => setAssignments(tx, actor, { transectId: t!.id, add: [vol.id], remove: [] }));
    const again = await db().transaction((tx) => setAssignments(tx, actor, { transectId: t!.id, add: [vol.id], remove: [] }));
    expect(again.added).toBe(0);
    const count = async () => (await db().select().from(transectAssignments)).length;
    const logs = async () => (await db().select().from(networkChanges)).length;
    const [n, l] = [await count(), await logs()];

    await expect(db().transaction((tx) => setAssignments(tx, actor, { transectId: t!.id, add: [partner.id, vol.id], remove: [] }))).rejects.toMatchObject({ status: 400 });
    await updatePerson(actor, { userId: vol.id, active: false });
    const l2 = await logs();
    const [t2] = await db().select().from(transects).where(sql`${transects.id} <> ${t!.id}`).limit(1);
    await expect(db().transaction((tx) => setAssignments(tx, actor, { transectId: t2!.id, add: [vol.id], remove: [] }))).rejects.toMatchObject({ status: 400 });
    await updatePerson(actor, { userId: vol.id, active: true });
    await db().update(transects).set({ active: false }).where(eq(transects.id, t2!.id));
    await expect(db().transaction((tx) => setAssignments(tx, actor, { userId: vol.id, add: [t2!.id], remove: [] }))).rejects.toMatchObject({ status: 400 });
    await expect(db().transaction((tx) => setAssignments(tx, actor, { userId: vol.id, transectId: t!.id, add: [], remove: [] }))).rejects.toMatchObject({ status: 400 });
    expect(await count()).toBe(n);
    expect(l2).toBe(l + 1);
    expect(await logs()).toBe(l + 2); // only the deactivation and reactivation
  });
});
