import "server-only";
import { asc, count, desc, eq, inArray, or, sql, type SQLWrapper } from "drizzle-orm";
import { db } from "@/db/client";
import { seasons, transects, visitSummaries, visits, weatherMisses } from "@/db/schema";
import type { Actor } from "@/lib/auth/guard";
import { buildGrid, needsAlert, progressOf, type Cell, type Progress } from "@/lib/effort/grid";
import { homeSeason } from "@/lib/effort/home-season";
import { thinForOverview } from "@/lib/geo/thin";
import { phaseOf, type SeasonPhase } from "@/lib/seasons/rules";
import { networkOverview } from "./network";
import { withVisibleRoutes, type VisibleRoute } from "./route-visibility";
import { seasonGraceDays } from "./seasons";

// The organiser's home: every season's totals and this season's week-by-week effort. Sightings
// are never counted row by row here: visit_summaries (drizzle/0007, kept by triggers) holds each
// walk's sightings by status, so every read is over walks, which are few beside their sightings.

const sum = (column: SQLWrapper) => sql<number>`coalesce(sum(${column}), 0)`.mapWith(Number);

/** Every season, newest first, with its walks and its sightings by status. */
export async function seasonTotals() {
  return db()
    .select({
      id: seasons.id,
      name: seasons.name,
      status: seasons.status,
      startsOn: seasons.startsOn,
      endsOn: seasons.endsOn,
      closedAt: seasons.closedAt,
      targetVisits: seasons.targetVisits,
      walks: count(visits.id),
      pending: sum(visitSummaries.pending),
      queried: sum(visitSummaries.queried),
      accepted: sum(visitSummaries.accepted),
      rejected: sum(visitSummaries.rejected),
    })
    .from(seasons)
    .leftJoin(visits, eq(visits.seasonId, seasons.id))
    .leftJoin(visitSummaries, eq(visitSummaries.visitId, visits.id))
    .groupBy(seasons.id)
    .orderBy(desc(seasons.startsOn));
}

export type SeasonTotals = Awaited<ReturnType<typeof seasonTotals>>[number];

export type EffortRow = {
  id: string;
  code: string;
  name: string;
  active: boolean;
  walks: number;
  pending: number;
  lastWalk: string | null;
  weeksWithoutWalk: number;
  progress: Progress;
  cells: Cell[];
};

export type EffortRoute = { id: string; code: string; name: string; progress: Progress; walks: number; route: VisibleRoute };

export type SeasonEffort = {
  season: { id: string; name: string; status: "planning" | "open" | "closed"; phase: SeasonPhase; startsOn: string; endsOn: string; targetVisits: number };
  today: string;
  weeks: string[];
  rows: EffortRow[];
  /** Transects unwalked for ALERT_WEEKS ended weeks or more; empty unless the season is open. */
  alerts: EffortRow[];
  routes: EffortRoute[];
};

/**
 * One season's grid: its transects in use (and retired ones walked in it) by week, each with its
 * walks, sightings waiting for review, last walk and progress, the alerts and the routes.
 */
export async function seasonEffort(actor: Actor, season: SeasonTotals, now: Date = new Date()): Promise<SeasonEffort> {
  const today = now.toISOString().slice(0, 10);
  const walkedHere = db().select({ id: visits.transectId }).from(visits).where(eq(visits.seasonId, season.id));
  const [transectRows, walkRows, weatherRows, graceDays] = await Promise.all([
    db()
      .select({ id: transects.id, code: transects.code, name: transects.name, active: transects.active, sensitive: transects.sensitive, route: transects.route })
      .from(transects)
      .where(or(eq(transects.active, true), inArray(transects.id, walkedHere)))
      .orderBy(desc(transects.active), asc(transects.code)),
    db()
      .select({
        transectId: visits.transectId,
        date: visits.visitDate,
        // Rejected records do not stand: a walk whose every record was rejected saw nothing.
        sightings: sql<number>`coalesce(${visitSummaries.pending} + ${visitSummaries.queried} + ${visitSummaries.accepted}, 0)`.mapWith(Number),
        pending: sql<number>`coalesce(${visitSummaries.pending}, 0)`.mapWith(Number),
      })
      .from(visits)
      .leftJoin(visitSummaries, eq(visitSummaries.visitId, visits.id))
      .where(eq(visits.seasonId, season.id)),
    db().selectDistinct({ transectId: weatherMisses.transectId, weekStart: weatherMisses.weekStart }).from(weatherMisses).where(eq(weatherMisses.seasonId, season.id)),
    seasonGraceDays(),
  ]);
  const phase = phaseOf(season, graceDays, now);
  const grid = buildGrid(season, transectRows.map((t) => t.id), walkRows, weatherRows, today);
  const rows: EffortRow[] = transectRows.map((t, i) => {
    const g = grid.rows[i]!;
    return {
      id: t.id,
      code: t.code,
      name: t.name,
      active: t.active,
      walks: g.walks,
      pending: g.pending,
      lastWalk: g.lastWalk,
      weeksWithoutWalk: g.weeksWithoutWalk,
      progress: progressOf(g.walks, season.targetVisits),
      cells: g.cells,
    };
  });
  const open = season.status === "open";
  const alerts = rows.filter((r) => r.active && needsAlert(r.weeksWithoutWalk, open)).sort((a, b) => b.weeksWithoutWalk - a.weeksWithoutWalk || a.code.localeCompare(b.code));
  const progressById = new Map(rows.map((r) => [r.id, r]));
  // Sensitive routes follow the one rule (route-visibility.ts); the overview map needs only a thinned line.
  const visible = await withVisibleRoutes(
    actor,
    transectRows.map((t) => ({ ...t, route: { type: "LineString" as const, coordinates: thinForOverview(t.route.coordinates) } })),
  );
  const routes = visible.map((t) => ({ id: t.id, code: t.code, name: t.name, progress: progressById.get(t.id)!.progress, walks: progressById.get(t.id)!.walks, route: t.route }));
  return {
    season: { id: season.id, name: season.name, status: season.status, phase, startsOn: season.startsOn, endsOn: season.endsOn, targetVisits: season.targetVisits },
    today,
    weeks: grid.weeks,
    rows,
    alerts,
    routes,
  };
}

/** Everything the organiser's home shows, in one call (bench:network times this). */
export async function networkHome(actor: Actor, now: Date = new Date()) {
  const [overview, totals] = await Promise.all([networkOverview(), seasonTotals()]);
  const season = homeSeason(totals);
  return { ...overview, seasons: totals, effort: season ? await seasonEffort(actor, season, now) : null };
}

export type NetworkHome = Awaited<ReturnType<typeof networkHome>>;
