import { drizzle, type PostgresJsDatabase } from "drizzle-orm/postgres-js";
import postgres from "postgres";
import { env } from "@/lib/env";
import * as schema from "./schema";

export type Database = PostgresJsDatabase<typeof schema>;
export type Transaction = Parameters<Parameters<Database["transaction"]>[0]>[0];

// Next's dev server re-evaluates modules on every change; keeping the pool on globalThis
// stops each reload from opening a fresh set of connections.
const globalForDb = globalThis as unknown as { turnstoneSql?: postgres.Sql; turnstoneDb?: Database };

export function sqlClient(): postgres.Sql {
  globalForDb.turnstoneSql ??= postgres(env().DATABASE_URL, {
    max: env().DATABASE_POOL_SIZE,
    idle_timeout: 20,
    connect_timeout: 10,
    onnotice: () => undefined,
  });
  return globalForDb.turnstoneSql;
}

export function db(): Database {
  globalForDb.turnstoneDb ??= drizzle(sqlClient(), { schema, casing: undefined });
  return globalForDb.turnstoneDb;
}

export async function closeDb(): Promise<void> {
  const client = globalForDb.turnstoneSql;
  globalForDb.turnstoneSql = undefined;
  globalForDb.turnstoneDb = undefined;
  await client?.end({ timeout: 5 });
}

export { schema };
