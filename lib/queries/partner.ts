import "server-only";
import { sql } from "drizzle-orm";
import { db } from "@/db/client";
import { seasons, sightings, visits } from "@/db/schema";

/** What partners may take: verified records only, summarised by season. */
export function verifiedDataBySeason() {
  return db()
    .select({
      id: seasons.id,
      name: seasons.name,
      startsOn: seasons.startsOn,
      endsOn: seasons.endsOn,
      status: seasons.status,
      transects: sql<number>`count(distinct ${visits.transectId}) filter (where ${sightings.status} = 'accepted')`.mapWith(Number),
      visits: sql<number>`count(distinct ${visits.id}) filter (where ${sightings.status} = 'accepted')`.mapWith(Number),
      acceptedRecords: sql<number>`count(${sightings.id}) filter (where ${sightings.status} = 'accepted')`.mapWith(Number),
      species: sql<number>`count(distinct ${sightings.speciesId}) filter (where ${sightings.status} = 'accepted')`.mapWith(Number),
    })
    .from(seasons)
    .leftJoin(visits, sql`${visits.seasonId} = ${seasons.id}`)
    .leftJoin(sightings, sql`${sightings.visitId} = ${visits.id}`)
    .groupBy(seasons.id)
    .orderBy(sql`${seasons.startsOn} desc`);
}
