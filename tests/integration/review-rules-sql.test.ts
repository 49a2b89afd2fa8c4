import { randomUUID } from "node:crypto";
import { and, eq, sql } from "drizzle-orm";
import { beforeAll, describe, expect, it } from "vitest";
import { db } from "@/db/client";
import { habitatGroups, networkSettings, photos, seasons, sightings, species, transects, users, visits } from "@/db/schema";
import { DEFAULT_WALK_RULES, walkRuleBreaches, type WalkConditions, type WalkRules } from "@/lib/review/walk-rules";
import { DEFAULT_WARNING_RULES } from "@/lib/review/warning-rules";
import { sightingWarningKinds, type SightingFacts } from "@/lib/review/warnings";
import { otherRuleCases, otherRules, walkRuleCases } from "../unit/review-rule-cases";
import { resetToDemo } from "./support/db";

// The review rules live twice: in TypeScript (lib/review/walk-rules.ts, warnings.ts: the phone's
// warnings, the screens, the unit tests) and in SQL (drizzle/0008: walk_rule_breaches and
// sighting_warning_kinds, kept in visits.rule_breaches and sightings.warnings by triggers so the
// queue can filter by them). This holds the two equal: the unit tests' boundary cases run
// through both, the SQL defaults are the TypeScript ones, and the triggers give a sighting the
// warnings the TypeScript rule gives the same facts. The walk rules' defaults are from memory
// (see lib/review/walk-rules.ts).

class Rollback extends Error {}

/** Runs fn in a transaction that is always rolled back, and returns what it returned. */
async function rolledBack<T>(fn: (tx: Parameters<Parameters<ReturnType<typeof db>["transaction"]>[0]>[0]) => Promise<T>): Promise<T> {
  let out: T | undefined;
  await db()
    .transaction(async (tx) => {
      out = await fn(tx);
      throw new Rollback();
    })
    .catch((e: unknown) => {
      if (!(e instanceof Rollback)) throw e;
    });
  return out as T;
}

async function sqlBreaches(rules: WalkRules, c: WalkConditions): Promise<string[]> {
  const [row] = await db().execute<{ breaches: string[] }>(sql`
    select walk_rule_breaches(${c.startTime}::time, ${c.endTime}::time, ${c.temperatureC}::double precision,
      ${c.sunshinePercent}::smallint, ${c.windBeaufort}::smallint, ${c.rain}::rain, ${JSON.stringify(rules)}::jsonb) as breaches`);
  return row!.breaches;
}

beforeAll(async () => {
  await resetToDemo();
});

describe("walk_rule_breaches agrees with walkRuleBreaches", () => {
  it.each(walkRuleCases)("default rules: %s", async (_what, conditions, breaches) => {
    const inSql = await sqlBreaches(DEFAULT_WALK_RULES, conditions);
    expect(inSql).toEqual(walkRuleBreaches(DEFAULT_WALK_RULES, conditions));
    expect(inSql).toEqual(breaches);
  });

  it.each(otherRuleCases)("a network's own rules: %s", async (_what, conditions, breaches) => {
    const inSql = await sqlBreaches(otherRules, conditions);
    expect(inSql).toEqual(walkRuleBreaches(otherRules, conditions));
    expect(inSql).toEqual(breaches);
  });

  it("a stored walk gets the same breaches from the trigger, with the network's rules", async () => {
    const [v] = await db().select({ transectId: visits.transectId, volunteerId: visits.volunteerId, seasonId: visits.seasonId, visitDate: visits.visitDate }).from(visits).limit(1);
    for (const [what, c, breaches] of walkRuleCases.filter(([, c]) => c.startTime !== null)) {
      const id = randomUUID();
      const endTime = c.endTime && c.endTime < c.startTime! ? null : c.endTime; // the table keeps times in order
      const [row] = await db().insert(visits).values({ id, ...v!, ...c, startTime: c.startTime!, endTime }).returning({ ruleBreaches: visits.ruleBreaches });
      expect(row!.ruleBreaches, what).toEqual(walkRuleBreaches(DEFAULT_WALK_RULES, { ...c, endTime }));
      if (endTime === c.endTime) expect(row!.ruleBreaches, what).toEqual(breaches);
      await db().delete(visits).where(eq(visits.id, id));
    }
  });
});

describe("the SQL defaults are the TypeScript defaults", () => {
  it("network_walk_rules() and network_warning_rules() with no settings row", async () => {
    const got = await rolledBack(async (tx) => {
      await tx.delete(networkSettings);
      const [row] = await tx.execute<{ walk: unknown; warning: unknown }>(sql`select network_walk_rules() as walk, network_warning_rules() as warning`);
      return row!;
    });
    expect(got.walk).toEqual(DEFAULT_WALK_RULES);
    expect(got.warning).toEqual(DEFAULT_WARNING_RULES);
  });

  it("a new settings row's column defaults, and the functions read the row when there is one", async () => {
    const got = await rolledBack(async (tx) => {
      await tx.delete(networkSettings);
      await tx.execute(sql`insert into network_settings (id, name, taxon_group) values (1, 'Defaults', 'butterflies')`);
      const [fresh] = await tx.execute<{ walk: unknown; warning: unknown }>(sql`select walk_rules as walk, warning_rules as warning from network_settings`);
      await tx.update(networkSettings).set({ walkRules: otherRules, warningRules: { countFactor: 2, countMinimum: 5, firstRecordMinSeasons: 4 } });
      const [read] = await tx.execute<{ walk: unknown; warning: unknown }>(sql`select network_walk_rules() as walk, network_warning_rules() as warning`);
      return { fresh: fresh!, read: read! };
    });
    expect(got.fresh).toEqual({ walk: DEFAULT_WALK_RULES, warning: DEFAULT_WARNING_RULES });
    expect(got.read).toEqual({ walk: otherRules, warning: { countFactor: 2, countMinimum: 5, firstRecordMinSeasons: 4 } });
  });
});

describe("the triggers keep sightings' warnings as the TypeScript rule says", () => {
  // A transect of its own, with no history, and species of our own, on the demo network (two
  // seasons: last year's closed, this year's open) plus one season two years back.
  let transectId: string;
  let volunteerId: string;
  let seasonTwoBack: string;
  let lastYear: typeof seasons.$inferSelect;
  let thisYear: typeof seasons.$inferSelect;
  const sp = { first: "", count: "", other: "", sensitive: "", summer: "" };

  const walkIn = async (seasonId: string, visitDate: string) => {
    const id = randomUUID();
    await db().insert(visits).values({ id, transectId, volunteerId, seasonId, visitDate, startTime: "11:00", completeList: true });
    return id;
  };
  const record = async (visitId: string, speciesId: string, count: number, status: "pending" | "accepted" = "pending") => {
    const id = randomUUID();
    await db().insert(sightings).values({ id, visitId, speciesId, count, status });
    return id;
  };
  const warningsOf = async (id: string) => (await db().select({ w: sightings.warnings }).from(sightings).where(eq(sightings.id, id)))[0]!.w;
  const facts = (over: Partial<SightingFacts>): SightingFacts => ({ month: 4, activeMonths: [], count: 1, sensitive: false, hasPhoto: false, earlierSeasons: 0, earlierMaxCount: null, ...over });
  const ts = (over: Partial<SightingFacts>) => sightingWarningKinds(DEFAULT_WARNING_RULES, facts(over));

  beforeAll(async () => {
    await resetToDemo();
    [lastYear] = (await db().select().from(seasons).where(eq(seasons.status, "closed"))) as [typeof lastYear];
    [thisYear] = (await db().select().from(seasons).where(eq(seasons.status, "open"))) as [typeof thisYear];
    const year = Number(lastYear.startsOn.slice(0, 4)) - 1;
    const [older] = await db().insert(seasons).values({ name: `${year} season`, startsOn: `${year}-04-01`, endsOn: `${year}-09-30`, status: "closed", closedAt: new Date(`${year}-10-01T00:00:00Z`) }).returning();
    seasonTwoBack = older!.id;
    const [group] = await db().select({ id: habitatGroups.id }).from(habitatGroups).limit(1);
    const [t] = await db().insert(transects).values({
      code: "SQL-01", name: "Rules test", habitatGroupId: group!.id, sectionCount: 3, lengthMetres: 900,
      route: { type: "LineString", coordinates: [[-1.5, 50.9], [-1.49, 50.91]] },
    }).returning();
    transectId = t!.id;
    [{ id: volunteerId }] = (await db().select({ id: users.id }).from(users).where(eq(users.email, "volunteer01@harrowmere.example"))) as [{ id: string }];
    const made = await db().insert(species).values([
      { scientificName: "Testus primus", vernacularName: "First-timer", taxonGroup: "butterflies" },
      { scientificName: "Testus numerosus", vernacularName: "Crowd", taxonGroup: "butterflies" },
      { scientificName: "Testus vulgaris", vernacularName: "Everywhere", taxonGroup: "butterflies" },
      { scientificName: "Testus rarus", vernacularName: "Secret", taxonGroup: "butterflies", sensitive: true },
      { scientificName: "Testus aestivus", vernacularName: "Summer-only", taxonGroup: "butterflies", activeMonths: [6, 7, 8] },
    ]).returning({ id: species.id });
    [sp.first, sp.count, sp.other, sp.sensitive, sp.summer] = made.map((m) => m.id) as [string, string, string, string, string];
  });

  it("flags first_on_transect and count_above_usual only from accepted sightings of two earlier seasons, and a photo clears sensitive_no_photo", async () => {
    const day = thisYear.startsOn; // April: outside a June-August species' months
    expect(Number(day.slice(5, 7))).toBe(4);

    // This season, before any history: nothing to compare with.
    const later = await walkIn(thisYear.id, day);
    const firstEarly = await record(later, sp.first, 1);
    const crowdEarly = await record(later, sp.count, 13);
    expect(await warningsOf(firstEarly)).toEqual(ts({ earlierSeasons: 0 }));
    expect(await warningsOf(crowdEarly)).toEqual([]);

    // One earlier season of accepted sightings (the pending one does not count).
    const twoBack = await walkIn(seasonTwoBack, `${Number(lastYear.startsOn.slice(0, 4)) - 1}-06-10`);
    await record(twoBack, sp.other, 2, "accepted");
    await record(twoBack, sp.count, 4, "accepted");
    const pendingFirst = await record(twoBack, sp.first, 1, "pending");
    // Recomputed for the later season's walk on the same transect.
    expect(await warningsOf(firstEarly)).toEqual([]);
    expect(await warningsOf(firstEarly)).toEqual(ts({ earlierSeasons: 1 }));
    expect(await warningsOf(crowdEarly)).toEqual(["count_above_usual"]);
    expect(await warningsOf(crowdEarly)).toEqual(ts({ earlierSeasons: 1, earlierMaxCount: 4, count: 13 }));

    // A second earlier season: now a species never checked here is a first.
    const last = await walkIn(lastYear.id, `${lastYear.startsOn.slice(0, 4)}-07-01`);
    await record(last, sp.other, 1, "accepted");
    expect(await warningsOf(firstEarly)).toEqual(["first_on_transect"]);
    expect(await warningsOf(firstEarly)).toEqual(ts({ earlierSeasons: 2 }));

    // Sightings inserted in the later season after the history exists.
    const second = await walkIn(thisYear.id, day);
    const cases: [string, string, number, Partial<SightingFacts>][] = [
      ["a first record", sp.first, 1, { earlierSeasons: 2 }],
      ["3 times the earlier highest exactly", sp.count, 12, { earlierSeasons: 2, earlierMaxCount: 4, count: 12 }],
      ["just above 3 times", sp.count, 13, { earlierSeasons: 2, earlierMaxCount: 4, count: 13 }],
      ["a species seen before, at its usual count", sp.other, 2, { earlierSeasons: 2, earlierMaxCount: 2, count: 2 }],
      ["sensitive, no photo (and a first)", sp.sensitive, 1, { earlierSeasons: 2, sensitive: true }],
      ["outside its months (and a first)", sp.summer, 1, { earlierSeasons: 2, activeMonths: [6, 7, 8] }],
    ];
    const expected: Record<string, string[]> = {
      "a first record": ["first_on_transect"],
      "3 times the earlier highest exactly": [],
      "just above 3 times": ["count_above_usual"],
      "a species seen before, at its usual count": [],
      "sensitive, no photo (and a first)": ["first_on_transect", "sensitive_no_photo"],
      "outside its months (and a first)": ["outside_months", "first_on_transect"],
    };
    const ids: Record<string, string> = {};
    for (const [what, speciesId, count, f] of cases) {
      ids[what] = await record(second, speciesId, count);
      const stored = await warningsOf(ids[what]);
      expect(stored, what).toEqual(ts(f));
      expect(stored, what).toEqual(expected[what]);
    }

    // A photo clears "sensitive without a photo"; a refused one does not count; removing it brings the warning back.
    const secret = ids["sensitive, no photo (and a first)"]!;
    const photoId = randomUUID();
    await db().insert(photos).values({ id: photoId, sightingId: secret, visitId: second, uploadedById: volunteerId, uploadKey: `originals/${second}/${photoId}` });
    expect(await warningsOf(secret)).toEqual(ts({ earlierSeasons: 2, sensitive: true, hasPhoto: true }));
    expect(await warningsOf(secret)).toEqual(["first_on_transect"]);
    await db().update(photos).set({ status: "refused", refusalReason: "Not a photo" }).where(eq(photos.id, photoId));
    expect(await warningsOf(secret)).toEqual(["first_on_transect", "sensitive_no_photo"]);
    await db().update(photos).set({ status: "ready" }).where(eq(photos.id, photoId));
    expect(await warningsOf(secret)).toEqual(["first_on_transect"]);
    await db().delete(photos).where(eq(photos.id, photoId));
    expect(await warningsOf(secret)).toEqual(["first_on_transect", "sensitive_no_photo"]);

    // The earlier season's pending sighting accepted: the species is no longer a first, on either walk.
    await db().update(sightings).set({ status: "accepted" }).where(eq(sightings.id, pendingFirst));
    expect(await warningsOf(firstEarly)).toEqual(ts({ earlierSeasons: 2, earlierMaxCount: 1 }));
    expect(await warningsOf(firstEarly)).toEqual([]);
    expect(await warningsOf(ids["a first record"]!)).toEqual([]);

    // Nothing on the demo's own transects changed its warnings' shape: every stored sighting's
    // warnings are what sighting_warning_kinds says now.
    const [stale] = await db().execute<{ n: number }>(sql`
      select count(*)::int as n from sightings s where s.warnings is distinct from sighting_warning_kinds(s.id, s.visit_id, s.species_id, s.count)`);
    expect(stale!.n).toBe(0);
    expect(await db().select().from(sightings).innerJoin(visits, eq(visits.id, sightings.visitId)).where(and(eq(visits.transectId, transectId), sql`cardinality(${sightings.warnings}) > 0`))).not.toHaveLength(0);
  });
});
