import "server-only";
import { and, desc, eq, isNotNull, or, sql } from "drizzle-orm";
import { db } from "@/db/client";
import { seasonImports, users, visits } from "@/db/schema";
import { walkSourceText } from "@/lib/import/walk-source";

/**
 * Where a walk came from, as two columns any select over visits can carry: who typed it in for
 * the volunteer, and "imported from <file> on <date>" (lib/import/walk-source.ts words them).
 */
export const walkSourceColumns = {
  enteredBy: sql<string | null>`(select ${users.name} from ${users} where ${users.id} = ${visits.enteredById})`,
  importedFrom: sql<string | null>`(select 'imported from ' || ${seasonImports.walksFileName} || ' on ' || to_char(${seasonImports.createdAt} at time zone 'UTC', 'YYYY-MM-DD') from ${seasonImports} where ${seasonImports.id} = ${visits.importId})`,
};

/** The volunteer's walks that did not come from their phone (newest first), visit id → how they came, for My records. */
export async function walkSourcesOf(volunteerId: string, limit = 500): Promise<Record<string, string>> {
  const rows = await db()
    .select({ id: visits.id, recorder: users.name, ...walkSourceColumns })
    .from(visits)
    .innerJoin(users, eq(users.id, visits.volunteerId))
    .where(and(eq(visits.volunteerId, volunteerId), or(isNotNull(visits.enteredById), isNotNull(visits.importId))))
    .orderBy(desc(visits.visitDate))
    .limit(limit);
  return Object.fromEntries(rows.map((r) => [r.id, walkSourceText(r)!]));
}
