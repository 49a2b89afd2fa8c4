import "server-only";
import { desc, eq, inArray, sql } from "drizzle-orm";
import { db } from "@/db/client";
import { photos, sightings, species, transects, users, visits } from "@/db/schema";
import { walkSourceColumns } from "./person-walks";

/** Records waiting for a checker, newest first, with the reasons they deserve a look. */
export async function reviewQueue(limit = 50) {
  const rows = await db()
    .select({
      id: sightings.id,
      status: sightings.status,
      count: sightings.count,
      section: sightings.section,
      scientificName: species.scientificName,
      vernacularName: species.vernacularName,
      sensitive: species.sensitive,
      activeMonths: species.activeMonths,
      visitDate: visits.visitDate,
      transectCode: transects.code,
      recorder: users.name,
      ...walkSourceColumns,
      photoCount: sql<number>`(select count(*) from ${photos} where ${photos.sightingId} = ${sightings.id})`.mapWith(Number),
    })
    .from(sightings)
    .innerJoin(visits, eq(visits.id, sightings.visitId))
    .innerJoin(species, eq(species.id, sightings.speciesId))
    .innerJoin(transects, eq(transects.id, visits.transectId))
    .innerJoin(users, eq(users.id, visits.volunteerId))
    .where(inArray(sightings.status, ["pending", "queried"]))
    .orderBy(desc(visits.visitDate), transects.code)
    .limit(limit);
  return rows.map((r) => {
    const month = Number(r.visitDate.slice(5, 7));
    const flags: string[] = [];
    if (r.activeMonths.length > 0 && !r.activeMonths.includes(month)) flags.push("outside usual months");
    if (r.sensitive) flags.push("sensitive species");
    if (r.photoCount > 0) flags.push("has photo");
    return { ...r, flags };
  });
}

export async function reviewCounts() {
  const rows = await db()
    .select({ status: sightings.status, n: sql<number>`count(*)`.mapWith(Number) })
    .from(sightings)
    .groupBy(sightings.status);
  const counts = { pending: 0, accepted: 0, queried: 0, rejected: 0 };
  for (const r of rows) counts[r.status] = r.n;
  return counts;
}
