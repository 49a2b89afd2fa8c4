import "server-only";
import { PgDialect } from "drizzle-orm/pg-core";
import { PostgresJsDatabase, PostgresJsSession } from "drizzle-orm/postgres-js";
import type { ReservedSql } from "postgres";
import { db, sqlClient } from "@/db/client";

/** What the sync code may use inside a batch's transaction: drizzle's query builders on one connection. */
export type BatchTx = PostgresJsDatabase<Record<string, never>>;

const dialect = new PgDialect();

// drizzle() itself wants the pool's options object, which a reserved connection lacks; the pool's
// drizzle instance (db()) has already installed its type parsers, which the connection shares.
function queryBuilderOn(connection: ReservedSql): BatchTx {
  return new PostgresJsDatabase(dialect, new PostgresJsSession(connection, dialect, undefined), undefined) as BatchTx;
}

/**
 * Runs one batch in a transaction on a connection of its own, sending BEGIN in the same network
 * write as the batch's first reads instead of waiting a round trip for it (drizzle's
 * `transaction()` awaits BEGIN first). `work` must await `begun` before it writes anything: if
 * BEGIN failed, only reads will have run outside a transaction. COMMIT is sent after `work`
 * returns, ROLLBACK if it throws.
 */
export async function inBatchTransaction<T>(work: (tx: BatchTx, begun: Promise<unknown>) => Promise<T>): Promise<T> {
  db(); // installs drizzle's type parsers on the pool before the first batch
  const connection = await sqlClient().reserve();
  try {
    // postgres-js sends a query when it is executed; the reads issued next share its write.
    // The batch's statements are prepared once per connection; left to choose, PostgreSQL re-plans
    // them on every run (it cannot price `= any($1)` generically), which cost more than running them.
    const begun = connection.unsafe("begin; set local plan_cache_mode = force_generic_plan").execute();
    begun.catch(() => undefined); // awaited by `work`; this only avoids an unhandled rejection
    const result = await work(queryBuilderOn(connection), begun).catch(async (error: unknown) => {
      await connection.unsafe("rollback").catch(() => undefined);
      throw error;
    });
    await connection.unsafe("commit");
    return result;
  } finally {
    connection.release();
  }
}
