import { eq, sql } from "drizzle-orm";
import { beforeAll, beforeEach, describe, expect, it, vi } from "vitest";
import { db } from "@/db/client";
import { networkChanges, networkSettings, seasons } from "@/db/schema";
import { resetToDemo } from "./support/db";
import { call, demo, userId } from "./transects-helpers";

// The organiser's season routes called as handlers against the demo network. Only Auth.js's
// cookie decoding is replaced. New seasons are placed in the 2090s, far from the demo's own
// (which follow the day the demo is seeded).
const session = vi.hoisted(() => ({ userId: null as string | null }));
vi.mock("@/lib/auth/session", () => ({ sessionUserId: async () => session.userId }));

const list = await import("@/app/(network)/api/network/seasons/route");
const one = await import("@/app/(network)/api/network/seasons/[id]/route");
const open = await import("@/app/(network)/api/network/seasons/[id]/open/route");
const close = await import("@/app/(network)/api/network/seasons/[id]/close/route");
const grace = await import("@/app/(network)/api/network/settings/season-grace/route");

const counts = async () => {
  const [row] = await db().execute<{ seasons: number; changes: number }>(sql`select (select count(*)::int from seasons) as seasons, (select count(*)::int from network_changes) as changes`);
  return row!;
};
const logsOf = (id: string) => db().select().from(networkChanges).where(eq(networkChanges.entityId, id));
const season2090 = { name: "2090 season", startsOn: "2090-04-01", endsOn: "2090-09-30", targetVisits: 6, minVisits: 3 };

describe("season routes", () => {
  let id: string;

  beforeAll(async () => {
    await resetToDemo();
  });

  beforeEach(async () => {
    session.userId = await userId(demo.organiser);
  });

  it("lists the demo's seasons with their phase and walks for a reviewer", async () => {
    session.userId = await userId(demo.coordinator);
    const { status, json } = await call(list.GET);
    expect(status).toBe(200);
    expect(json.graceDays).toBe(30);
    const phases = json.seasons.map((s: { phase: string }) => s.phase);
    expect(phases).toEqual(["open", "frozen"]); // newest first: the demo's open season, then last year's frozen one
    expect(json.seasons.every((s: { walks: number }) => s.walks > 0)).toBe(true);
  });

  it("creates a season in planning, logged", async () => {
    const { status, json } = await call(list.POST, { body: season2090 });
    expect(status).toBe(201);
    expect(json.season).toMatchObject({ ...season2090, status: "planning", openedAt: null, closedAt: null });
    id = json.season.id;
    const [log] = await logsOf(id);
    expect(log).toMatchObject({ entity: "season", action: "create", after: { name: "2090 season", startsOn: "2090-04-01" } });
  });

  it("refuses overlapping dates, a shared first or last day included, with a field message and nothing written", async () => {
    const before = await counts();
    const touching = await call(list.POST, { body: { ...season2090, name: "2091 season", startsOn: "2090-09-30", endsOn: "2091-03-31" } });
    expect(touching.status).toBe(400);
    expect(touching.json.error.fields.startsOn[0]).toMatch(/overlap the 2090 season \(2090-04-01 to 2090-09-30\)/);
    const inside = await call(list.POST, { body: { ...season2090, name: "2091 season", startsOn: "2089-10-01", endsOn: "2090-04-01" } });
    expect(inside.json.error.fields.startsOn).toHaveLength(1);
    const name = await call(list.POST, { body: { ...season2090, name: "2090 SEASON", startsOn: "2092-04-01", endsOn: "2092-09-30" } });
    expect(name.json.error.fields.name).toEqual(["Another season has this name."]);
    const reversed = await call(list.POST, { body: { ...season2090, name: "2093 season", startsOn: "2093-09-30", endsOn: "2093-04-01" } });
    expect(reversed.json.error.fields.endsOn).toEqual(["The season cannot end before it starts."]);
    expect(await counts()).toEqual(before);
  });

  it("takes the day after another season ends", async () => {
    const { status, json } = await call(list.POST, { body: { ...season2090, name: "2090-91 winter", startsOn: "2090-10-01", endsOn: "2091-03-31" } });
    expect(status).toBe(201);
    expect(json.season.startsOn).toBe("2090-10-01");
  });

  it("changes dates while planning, but not into another season", async () => {
    const moved = await call(one.PATCH, { method: "PATCH", params: { id }, body: { startsOn: "2090-03-15" } });
    expect(moved.status).toBe(200);
    expect(moved.json.season.startsOn).toBe("2090-03-15");
    const clash = await call(one.PATCH, { method: "PATCH", params: { id }, body: { endsOn: "2090-10-01" } });
    expect(clash.status).toBe(400);
    expect(clash.json.error.fields.startsOn[0]).toMatch(/2090-91 winter/);
  });

  it("opens it, logged; then its dates are fixed but its targets still change", async () => {
    const opened = await call(open.POST, { method: "POST", params: { id } });
    expect(opened.status).toBe(200);
    expect(opened.json.season.status).toBe("open");
    expect(opened.json.season.openedAt).not.toBeNull();
    expect((await logsOf(id)).map((l) => l.action)).toContain("open");
    const dates = await call(one.PATCH, { method: "PATCH", params: { id }, body: { endsOn: "2090-09-29" } });
    expect(dates.status).toBe(400);
    expect(dates.json.error.fields.startsOn[0]).toMatch(/dates are fixed/);
    const targets = await call(one.PATCH, { method: "PATCH", params: { id }, body: { targetVisits: 8, minVisits: 4 } });
    expect(targets.status).toBe(200);
    expect(targets.json.season).toMatchObject({ targetVisits: 8, minVisits: 4, endsOn: "2090-09-30" });
  });

  it("closes it: closed_at set, the log names the end of grace; never reopened or closed twice", async () => {
    const closed = await call(close.POST, { method: "POST", params: { id } });
    expect(closed.status).toBe(200);
    expect(closed.json.season.status).toBe("closed");
    const closedAt = Date.parse(closed.json.season.closedAt);
    expect(Math.abs(closedAt - Date.now())).toBeLessThan(60_000);
    const log = (await logsOf(id)).find((l) => l.action === "close")!;
    expect(log.summary).toBe(`Closed the 2090 season; late walks and their review until ${new Date(closedAt + 30 * 86_400_000).toISOString().slice(0, 10)}, then frozen`);
    const listed = (await call(list.GET)).json.seasons.find((s: { id: string }) => s.id === id);
    expect(listed.phase).toBe("grace");
    const before = await counts();
    expect((await call(open.POST, { method: "POST", params: { id } })).status).toBe(409);
    expect((await call(close.POST, { method: "POST", params: { id } })).status).toBe(409);
    expect(await counts()).toEqual(before);
  });

  it("freezes it once the grace period is over, and the grace days are a logged setting", async () => {
    const set = await call(grace.PUT, { method: "PUT", body: { graceDays: 0 } });
    expect(set.status).toBe(200);
    expect(set.json).toEqual({ graceDays: 0 });
    const [settings] = await db().select().from(networkSettings);
    expect(settings!.seasonGraceDays).toBe(0);
    const listed = (await call(list.GET)).json.seasons.find((s: { id: string }) => s.id === id);
    expect(listed.phase).toBe("frozen");
    const [log] = await logsOf("season_grace_days");
    expect(log).toMatchObject({ entity: "settings", before: { seasonGraceDays: 30 }, after: { seasonGraceDays: 0 } });
    const tooMany = await call(grace.PUT, { method: "PUT", body: { graceDays: 366 } });
    expect(tooMany.status).toBe(400);
    expect(tooMany.json.error.fields.graceDays).toEqual(["At most 365 days."]);
    expect((await call(grace.GET)).json).toEqual({ graceDays: 0 });
    await call(grace.PUT, { method: "PUT", body: { graceDays: 30 } });
  });

  it("answers a malformed id or an unknown season with 400 and 404", async () => {
    expect((await call(open.POST, { method: "POST", params: { id: "nope" } })).status).toBe(400);
    expect((await call(one.PATCH, { method: "PATCH", params: { id: "00000000-0000-4000-8000-000000000000" }, body: { name: "Anything" } })).status).toBe(404);
  });

  it("lets only organisers change seasons; reviewers read; volunteers and partners are refused everything", async () => {
    const [demoSeason] = await db().select().from(seasons).where(eq(seasons.status, "open")).limit(1);
    const params = { id: demoSeason!.id };
    const before = await counts();
    session.userId = await userId(demo.coordinator);
    expect((await call(grace.GET)).status).toBe(200);
    expect((await call(list.POST, { body: { ...season2090, name: "x", startsOn: "2095-01-01", endsOn: "2095-02-01" } })).status).toBe(403);
    expect((await call(close.POST, { method: "POST", params })).status).toBe(403);
    expect((await call(grace.PUT, { method: "PUT", body: { graceDays: 10 } })).status).toBe(403);
    for (const who of [demo.volunteer, demo.partner]) {
      session.userId = await userId(who);
      expect((await call(list.GET)).status).toBe(403);
      expect((await call(grace.GET)).status).toBe(403);
      expect((await call(list.POST, { body: season2090 })).status).toBe(403);
      expect((await call(one.PATCH, { method: "PATCH", params, body: { name: "Mine" } })).status).toBe(403);
      expect((await call(open.POST, { method: "POST", params })).status).toBe(403);
      expect((await call(close.POST, { method: "POST", params })).status).toBe(403);
      expect((await call(grace.PUT, { method: "PUT", body: { graceDays: 10 } })).status).toBe(403);
    }
    session.userId = null;
    expect((await call(list.GET)).status).toBe(401);
    expect(await counts()).toEqual(before);
    const [still] = await db().select().from(seasons).where(eq(seasons.id, demoSeason!.id));
    expect(still!.status).toBe("open");
  });
});
