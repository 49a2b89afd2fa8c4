import "./load-env";
import { sql } from "drizzle-orm";
import { closeDb, db } from "@/db/client";
import { isDatabaseEmpty, seedDemo, demoPassword } from "@/db/seed/demo";
import { hashPassword } from "@/lib/auth/password";

// Seeds only an empty database, so restarting never duplicates or overwrites real data.
try {
  if (await isDatabaseEmpty(db())) {
    const { sightings } = await seedDemo(db(), await hashPassword(demoPassword));
    // Fresh tables have no planner statistics until autovacuum gets round to them.
    await db().execute(sql`analyze`);
    console.log(`[turnstone] demo network seeded (${sightings} sightings)`);
  } else {
    console.log("[turnstone] database already has data: demo seed skipped");
  }
} catch (error) {
  console.error("[turnstone] seeding failed:", error instanceof Error ? error.message : error);
  process.exitCode = 1;
} finally {
  await closeDb();
}
