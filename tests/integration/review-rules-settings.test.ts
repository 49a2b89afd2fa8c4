import { randomUUID } from "node:crypto";
import { and, eq, sql } from "drizzle-orm";
import { beforeAll, beforeEach, describe, expect, it, vi } from "vitest";
import { db } from "@/db/client";
import { networkChanges, networkSettings, seasons, sightings, species, visits } from "@/db/schema";
import { DEFAULT_WALK_RULES, type WalkRules } from "@/lib/review/walk-rules";
import { DEFAULT_WARNING_RULES, type WarningRules } from "@/lib/review/warning-rules";
import { resetToDemo } from "./support/db";
import { call, demo, userId } from "./transects-helpers";

// PUT /api/network/settings/review-rules against the demo network (last year's season closed with
// confirmed sightings, this year's open), called as a handler; only Auth.js's cookie decoding is
// replaced. Saving judges every stored walk and sighting again in the same transaction.
const session = vi.hoisted(() => ({ userId: null as string | null }));
vi.mock("@/lib/auth/session", () => ({ sessionUserId: async () => session.userId }));

const rulesRoute = await import("@/app/(network)/api/network/settings/review-rules/route");
const put = (body: unknown) => call(rulesRoute.PUT, { method: "PUT", body });

const stored = async () => (await db().select({ walkRules: networkSettings.walkRules, warningRules: networkSettings.warningRules, updatedAt: networkSettings.updatedAt }).from(networkSettings))[0]!;
const ruleLogs = () => db().select().from(networkChanges).where(and(eq(networkChanges.entity, "settings"), eq(networkChanges.entityId, "review_rules")));
const breachesOf = async (id: string) => (await db().select({ b: visits.ruleBreaches }).from(visits).where(eq(visits.id, id)))[0]!.b;
const warningsOf = async (id: string) => (await db().select({ w: sightings.warnings }).from(sightings).where(eq(sightings.id, id)))[0]!.w;
/** Every walk's and sighting's marks, to see that a refused save changed none. */
const allMarks = async () => {
  const [row] = await db().execute<{ walks: string; sightings: string }>(sql`
    select (select md5(coalesce(string_agg(id::text || rule_breaches::text, ',' order by id), '')) from visits) as walks,
           (select md5(coalesce(string_agg(id::text || warnings::text, ',' order by id), '')) from sightings) as sightings`);
  return row!;
};

const stricter: { walkRules: WalkRules; warningRules: WarningRules } = {
  walkRules: { ...DEFAULT_WALK_RULES, maxWindBeaufort: 4 },
  warningRules: { ...DEFAULT_WARNING_RULES, firstRecordMinSeasons: 1 },
};

describe("PUT /api/network/settings/review-rules", () => {
  let windy: string; // a walk in force 5: inside the defaults, outside force 4
  let newcomer: string; // a sighting of a species never confirmed on its transect
  let organiser: string;

  beforeAll(async () => {
    await resetToDemo();
    organiser = await userId(demo.organiser);
    // A walk of this season on a transect with confirmed sightings last year, and on it a species new to the checklist.
    const [open] = await db().select().from(seasons).where(eq(seasons.status, "open"));
    const [walk] = await db().execute<{ id: string; transect_id: string; volunteer_id: string; visit_date: string }>(sql`
      select v.id, v.transect_id, v.volunteer_id, v.visit_date::text from visits v
      where v.season_id = ${open!.id}
        and exists (select 1 from transect_species_seasons t join seasons s on s.id = t.season_id where t.transect_id = v.transect_id and s.starts_on < ${open!.startsOn})
      order by v.id limit 1`);
    windy = randomUUID();
    await db().insert(visits).values({ id: windy, transectId: walk!.transect_id, volunteerId: walk!.volunteer_id, seasonId: open!.id, visitDate: walk!.visit_date, startTime: "11:00", windBeaufort: 5, completeList: true });
    const [sp] = await db().insert(species).values({ scientificName: "Testus novus", vernacularName: "Newcomer", taxonGroup: "butterflies" }).returning();
    newcomer = randomUUID();
    await db().insert(sightings).values({ id: newcomer, visitId: walk!.id, speciesId: sp!.id, count: 1 });
  });

  beforeEach(() => {
    session.userId = organiser;
  });

  it("refuses reviewers and volunteers with 403, and changes nothing", async () => {
    const before = { settings: await stored(), marks: await allMarks(), logs: (await ruleLogs()).length };
    for (const who of [demo.coordinator, demo.volunteer, demo.partner]) {
      session.userId = await userId(who);
      const { status, json } = await put(stricter);
      expect(status, who).toBe(403);
      expect(json.error.code).toBe("forbidden");
    }
    session.userId = null;
    expect((await put(stricter)).status).toBe(401);
    expect(await stored()).toEqual(before.settings);
    expect(await allMarks()).toEqual(before.marks);
    expect(await ruleLogs()).toHaveLength(before.logs);
  });

  it("answers bad input with 400 and a message on each field, and changes nothing", async () => {
    const before = { settings: await stored(), marks: await allMarks(), logs: (await ruleLogs()).length };
    const cases: [unknown, string[]][] = [
      [{ ...stricter, walkRules: { ...stricter.walkRules, windowStart: "15:00", windowEnd: "14:00" } }, ["walkRules.windowEnd"]],
      [{ ...stricter, walkRules: { ...stricter.walkRules, windowStart: "10.45" } }, ["walkRules.windowStart"]],
      [{ ...stricter, walkRules: { ...stricter.walkRules, maxWindBeaufort: 13, coolSunshinePercent: 101 } }, ["walkRules.coolSunshinePercent", "walkRules.maxWindBeaufort"]],
      [{ ...stricter, walkRules: { ...stricter.walkRules, coolMinimumC: 18 } }, ["walkRules.warmEnoughC"]],
      [{ ...stricter, walkRules: { ...stricter.walkRules, rainAllowed: "no" } }, ["walkRules.rainAllowed"]],
      [{ ...stricter, warningRules: { countFactor: 0, countMinimum: 2.5, firstRecordMinSeasons: 0 } }, ["warningRules.countFactor", "warningRules.countMinimum", "warningRules.firstRecordMinSeasons"]],
      [{ walkRules: stricter.walkRules }, ["warningRules"]],
    ];
    for (const [body, fields] of cases) {
      const { status, json } = await put(body);
      expect(status, JSON.stringify(body)).toBe(400);
      expect(json.error.code).toBe("invalid");
      expect(Object.keys(json.error.fields).sort(), JSON.stringify(body)).toEqual(fields);
      for (const messages of Object.values(json.error.fields) as string[][]) expect(messages[0]).toMatch(/\S/);
    }
    expect((await call(rulesRoute.PUT, { method: "PUT", rawBody: "{walkRules" })).status).toBe(400);
    expect(await stored()).toEqual(before.settings);
    expect(await allMarks()).toEqual(before.marks);
    expect(await ruleLogs()).toHaveLength(before.logs);
  });

  it("saves, logs the change, and judges stored walks and sightings again by the new numbers", async () => {
    expect(await breachesOf(windy)).toEqual([]);
    expect(await warningsOf(newcomer)).toEqual([]);
    // What the save should re-mark, counted independently beforehand.
    const [expected] = await db().execute<{ walks: number; sightings: number }>(sql`
      select (select count(*)::int from visits v where v.rule_breaches is distinct from
                walk_rule_breaches(v.start_time, v.end_time, v.temperature_c, v.sunshine_percent, v.wind_beaufort, v.rain, ${JSON.stringify(stricter.walkRules)}::jsonb)) as walks,
             (select count(*)::int from sightings s where exists (
                select 1 from visits v join seasons se on se.id = v.season_id
                where v.id = s.visit_id and not exists (
                  select 1 from transect_species_seasons t join seasons e on e.id = t.season_id
                  where t.transect_id = v.transect_id and t.species_id = s.species_id and e.starts_on < se.starts_on)
                and exists (
                  select 1 from transect_species_seasons t join seasons e on e.id = t.season_id
                  where t.transect_id = v.transect_id and e.starts_on < se.starts_on))) as sightings`);
    expect(expected!.walks).toBeGreaterThan(0);

    const { status, json } = await put(stricter);
    expect(status).toBe(200);
    expect(json).toMatchObject({ ...stricter, walksRejudged: expected!.walks });
    expect(json.sightingsRejudged).toBeGreaterThanOrEqual(1);
    expect(json.sightingsRejudged).toBe(expected!.sightings);
    expect(await stored()).toMatchObject(stricter);
    expect(await breachesOf(windy)).toEqual(["too_windy"]);
    expect(await warningsOf(newcomer)).toEqual(["first_on_transect"]);
    // Nothing left judged by the old numbers.
    const [left] = await db().execute<{ walks: number; sightings: number }>(sql`
      select (select count(*)::int from visits where rule_breaches is distinct from walk_rule_breaches(start_time, end_time, temperature_c, sunshine_percent, wind_beaufort, rain, network_walk_rules())) as walks,
             (select count(*)::int from sightings where warnings is distinct from sighting_warning_kinds(id, visit_id, species_id, count)) as sightings`);
    expect(left).toEqual({ walks: 0, sightings: 0 });

    const logs = await ruleLogs();
    expect(logs).toHaveLength(1);
    expect(logs[0]).toMatchObject({ actorId: organiser, action: "update", before: { walkRules: DEFAULT_WALK_RULES, warningRules: DEFAULT_WARNING_RULES }, after: stricter });
    expect(logs[0]!.summary).toContain("strongest wind (Beaufort) 5 → 4");
    expect(logs[0]!.summary).toContain("first on a transect: earlier seasons needed 2 → 1");

    // The organiser reads them back; a reviewer may not. The same rules saved again change and log nothing.
    expect((await call(rulesRoute.GET)).json).toEqual(stricter);
    session.userId = await userId(demo.coordinator);
    expect((await call(rulesRoute.GET)).status).toBe(403);
    session.userId = organiser;
    expect((await put(stricter)).json).toMatchObject({ walksRejudged: 0, sightingsRejudged: 0 });
    expect(await ruleLogs()).toHaveLength(1);

    // Back to the starting values: the marks go with them.
    const back = await put({ walkRules: DEFAULT_WALK_RULES, warningRules: DEFAULT_WARNING_RULES });
    expect(back.json).toMatchObject({ walksRejudged: expected!.walks, sightingsRejudged: expected!.sightings });
    expect(await breachesOf(windy)).toEqual([]);
    expect(await warningsOf(newcomer)).toEqual([]);
    expect(await ruleLogs()).toHaveLength(2);
  });

  it("keeps a walk's later edits judged by the saved rules (the trigger reads them)", async () => {
    await put({ walkRules: { ...DEFAULT_WALK_RULES, rainAllowed: true }, warningRules: DEFAULT_WARNING_RULES });
    await db().update(visits).set({ rain: "heavy" }).where(eq(visits.id, windy));
    expect(await breachesOf(windy)).toEqual([]);
    await put({ walkRules: DEFAULT_WALK_RULES, warningRules: DEFAULT_WARNING_RULES });
    expect(await breachesOf(windy)).toEqual(["rain"]);
  });
});
