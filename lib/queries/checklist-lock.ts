import "server-only";
import { sql } from "drizzle-orm";
import type { Transaction } from "@/db/client";

/**
 * Every checklist write (import, edit, merge, tags) checks names across entries, synonyms and
 * aggregates before it writes; taking this lock first runs them one at a time, so no two can both
 * pass their checks and then clash. PostgreSQL releases it at commit or rollback.
 */
export async function lockChecklist(tx: Transaction): Promise<void> {
  await tx.execute(sql`select pg_advisory_xact_lock(hashtext('turnstone.checklist'))`);
}
