import "server-only";
import { and, asc, count, eq, max, sql } from "drizzle-orm";
import { db } from "@/db/client";
import { habitatGroups, transectAssignments, transects, visits } from "@/db/schema";
import type { Actor } from "@/lib/auth/guard";
import { forbidden } from "@/lib/errors";
import { currentSeason } from "./seasons";

/** The volunteer's own transects, with their last visit and this season's visit count. */
export async function assignedTransects(actor: Actor) {
  const season = await currentSeason();
  const seasonVisits = season
    ? sql<number>`count(${visits.id}) filter (where ${visits.seasonId} = ${season.id})`
    : sql<number>`0`;
  const rows = await db()
    .select({
      id: transects.id,
      code: transects.code,
      name: transects.name,
      habitat: habitatGroups.name,
      sectionCount: transects.sectionCount,
      lengthMetres: transects.lengthMetres,
      coastal: transects.coastal,
      accessNotes: transects.accessNotes,
      route: transects.route,
      lastVisit: max(visits.visitDate),
      visitsThisSeason: seasonVisits.mapWith(Number),
    })
    .from(transectAssignments)
    .innerJoin(transects, eq(transects.id, transectAssignments.transectId))
    .innerJoin(habitatGroups, eq(habitatGroups.id, transects.habitatGroupId))
    .leftJoin(visits, and(eq(visits.transectId, transects.id), eq(visits.volunteerId, actor.id)))
    .where(and(eq(transectAssignments.userId, actor.id), eq(transects.active, true)))
    .groupBy(transects.id, habitatGroups.name)
    .orderBy(asc(transects.code));
  return { season, transects: rows };
}

/** Throws 403 unless the volunteer is assigned to every one of these transects. */
export async function assertAssigned(actor: Actor, transectIds: string[]): Promise<void> {
  const unique = [...new Set(transectIds)];
  if (unique.length === 0) return;
  const [row] = await db()
    .select({ n: count() })
    .from(transectAssignments)
    .where(and(eq(transectAssignments.userId, actor.id), sql`${transectAssignments.transectId} in ${unique}`));
  if ((row?.n ?? 0) !== unique.length) throw forbidden("You are not assigned to that transect.");
}
