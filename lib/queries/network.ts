import "server-only";
import { asc, count, eq, sql } from "drizzle-orm";
import { db } from "@/db/client";
import { habitatGroups, networkSettings, transects, users, type Role } from "@/db/schema";

export async function networkSettingsRow() {
  const [row] = await db().select().from(networkSettings).limit(1);
  return row ?? null;
}

/** The network's shape for the organiser's home; each season's totals come from lib/queries/effort.ts. */
export async function networkOverview() {
  const [settings, byHabitat, people] = await Promise.all([
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
  ]);
  return { settings, byHabitat, people };
}
