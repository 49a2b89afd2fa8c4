import { randomUUID } from "node:crypto";
import { asc, eq, sql } from "drizzle-orm";
import { beforeAll, beforeEach, describe, expect, it, vi } from "vitest";
import { db } from "@/db/client";
import { networkChanges, sightings, species, transectRouteVersions, transects, visits } from "@/db/schema";
import { latestRecordDate } from "@/lib/validation/fields";
import { routeChangedBetween, routesChangedBetween, routeVersionOn, sectionCountOn, sectionCountOnSql, versionSpansOf } from "@/lib/queries/transects";
import { resetToDemo } from "./support/db";
import { call, demo, details, habitatId, tableCounts, userId } from "./transects-helpers";

const session = vi.hoisted(() => ({ userId: null as string | null }));
vi.mock("@/lib/auth/session", () => ({ sessionUserId: async () => session.userId }));

const list = await import("@/app/(network)/api/network/transects/route");
const versionsRoute = await import("@/app/(network)/api/network/transects/[id]/versions/route");

const day = (offset: number) => new Date(Date.now() + offset * 86_400_000).toISOString().slice(0, 10);
const today = day(0);
const tomorrow = latestRecordDate();
// Five sections going north from the same start, 0.001° (111 m) each.
const sections = (n: number, step = 0.001) => Array.from({ length: n }, (_, i) => ({ coordinates: [[-1.25, 51 + i * step], [-1.25, 51 + (i + 1) * step]] }));

describe("route versions", () => {
  let id: string;
  let volunteer: string;
  let speciesId: string;

  async function walk(date: string, section: number) {
    const visitId = randomUUID();
    await db().insert(visits).values({ id: visitId, transectId: id, volunteerId: volunteer, visitDate: date, startTime: "11:00:00" });
    await db().insert(sightings).values({ id: randomUUID(), visitId, speciesId, count: 1, section });
    return visitId;
  }

  beforeAll(async () => {
    await resetToDemo();
    session.userId = await userId(demo.organiser);
    volunteer = await userId(demo.volunteer);
    [{ id: speciesId }] = (await db().select({ id: species.id }).from(species).orderBy(asc(species.sortOrder)).limit(1)) as [{ id: string }];
    const created = await call(list.POST, { body: { ...details(await habitatId("WET"), "VER-01"), route: { sections: sections(5) } } });
    expect(created.status).toBe(201);
    id = created.json.transect.id;
  });

  beforeEach(async () => {
    session.userId = await userId(demo.organiser);
  });

  it("a route change from a date creates version 2; the transect shows it; an earlier walk keeps version 1", async () => {
    // Walked today on the five-section route, in section 5.
    await walk(today, 5);
    const { status, json } = await call(versionsRoute.POST, { params: { id }, body: { validFrom: tomorrow, route: { sections: sections(3, 0.002) } } });
    expect(status).toBe(201);
    expect(json.version).toMatchObject({ version: 2, validFrom: tomorrow, unchanged: false });

    const [row] = await db().select().from(transects).where(eq(transects.id, id));
    expect(row).toMatchObject({ sectionCount: 3, lengthMetres: json.version.lengthMetres });
    // Today's walk (sent late or not) is checked against the route it was walked on.
    expect(await sectionCountOn(id, today)).toBe(5);
    expect((await routeVersionOn(id, today))?.version).toBe(1);
    expect(await sectionCountOn(id, tomorrow)).toBe(3);
    // Walks from before Turnstone (imported seasons) use the first route.
    expect(await sectionCountOn(id, "2019-06-01")).toBe(5);
    expect((await versionSpansOf([id])).get(id)?.map((v) => v.version).sort()).toEqual([1, 2]);
    // The SQL form gives every walk the same answer.
    const [inSql] = await db().execute<{ today: number; tomorrow: number; early: number }>(sql`select
      ${sectionCountOnSql(sql`${id}::uuid`, sql`${today}::date`)} as today,
      ${sectionCountOnSql(sql`${id}::uuid`, sql`${tomorrow}::date`)} as tomorrow,
      ${sectionCountOnSql(sql`${id}::uuid`, sql`'2019-06-01'::date`)} as early`);
    expect(inSql).toEqual({ today: 5, tomorrow: 3, early: 5 });

    const log = await db().select().from(networkChanges).where(eq(networkChanges.entityId, id)).orderBy(asc(networkChanges.createdAt));
    expect(log.map((l) => l.action)).toEqual(["create", "new-route"]);
    expect(log[1]!.before).toMatchObject({ routeVersion: 1, sectionCount: 5 });
    expect(log[1]!.after).toMatchObject({ routeVersion: 2, sectionCount: 3, validFrom: tomorrow });
  });

  it("the same date again corrects that version instead of adding one", async () => {
    const { status, json } = await call(versionsRoute.POST, { params: { id }, body: { validFrom: tomorrow, route: { sections: sections(4, 0.0015) } } });
    expect(status).toBe(201);
    expect(json.version).toMatchObject({ version: 2, validFrom: tomorrow });
    const versions = await db().select().from(transectRouteVersions).where(eq(transectRouteVersions.transectId, id));
    expect(versions.map((v) => [v.version, v.sectionCount]).sort()).toEqual([[1, 5], [2, 4]]);
    const [last] = await db().select().from(networkChanges).where(eq(networkChanges.entityId, id)).orderBy(asc(networkChanges.createdAt)).offset(2);
    expect(last?.action).toBe("correct-route");
  });

  it("sending the current route again changes nothing", async () => {
    const before = await tableCounts();
    const { status, json } = await call(versionsRoute.POST, { params: { id }, body: { validFrom: tomorrow, route: { sections: sections(4, 0.0015) } } });
    expect(status).toBe(200);
    expect(json.version.unchanged).toBe(true);
    expect(await tableCounts()).toEqual(before);
  });

  it("refuses a version starting before the latest one, and writes nothing", async () => {
    const before = await tableCounts();
    const { status, json } = await call(versionsRoute.POST, { params: { id }, body: { validFrom: today, route: { sections: sections(2) } } });
    expect(status).toBe(400);
    expect(json.error.fields.validFrom).toEqual([expect.stringMatching(/Route version 2 starts on .*: a new route must start after it/)]);
    expect(await tableCounts()).toEqual(before);
  });

  it("refuses a route with fewer sections than sightings from that date on use, and writes nothing", async () => {
    await walk(tomorrow, 4);
    const before = await tableCounts();
    const { status, json } = await call(versionsRoute.POST, { params: { id }, body: { validFrom: tomorrow, route: { sections: sections(2) } } });
    expect(status).toBe(400);
    expect(json.error.fields.route).toEqual([expect.stringMatching(/1 sighting on walks from .* is in sections up to 4, but the new route has 2/)]);
    expect(await tableCounts()).toEqual(before);
  });

  it("refuses a bad route or date in a change, writing nothing", async () => {
    const before = await tableCounts();
    const gap = await call(versionsRoute.POST, { params: { id }, body: { validFrom: tomorrow, route: { sections: [sections(1)[0], { coordinates: [[-1.25, 51.01], [-1.25, 51.02]] }] } } });
    expect(gap.json.error.fields.route).toEqual([expect.stringMatching(/without gaps/)]);
    const future = await call(versionsRoute.POST, { params: { id }, body: { validFrom: day(30), route: { sections: sections(5) } } });
    expect(future.json.error.fields.validFrom).toEqual([expect.stringMatching(/Must be a date between/)]);
    const badId = await call(versionsRoute.POST, { params: { id: "not-a-uuid" }, body: { validFrom: tomorrow, route: { sections: sections(5) } } });
    expect(badId.status).toBe(400);
    const missing = await call(versionsRoute.POST, { params: { id: randomUUID() }, body: { validFrom: tomorrow, route: { sections: sections(5) } } });
    expect(missing.status).toBe(404);
    expect(await tableCounts()).toEqual(before);
  });

  it("flags the route as changed between two seasons that span the change, and not otherwise", async () => {
    const lastYear = { startsOn: day(-400), endsOn: day(-200) };
    const thisYear = { startsOn: day(-30), endsOn: day(100) };
    const longAgo = { startsOn: "2019-04-01", endsOn: "2019-09-30" };
    expect(await routeChangedBetween(id, lastYear, thisYear)).toBe(true);
    expect(await routeChangedBetween(id, longAgo, lastYear)).toBe(false);
    const changed = await routesChangedBetween(lastYear, thisYear);
    expect(changed.has(id)).toBe(true);
    // The demo's transects have had one route each.
    expect(changed.size).toBe(1);
  });
});
