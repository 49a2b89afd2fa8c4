import { randomUUID } from "node:crypto";
import { eq } from "drizzle-orm";
import { beforeEach, describe, expect, it, vi } from "vitest";
import { db } from "@/db/client";
import { invitations, networkChanges, sightings, species, transectAssignments, transects, users, verificationEvents, visits } from "@/db/schema";
import { resetToDemo } from "./support/db";
import { call, demo, userId } from "./transects-helpers";

const session = vi.hoisted(() => ({ userId: null as string | null }));
vi.mock("@/lib/auth/session", () => ({ sessionUserId: async () => session.userId }));

const people = await import("@/app/(network)/api/network/people/route");
const person = await import("@/app/(network)/api/network/people/[id]/route");
const assignments = await import("@/app/(network)/api/network/people/[id]/assignments/route");
const myData = await import("@/app/(account)/api/account/data/route");

describe("the People routes", () => {
  beforeEach(async () => {
    await resetToDemo();
    session.userId = await userId(demo.organiser);
  });

  it("invites with several roles (201), and answers 400 with field messages for no role or an unknown one, writing nothing", async () => {
    const ok = await call(people.POST, { body: { name: "Nia Holt", email: "nia@example.org", roles: ["volunteer", "coordinator"] } });
    expect(ok).toMatchObject({ status: 201, json: { invitation: { email: "nia@example.org", roles: ["volunteer", "coordinator"] } } });
    for (const roles of [[], ["ranger"], "volunteer", undefined]) {
      const refused = await call(people.POST, { body: { name: "Kit Ode", email: "kit@example.org", roles } });
      expect(refused.status, JSON.stringify(roles)).toBe(400);
      expect(refused.json.error.fields).toHaveProperty(Array.isArray(roles) && roles.length ? "roles.0" : "roles");
    }
    expect(await db().select().from(invitations).where(eq(invitations.email, "kit@example.org"))).toHaveLength(0);
    const list = await call(people.GET);
    expect(list.json.invitations).toEqual([expect.objectContaining({ email: "nia@example.org", roles: ["volunteer", "coordinator"] })]);
    expect(list.json.people.find((p: { email: string }) => p.email === demo.volunteer).transects.length).toBeGreaterThan(0);
  });

  it("changes roles and access with PATCH; an empty change or a bad id is a 400, an unknown person a 404", async () => {
    const id = await userId(demo.volunteer);
    expect((await call(person.PATCH, { method: "PATCH", body: { roles: ["volunteer", "partner"] }, params: { id } })).json.person.roles).toEqual(["volunteer", "partner"]);
    expect((await call(person.PATCH, { method: "PATCH", body: {}, params: { id } })).status).toBe(400);
    expect((await call(person.PATCH, { method: "PATCH", body: { active: "no" }, params: { id } })).status).toBe(400);
    expect((await call(person.PATCH, { method: "PATCH", body: { active: false }, params: { id: "x" } })).status).toBe(400);
    expect((await call(person.PATCH, { method: "PATCH", body: { active: false }, params: { id: randomUUID() } })).status).toBe(404);
    const organiserId = await userId(demo.organiser);
    const last = await call(person.PATCH, { method: "PATCH", body: { roles: ["volunteer"] }, params: { id: organiserId } });
    expect(last).toMatchObject({ status: 400, json: { error: { fields: { roles: [expect.stringMatching(/active organiser/)] } } } });
  });

  it("a person's page data: their transects and this season's walks, a walk with nothing seen included", async () => {
    const id = await userId(demo.volunteer);
    const [t] = await db().select({ transectId: transectAssignments.transectId }).from(transectAssignments).where(eq(transectAssignments.userId, id)).limit(1);
    const detail = await call(person.GET, { params: { id } });
    expect(detail.status).toBe(200);
    expect(detail.json.transects.map((x: { id: string }) => x.id)).toContain(t!.transectId);
    const season = detail.json.season;
    expect(season).not.toBeNull();
    const walks = await db().select().from(visits).where(eq(visits.volunteerId, id));
    expect(detail.json.walks).toHaveLength(walks.filter((w) => w.seasonId === season.id).length);
  });

  it("assigns from the person's side through the route, logged; a retired transect is refused with a field message", async () => {
    const id = await userId(demo.volunteer);
    const mine = new Set((await db().select().from(transectAssignments).where(eq(transectAssignments.userId, id))).map((a) => a.transectId));
    const [other] = (await db().select().from(transects).where(eq(transects.active, true))).filter((t) => !mine.has(t.id));
    const added = await call(assignments.POST, { body: { add: [other!.id] }, params: { id } });
    expect(added).toMatchObject({ status: 200, json: { added: 1, removed: 0 } });
    const [log] = await db().select().from(networkChanges).where(eq(networkChanges.entity, "assignment"));
    expect(log).toMatchObject({ entityId: id, action: "assign" });
    await db().update(transects).set({ active: false }).where(eq(transects.id, other!.id));
    const [another] = (await db().select().from(transects).where(eq(transects.active, true))).filter((t) => !mine.has(t.id));
    await db().update(transects).set({ active: false }).where(eq(transects.id, another!.id));
    const refused = await call(assignments.POST, { body: { add: [another!.id] }, params: { id } });
    expect(refused).toMatchObject({ status: 400, json: { error: { fields: { add: [expect.stringMatching(/retired/)] } } } });
    expect((await call(assignments.POST, { body: { add: [other!.id], remove: [other!.id] }, params: { id } })).status).toBe(400);
    // Taking someone off a retired transect is still allowed.
    expect((await call(assignments.POST, { body: { remove: [other!.id] }, params: { id } })).json).toEqual({ added: 0, removed: 1 });
  });
});

describe("downloading one's own data", () => {
  beforeEach(async () => {
    await resetToDemo();
  });

  it("gives every person their profile, walks with sightings and conversations, and messages, as a JSON file, and nobody else's", async () => {
    const id = await userId(demo.volunteer);
    const checker = await userId(demo.coordinator);
    const [walk] = await db().select().from(visits).where(eq(visits.volunteerId, id)).limit(1);
    const [taxon] = await db().select().from(species).limit(1);
    const seen = randomUUID();
    await db().insert(sightings).values({ id: seen, visitId: walk!.id, speciesId: taxon!.id, count: 2, note: "by the gate" });
    await db().insert(verificationEvents).values([
      { sightingId: seen, actorId: checker, action: "query", message: "Which gate?", createdAt: new Date("2024-06-01T10:00:00Z") },
      { sightingId: seen, actorId: id, action: "reply", message: "The north one", createdAt: new Date("2024-06-01T11:00:00Z") },
    ]);
    session.userId = id;
    const response = await myData.GET(new Request("http://localhost/api/account/data"), { params: Promise.resolve({}) });
    expect(response.status).toBe(200);
    expect(response.headers.get("content-disposition")).toMatch(/^attachment; filename="turnstone-my-data-\d{4}-\d{2}-\d{2}\.json"$/);
    const data = JSON.parse(await response.text());
    expect(data.profile).toMatchObject({ id, email: demo.volunteer, roles: ["volunteer"], pseudonym: expect.stringMatching(/^Recorder /) });
    expect(data.walks).toHaveLength((await db().select().from(visits).where(eq(visits.volunteerId, id))).length);
    const mine = data.walks.find((w: { id: string }) => w.id === walk!.id).sightings.find((s: { id: string }) => s.id === seen);
    expect(mine).toMatchObject({ note: "by the gate", count: 2, scientificName: taxon!.scientificName });
    expect(mine.conversation.map((c: { from: string; message: string }) => [c.from, c.message])).toEqual([
      ["a reviewer", "Which gate?"],
      ["you", "The north one"],
    ]);
    expect(data.messagesYouWrote.map((m: { message: string }) => m.message)).toEqual(["The north one"]);
    expect(JSON.stringify(data)).not.toContain(demo.coordinator);
    const [them] = await db().select({ name: users.name }).from(users).where(eq(users.id, checker));
    expect(JSON.stringify(data)).not.toContain(them!.name);

    for (const who of [demo.partner, demo.organiser, demo.coordinator]) {
      session.userId = await userId(who);
      const theirs = JSON.parse(await (await myData.GET(new Request("http://localhost/api/account/data"), { params: Promise.resolve({}) })).text());
      expect(theirs.profile.email, who).toBe(who);
    }
    session.userId = null;
    expect((await myData.GET(new Request("http://localhost/api/account/data"), { params: Promise.resolve({}) })).status).toBe(401);
  });
});
