import "server-only";
import { drizzle, type PgRemoteDatabase } from "drizzle-orm/pg-proxy";
import type { ReservedSql } from "postgres";
import { db, sqlClient } from "@/db/client";
import { sendPrepared } from "./prepared";

/**
 * What the sync code may use inside a batch's transaction: the batch's own postgres.js
 * connection (for hand-written statements, `executePrepared`) and drizzle's query builder on
 * it. The builder is drizzle's public proxy driver (drizzle-orm/pg-proxy), which renders each
 * statement, hands it to us to run, and maps the rows back; we run it prepared on the connection.
 */
export type BatchTx = { readonly connection: ReservedSql; readonly builder: PgRemoteDatabase };

function batchTx(connection: ReservedSql): BatchTx {
  const builder = drizzle(async (text, params, method) => ({ rows: await sendPrepared(connection, text, params, method === "all" ? "values" : "objects") }));
  return { connection, builder };
}

/** What a batch's work hands back: its answer, and its writes, already sent but not yet done. */
export type BatchWork<T> = { value: T; written: Promise<unknown> };

/**
 * Runs one batch in a transaction on a connection of its own, in two round trips instead of
 * four: BEGIN goes in the same network write as the batch's reads, and COMMIT in the same write
 * as its writes. `work` must await `begun` before it writes anything (if BEGIN failed, only reads
 * ran outside a transaction), and must have sent all its writes when it returns. A write that
 * fails aborts the transaction in PostgreSQL, which then answers the queued COMMIT by rolling
 * back; anything else that fails gets an explicit ROLLBACK.
 */
export async function inBatchTransaction<T>(work: (tx: BatchTx, begun: Promise<unknown>) => Promise<BatchWork<T>>): Promise<T> {
  // The connection shares the pool's type parsers, which db() sets as drizzle expects them
  // (dates and times as text), so rows map as they do everywhere else.
  db();
  const connection = await sqlClient().reserve();
  try {
    // postgres-js sends a query when it is executed; the reads issued next share its write.
    // The batch's statements are prepared once per connection; left to choose, PostgreSQL re-plans
    // them on every run (it cannot price `= any($1)` generically), which cost more than running them.
    const begun = connection.unsafe("begin; set local plan_cache_mode = force_generic_plan").execute();
    begun.catch(() => undefined); // awaited by `work`; this only avoids an unhandled rejection
    try {
      const { value, written } = await work(batchTx(connection), begun);
      const committed = connection.unsafe("commit").execute();
      const [, outcome] = await Promise.all([written, committed]);
      // PostgreSQL answers COMMIT of an aborted transaction with ROLLBACK rather than an error.
      if ((outcome as unknown as { command?: string }).command !== "COMMIT") throw new Error("the batch's transaction did not commit");
      return value;
    } catch (error) {
      await connection.unsafe("rollback").catch(() => undefined);
      throw error;
    }
  } finally {
    connection.release();
  }
}
