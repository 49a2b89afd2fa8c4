// npm run db:seed [-- --demo]: the demo network, into an empty database of the project's own
// local cluster (scripts/demo-seed-policy.ts), or anywhere empty with --demo.
import "./load-env";
import { sql } from "drizzle-orm";
import { z } from "zod";
import { closeDb, db } from "@/db/client";
import { isDatabaseEmpty, seedDemo, demoPassword } from "@/db/seed/demo";
import { hashPassword } from "@/lib/auth/password";
import { isProduction } from "@/lib/env";
import { parseFlags } from "./cli-flags";
import { demoSeedRefusal } from "./demo-seed-policy";
import { requireEnv } from "./require-env";

const flags = parseFlags("npm run db:seed [-- --demo]", { demo: { type: "boolean" } }, z.object({ demo: z.boolean().default(false) }));
const config = requireEnv();
const refusal = demoSeedRefusal({ databaseUrl: config.DATABASE_URL, production: isProduction(config), demoFlag: flags.demo });

if (refusal) {
  console.log(`[turnstone] demo seed skipped: ${refusal}. (npm run db:seed -- --demo seeds an empty database anyway; its accounts share a published password.)`);
  console.log("[turnstone] To create the network's first organiser: npm run setup:organiser -- --email you@your-network.example");
} else {
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
}
