import "server-only";
import type { SQL } from "drizzle-orm";
import { PgDialect } from "drizzle-orm/pg-core";
import type { PostgresJsSession } from "drizzle-orm/postgres-js";
import type { Sql } from "postgres";
import type { BatchTx } from "./batch-transaction";

/** The one SQL dialect of the sync code: renders statements and builds its query builders. */
export const dialect = new PgDialect();

/**
 * Runs a hand-written statement on the batch's connection as a prepared statement.
 * drizzle's `tx.execute` sends raw SQL unprepared, and postgres-js then has the server describe
 * its parameters first: a second round trip per statement that also stops the connection's
 * pipeline. Prepared, the statement is parsed once per connection and pipelines with the rest.
 */
export function executePrepared<Row>(tx: BatchTx, query: SQL): Promise<Row[]> {
  const { sql: text, params } = dialect.sqlToQuery(query);
  const { client } = tx._.session as unknown as PostgresJsSession<Sql, Record<string, never>, Record<string, never>>;
  // Sent at once (postgres-js otherwise waits for the first `then`), so statements reach the
  // connection in call order: the batch's COMMIT is queued right behind its writes.
  return client.unsafe(text, params as never[], { prepare: true }).execute() as unknown as Promise<Row[]>;
}
