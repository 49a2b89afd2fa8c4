import { sql } from "drizzle-orm";
import { db } from "@/db/client";
import { seedDemo } from "@/db/seed/demo";
import { demoPassword } from "@/db/seed/network";
import { hashPassword } from "@/lib/auth/password";

if (!process.env.DATABASE_URL?.includes("test")) {
  // Integration tests wipe tables: refuse to run against anything but a test database.
  throw new Error("Integration tests need DATABASE_URL pointing at a test database (npm test sets it).");
}

let hash: string | undefined;

/** Empties every table and reseeds the demo network. */
export async function resetToDemo(): Promise<void> {
  const tables = await db().execute<{ tablename: string }>(sql`select tablename from pg_tables where schemaname = 'public'`);
  const names = tables.map((t) => `"${t.tablename}"`).join(", ");
  if (names) await db().execute(sql.raw(`truncate ${names} restart identity cascade`));
  hash ??= await hashPassword(demoPassword);
  await seedDemo(db(), hash);
}
