import "server-only";
import { sql, type SQL, type SQLWrapper } from "drizzle-orm";
import type { SightingStatus } from "@/db/schema/field";

// The counting rule, stated once: analyses (comparisons, partner data, newsletters, exports)
// count CONFIRMED sightings (status accepted). An organiser may choose to include those still
// waiting (waiting for review, or with a question asked), and every result built that way says
// so, in the words of countingNote. Set-aside (rejected) sightings are never counted.

export type Counting = { includeWaiting: boolean };

export const CONFIRMED_ONLY: Counting = { includeWaiting: false };

export function countedStatuses(c: Counting): readonly SightingStatus[] {
  return c.includeWaiting ? ["accepted", "pending", "queried"] : ["accepted"];
}

/** The rule as a condition on a sightings status column, for any query. */
export function countedSql(status: SQLWrapper, c: Counting = CONFIRMED_ONLY): SQL {
  return sql`${status} in (${sql.join(countedStatuses(c).map((s) => sql`${s}::sighting_status`), sql`, `)})`;
}

/** What a result built with waiting sightings must say about itself; null for confirmed only. */
export function countingNote(c: Counting): string | null {
  return c.includeWaiting ? "Includes sightings still waiting for review: these results may change as they are reviewed." : null;
}
