import "server-only";
import type { SQL } from "drizzle-orm";
import { PgDialect } from "drizzle-orm/pg-core";
import type { ReservedSql } from "postgres";
import type { BatchTx } from "./batch-transaction";

/** The one SQL dialect of the sync code's hand-written statements. */
export const dialect = new PgDialect();

/**
 * Sends one rendered statement on the batch's connection as a prepared statement, at once.
 * Unprepared, postgres-js first has the server describe a parameterised statement: a second
 * round trip per statement that also stops the connection's pipeline. Prepared, it is parsed once
 * per connection and pipelines with the rest. Sent at once (postgres-js otherwise waits for the
 * first `then`), statements reach the connection in call order, so the batch's COMMIT is queued
 * right behind its writes. `values` asks for rows as arrays, as drizzle's query builder maps them.
 */
export function sendPrepared(connection: ReservedSql, text: string, params: unknown[], rows: "objects" | "values" = "objects"): Promise<unknown[]> {
  const query = connection.unsafe(text, params as never[], { prepare: true });
  return (rows === "values" ? query.values() : query).execute() as unknown as Promise<unknown[]>;
}

/** Runs a hand-written statement, rendered with drizzle's public `sqlToQuery`, prepared on the batch's connection. */
export function executePrepared<Row>(tx: BatchTx, query: SQL): Promise<Row[]> {
  const { sql: text, params } = dialect.sqlToQuery(query);
  return sendPrepared(tx.connection, text, params) as Promise<Row[]>;
}
