import { and, eq, sql } from "drizzle-orm";
import { beforeAll, describe, expect, it } from "vitest";
import { db } from "@/db/client";
import { seasons, transects } from "@/db/schema";
import type { Actor } from "@/lib/auth/guard";
import { daysBetween, mondayOf, weekStartsBetween } from "@/lib/effort/weeks";
import { networkHome, type NetworkHome } from "@/lib/queries/effort";
import { actorFor } from "./support/actors";
import { resetToDemo } from "./support/db";

// The organiser's home on the demo network, checked against counts made here straight from the
// tables (not through visit_summaries).

describe("the organiser's home on the demo network", () => {
  let home: NetworkHome;
  let organiser: Actor;
  const now = new Date();
  const today = now.toISOString().slice(0, 10);

  beforeAll(async () => {
    await resetToDemo();
    organiser = await actorFor("organiser@harrowmere.example");
    await db().update(transects).set({ sensitive: true }).where(eq(transects.code, "WET-03"));
    home = await networkHome(organiser, now);
  });

  it("shows the open season, week by week from its first Monday", async () => {
    const [open] = await db().select().from(seasons).where(eq(seasons.status, "open"));
    const effort = home.effort!;
    expect(effort.season).toMatchObject({ id: open!.id, status: "open", phase: "open", targetVisits: open!.targetVisits });
    expect(effort.weeks).toEqual(weekStartsBetween(open!.startsOn, open!.endsOn));
    expect(effort.weeks[0]).toBe(mondayOf(open!.startsOn));
  });

  it("has one row per transect in use with its walks, waiting sightings and last walk counted from the tables", async () => {
    const expected = await db().execute<{ id: string; walks: number; pending: number; last: string | null }>(sql`
      select t.id,
        (select count(*)::int from visits v where v.transect_id = t.id and v.season_id = s.id) as walks,
        (select count(*)::int from sightings x join visits v on v.id = x.visit_id where v.transect_id = t.id and v.season_id = s.id and x.status = 'pending') as pending,
        (select max(v.visit_date)::text from visits v where v.transect_id = t.id and v.season_id = s.id) as last
      from transects t cross join seasons s where s.status = 'open' and t.active order by t.code`);
    const rows = home.effort!.rows;
    expect(rows.map((r) => r.id)).toEqual(expected.map((e) => e.id));
    expect(rows.map((r) => ({ id: r.id, walks: r.walks, pending: r.pending, last: r.lastWalk }))).toEqual(expected);
    expect(rows.reduce((n, r) => n + r.pending, 0)).toBeGreaterThan(50);
  });

  it("shows every state of a week: walks with sightings, the walk where nothing was seen, weather reports, weeks not walked and weeks to come", async () => {
    const cells = (code: string) => home.effort!.rows.find((r) => r.code === code)!.cells;
    const states = new Set(home.effort!.rows.flatMap((r) => r.cells.map((c) => c.state)));
    expect([...states].sort()).toEqual(["not_walked", "nothing_seen", "sightings", "upcoming", "weather"].sort());

    // db/seed/effort.ts: DUN-02's walk with no sightings, and WDR-06's weather reports (never walked this season).
    const [empty] = await db().execute<{ week: string }>(sql`
      select date_trunc('week', v.visit_date)::date::text as week from visits v join transects t on t.id = v.transect_id
      where t.code = 'DUN-02' and not exists (select 1 from sightings x where x.visit_id = v.id)`);
    expect(cells("DUN-02").find((c) => c.weekStart === empty!.week)).toMatchObject({ state: "nothing_seen", walks: 1, sightings: 0 });
    const weather = await db().execute<{ week: string }>(sql`
      select w.week_start::text as week from weather_misses w join transects t on t.id = w.transect_id where t.code = 'WDR-06' order by 1`);
    expect(weather.length).toBeGreaterThan(0);
    expect(cells("WDR-06").filter((c) => c.state === "weather").map((c) => c.weekStart)).toEqual(weather.map((w) => w.week));
    expect(cells("WDR-06").some((c) => c.state === "sightings" || c.state === "nothing_seen")).toBe(false);

    // Each walked cell is a week with a walk, by the tables.
    const walkedWeeks = await db().execute<{ code: string; week: string }>(sql`
      select distinct t.code, date_trunc('week', v.visit_date)::date::text as week
      from visits v join transects t on t.id = v.transect_id join seasons s on s.id = v.season_id where s.status = 'open'`);
    const walkedCells = home.effort!.rows.flatMap((r) => r.cells.filter((c) => c.state === "sightings" || c.state === "nothing_seen").map((c) => `${r.code}|${c.weekStart}`));
    expect(walkedCells.sort()).toEqual(walkedWeeks.map((w) => `${w.code}|${w.week}`).sort());
    // Weeks that have not begun are "to come", and only they.
    for (const row of home.effort!.rows) for (const c of row.cells) expect(c.state === "upcoming").toBe(c.weekStart > today);
  });

  it("lists in the alerts the transects in use with three ended weeks or more since their last walk", () => {
    const effort = home.effort!;
    const endedSince = (day: string) => Math.floor(daysBetween(mondayOf(day), mondayOf(today)) / 7) - 1;
    for (const row of effort.rows) {
      const expected = row.lastWalk ? endedSince(row.lastWalk) : Math.floor(daysBetween(effort.weeks[0]!, mondayOf(today)) / 7);
      expect(row.weeksWithoutWalk, row.code).toBe(Math.max(0, expected));
    }
    expect(effort.alerts.map((a) => a.code).sort()).toEqual(effort.rows.filter((r) => r.weeksWithoutWalk >= 3).map((r) => r.code).sort());
    expect(effort.alerts.some((a) => a.code === "WDR-06")).toBe(true);
  });

  it("gives every season its walks and sightings by status, as counted row by row", async () => {
    const expected = await db().execute<{ id: string; walks: number; pending: number; queried: number; accepted: number; rejected: number }>(sql`
      select s.id,
        (select count(*)::int from visits v where v.season_id = s.id) as walks,
        (select count(*)::int from sightings x join visits v on v.id = x.visit_id where v.season_id = s.id and x.status = 'pending') as pending,
        (select count(*)::int from sightings x join visits v on v.id = x.visit_id where v.season_id = s.id and x.status = 'queried') as queried,
        (select count(*)::int from sightings x join visits v on v.id = x.visit_id where v.season_id = s.id and x.status = 'accepted') as accepted,
        (select count(*)::int from sightings x join visits v on v.id = x.visit_id where v.season_id = s.id and x.status = 'rejected') as rejected
      from seasons s order by s.starts_on desc`);
    expect(home.seasons.map(({ id, walks, pending, queried, accepted, rejected }) => ({ id, walks, pending, queried, accepted, rejected }))).toEqual(expected);
  });

  it("colours routes by progress and follows the sensitive-route rule: organisers see the exact line, others where it is", async () => {
    const effort = home.effort!;
    const sensitive = effort.routes.find((r) => r.code === "WET-03")!;
    expect(sensitive.route.type).toBe("LineString");
    const partner = await actorFor("partner@harrowmere.example");
    const asPartner = await networkHome(partner, now);
    expect(asPartner.effort!.routes.find((r) => r.code === "WET-03")!.route.type).toBe("generalised");
    expect(effort.routes.find((r) => r.code === "WDR-06")!.progress).toBe("none");
    for (const r of effort.routes) {
      const row = effort.rows.find((x) => x.id === r.id)!;
      expect(r.progress).toBe(row.walks >= effort.season.targetVisits ? "target_reached" : row.walks === 0 ? "none" : row.walks * 2 >= effort.season.targetVisits ? "half_or_more" : "under_half");
    }
  });

  it("lists no alerts once the season is closed", async () => {
    const [open] = await db().select().from(seasons).where(eq(seasons.status, "open"));
    await db().update(seasons).set({ status: "closed", closedAt: now }).where(and(eq(seasons.id, open!.id)));
    const closed = await networkHome(organiser, now);
    expect(closed.effort!.season).toMatchObject({ id: open!.id, status: "closed", phase: "grace" });
    expect(closed.effort!.alerts).toEqual([]);
  });
});
