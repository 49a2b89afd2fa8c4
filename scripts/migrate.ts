import "./load-env";
import path from "node:path";
import { migrate } from "drizzle-orm/postgres-js/migrator";
import { closeDb, db } from "@/db/client";
import { requireEnv } from "./require-env";

requireEnv();
try {
  await migrate(db(), { migrationsFolder: path.resolve(import.meta.dirname, "..", "drizzle") });
  console.log("[turnstone] database migrated");
} catch (error) {
  console.error("[turnstone] migration failed:", error instanceof Error ? error.message : error);
  process.exitCode = 1;
} finally {
  await closeDb();
}
