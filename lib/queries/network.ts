import "server-only";
import { asc, count, eq, sql } from "drizzle-orm";
import { db } from "@/db/client";
import { habitatGroups, networkSettings, seasons, sightings, transects, users, visits, type Role } from "@/db/schema";

export async function networkSettingsRow() {
  const [row] = await db().select().from(networkSettings).limit(1);
  return row ?? null;
}

/** The organiser's overview: the network's shape and how far each season's checking has got. */
export async function networkOverview() {
  const [settings, byHabitat, people, bySeason] = await Promise.all([
    networkSettingsRow(),
    db()
      .select({ code: habitatGroups.code, name: habitatGroups.name, transects: count(transects.id) })
      .from(habitatGroups)
      .leftJoin(transects, eq(transects.habitatGroupId, habitatGroups.id))
      .groupBy(habitatGroups.id)
      .orderBy(asc(habitatGroups.name)),
    // A person with several roles counts once under each.
    db()
      .select({ role: sql<Role>`r.role`, n: count() })
      .from(sql`${users} cross join lateral unnest(${users.roles}) as r(role)`)
      .where(eq(users.active, true))
      .groupBy(sql`r.role`)
      .orderBy(sql`r.role`),
    db()
      .select({
        id: seasons.id,
        name: seasons.name,
        status: seasons.status,
        startsOn: seasons.startsOn,
        endsOn: seasons.endsOn,
        visits: sql<number>`count(distinct ${visits.id})`.mapWith(Number),
        sightings: sql<number>`count(${sightings.id})`.mapWith(Number),
        accepted: sql<number>`count(${sightings.id}) filter (where ${sightings.status} = 'accepted')`.mapWith(Number),
        pending: sql<number>`count(${sightings.id}) filter (where ${sightings.status} in ('pending', 'queried'))`.mapWith(Number),
      })
      .from(seasons)
      .leftJoin(visits, eq(visits.seasonId, seasons.id))
      .leftJoin(sightings, eq(sightings.visitId, visits.id))
      .groupBy(seasons.id)
      .orderBy(sql`${seasons.startsOn} desc`),
  ]);
  return { settings, byHabitat, people, bySeason };
}
