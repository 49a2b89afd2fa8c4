import "server-only";
import { sql } from "drizzle-orm";
import { db } from "@/db/client";
import { seasons, sightings, visits } from "@/db/schema";
import { countedSql } from "./counting";

/** What partners may take: confirmed sightings only (the counting rule), summarised by season. */
export function verifiedDataBySeason() {
  const counted = countedSql(sightings.status);
  return db()
    .select({
      id: seasons.id,
      name: seasons.name,
      startsOn: seasons.startsOn,
      endsOn: seasons.endsOn,
      status: seasons.status,
      transects: sql<number>`count(distinct ${visits.transectId}) filter (where ${counted})`.mapWith(Number),
      visits: sql<number>`count(distinct ${visits.id}) filter (where ${counted})`.mapWith(Number),
      acceptedRecords: sql<number>`count(${sightings.id}) filter (where ${counted})`.mapWith(Number),
      species: sql<number>`count(distinct ${sightings.speciesId}) filter (where ${counted})`.mapWith(Number),
    })
    .from(seasons)
    .leftJoin(visits, sql`${visits.seasonId} = ${seasons.id}`)
    .leftJoin(sightings, sql`${sightings.visitId} = ${visits.id}`)
    .groupBy(seasons.id)
    .orderBy(sql`${seasons.startsOn} desc`);
}
