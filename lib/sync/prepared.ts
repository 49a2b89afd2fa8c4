import "server-only";
import type { SQL } from "drizzle-orm";
import { PgDialect } from "drizzle-orm/pg-core";
import type { PostgresJsSession } from "drizzle-orm/postgres-js";
import type { Sql } from "postgres";
import type { BatchTx } from "./batch-transaction";

const dialect = new PgDialect();

/**
 * Runs a hand-written statement on the batch's connection as a prepared statement.
 * drizzle's `tx.execute` sends raw SQL unprepared, and postgres-js then has the server describe
 * its parameters first: a second round trip per statement that also stops the connection's
 * pipeline. Prepared, the statement is parsed once per connection and pipelines with the rest.
 */
export async function executePrepared<Row>(tx: BatchTx, query: SQL): Promise<Row[]> {
  const { sql: text, params } = dialect.sqlToQuery(query);
  const { client } = tx._.session as unknown as PostgresJsSession<Sql, Record<string, never>, Record<string, never>>;
  return (await client.unsafe(text, params as never[], { prepare: true })) as unknown as Row[];
}
