import { randomUUID } from "node:crypto";
import { and, asc, eq, gte } from "drizzle-orm";
import { beforeEach, describe, expect, it } from "vitest";
import { db } from "@/db/client";
import { seasons, sightings, species, speciesMerges, transectAssignments, transectRouteVersions, transects, users, visits } from "@/db/schema";
import type { Actor } from "@/lib/auth/guard";
import { applySyncBatch } from "@/lib/sync/apply-batch";
import { resetToDemo } from "./support/db";

// The sync against the season rules, route versions, retired transects and merged species, on
// the demo network (an open season containing the seed day, last year's closed and frozen).

const DAY = 86_400_000;
const addDays = (day: string, n: number) => new Date(Date.parse(`${day}T00:00:00Z`) + n * DAY).toISOString().slice(0, 10);

const visitOf = (transectId: string, visitDate: string, over: Record<string, unknown> = {}) => ({
  id: randomUUID(), transectId, visitDate, startTime: "10:30", completeList: true, clientUpdatedAt: `${visitDate}T11:50:00.000Z`, ...over,
});
const sightingOf = (visitId: string, speciesId: string, over: Record<string, unknown> = {}) => ({
  id: randomUUID(), visitId, speciesId, count: 2, section: 1, clientUpdatedAt: new Date().toISOString(), ...over,
});

describe("sync and the seasons", () => {
  let actor: Actor;
  let transect: { id: string; sectionCount: number };
  let open: typeof seasons.$inferSelect;
  let closed: typeof seasons.$inferSelect;
  let speciesId: string;

  beforeEach(async () => {
    await resetToDemo();
    const [u] = await db().select().from(users).where(eq(users.email, "volunteer01@harrowmere.example"));
    actor = { id: u!.id, roles: u!.roles, name: u!.name, email: u!.email };
    [transect] = await db()
      .select({ id: transects.id, sectionCount: transects.sectionCount })
      .from(transectAssignments)
      .innerJoin(transects, eq(transects.id, transectAssignments.transectId))
      .where(and(eq(transectAssignments.userId, actor.id), gte(transects.sectionCount, 5)))
      .orderBy(asc(transects.code))
      .limit(1) as [typeof transect];
    [open] = (await db().select().from(seasons).where(eq(seasons.status, "open"))) as [typeof open];
    [closed] = (await db().select().from(seasons).where(eq(seasons.status, "closed"))) as [typeof closed];
    [{ id: speciesId }] = await db().select({ id: species.id }).from(species).orderBy(asc(species.sortOrder)).limit(1) as [{ id: string }];
  });

  it("refuses a walk dated in a frozen season or one still planning, with the reason on visitDate; takes one in grace", async () => {
    const frozenWalk = visitOf(transect.id, closed.startsOn);
    const refused = await applySyncBatch(actor, { visits: [frozenWalk], sightings: [sightingOf(frozenWalk.id, speciesId)] });
    expect(refused.status).toBe(400);
    expect(refused.response.results[0]).toMatchObject({ status: "invalid", reason: expect.stringMatching(/closed and its grace period is over/) });
    expect(refused.response.results[0]!.errors?.visitDate).toHaveLength(1);
    expect(refused.response.results[1]).toMatchObject({ status: "invalid", reason: "Turnstone does not have this sighting's walk." });

    const [planned] = await db().insert(seasons).values({ name: "Planned season", startsOn: addDays(open.endsOn, 1), endsOn: addDays(open.endsOn, 30) }).returning();
    const early = await applySyncBatch(actor, { visits: [visitOf(transect.id, planned!.startsOn)] });
    expect(early.response.results[0]).toMatchObject({ status: "invalid" });

    await db().update(seasons).set({ closedAt: new Date(Date.now() - DAY) }).where(eq(seasons.id, closed.id));
    const late = visitOf(transect.id, closed.startsOn);
    const taken = await applySyncBatch(actor, { visits: [late] });
    expect(taken.response.results[0]!.status).toBe("created");
    const [stored] = await db().select().from(visits).where(eq(visits.id, late.id));
    expect(stored!.seasonId).toBe(closed.id);
  });

  it("keeps the server's copy of a stored walk once its season is frozen: edits and new sightings are kept-server", async () => {
    const [old] = await db().select().from(visits).where(and(eq(visits.seasonId, closed.id), eq(visits.volunteerId, actor.id))).limit(1);
    const resend = {
      id: old!.id, transectId: old!.transectId, visitDate: old!.visitDate, startTime: old!.startTime.slice(0, 5), completeList: old!.completeList,
      notes: "Changed my mind", clientUpdatedAt: new Date().toISOString(),
    };
    const added = sightingOf(old!.id, speciesId);
    const { response } = await applySyncBatch(actor, { visits: [resend], sightings: [added] });
    expect(response.results.map((r) => r.status)).toEqual(["kept-server", "kept-server"]);
    expect(response.results[0]!.reason).toMatch(/grace period is over/);
    const [after] = await db().select().from(visits).where(eq(visits.id, old!.id));
    expect(after!.notes).toBe(old!.notes);
    expect(await db().select().from(sightings).where(eq(sightings.id, added.id))).toHaveLength(0);
  });

  it("checks a sighting's section against the route version on its walk's date, in the batch and stored", async () => {
    const changedOn = addDays(open.startsOn, 1);
    const [v1] = await db().select().from(transectRouteVersions).where(eq(transectRouteVersions.transectId, transect.id));
    await db().insert(transectRouteVersions).values({ transectId: transect.id, version: 2, validFrom: changedOn, route: v1!.route, sectionCount: 3, lengthMetres: v1!.lengthMetres });
    await db().update(transects).set({ sectionCount: 3 }).where(eq(transects.id, transect.id));

    // An old walk, sent late after the route lost sections, keeps its version: section 5 stands.
    const oldWalk = visitOf(transect.id, open.startsOn);
    const newWalk = visitOf(transect.id, changedOn);
    const { response } = await applySyncBatch(actor, {
      visits: [oldWalk, newWalk],
      sightings: [sightingOf(oldWalk.id, speciesId, { section: 5 }), sightingOf(newWalk.id, speciesId, { section: 5 })],
    });
    expect(response.results.map((r) => r.status)).toEqual(["created", "created", "created", "invalid"]);
    expect(response.results[3]!.errors?.section).toEqual(["This transect has 3 sections."]);

    // The same for sightings sent in a later batch, against the walks now stored.
    const later = await applySyncBatch(actor, { sightings: [sightingOf(oldWalk.id, speciesId, { section: 5 }), sightingOf(newWalk.id, speciesId, { section: 4 })] });
    expect(later.response.results.map((r) => r.status)).toEqual(["created", "invalid"]);
  });

  it("takes no new walks on a retired transect", async () => {
    await db().update(transects).set({ active: false }).where(eq(transects.id, transect.id));
    const { status, response } = await applySyncBatch(actor, { visits: [visitOf(transect.id, open.startsOn)] });
    expect(status).toBe(403);
    expect(response.results[0]).toMatchObject({ status: "forbidden", reason: "You are not assigned to that transect." });
  });

  it("re-points a sighting of a species merged away to the species kept", async () => {
    const goneId = randomUUID();
    await db().insert(speciesMerges).values({ fromSpeciesId: goneId, fromScientificName: "Thymelicus vetus", intoSpeciesId: speciesId });
    const walk = visitOf(transect.id, open.startsOn);
    const s = sightingOf(walk.id, goneId);
    const { status, response } = await applySyncBatch(actor, { visits: [walk], sightings: [s] });
    expect(status).toBe(200);
    expect(response.results.map((r) => r.status)).toEqual(["created", "created"]);
    const [stored] = await db().select().from(sightings).where(eq(sightings.id, s.id));
    expect(stored!.speciesId).toBe(speciesId);
    // A species that never existed is still refused.
    const unknown = await applySyncBatch(actor, { sightings: [sightingOf(walk.id, randomUUID())] });
    expect(unknown.response.results[0]!.errors?.speciesId).toEqual(["That species is not on the checklist."]);
  });
});
