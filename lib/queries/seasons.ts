import "server-only";
import { desc, sql } from "drizzle-orm";
import { db } from "@/db/client";
import { seasons } from "@/db/schema";

/** The season covering today, else the most recent one to have started. */
export async function currentSeason() {
  const [covering] = await db()
    .select()
    .from(seasons)
    .where(sql`current_date between ${seasons.startsOn} and ${seasons.endsOn}`)
    .limit(1);
  if (covering) return covering;
  const [latest] = await db().select().from(seasons).where(sql`${seasons.startsOn} <= current_date`).orderBy(desc(seasons.startsOn)).limit(1);
  return latest ?? null;
}

export function listSeasons() {
  return db().select().from(seasons).orderBy(desc(seasons.startsOn));
}
