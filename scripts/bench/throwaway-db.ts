// A benchmark's own database on the cluster DATABASE_URL names (else the project's local one):
// made fresh for each run and dropped afterwards, also on Ctrl-C; BENCH_KEEP=1 keeps it, and a
// later BENCH_KEEP=1 run reuses it when its mark (a comment on the database saying what made it)
// is the same.
import path from "node:path";
import postgres from "postgres";
import { developmentDefaults } from "../../lib/env";

export function throwawayDatabase(name: string, label: string, mark: string) {
  const keep = process.env.BENCH_KEEP === "1";
  const clusterUrl = new URL(process.env.DATABASE_URL ?? developmentDefaults.DATABASE_URL);
  const url = Object.assign(new URL(clusterUrl), { pathname: `/${name}` }).toString();
  const admin = postgres(Object.assign(new URL(clusterUrl), { pathname: "/postgres" }).toString(), { max: 1, onnotice: () => undefined });
  let dropped = false;

  async function drop() {
    if (keep || dropped) return;
    dropped = true;
    await admin.unsafe(`drop database if exists "${name}" with (force)`);
    console.log(`[${label}] dropped ${name}`);
  }

  for (const signal of ["SIGINT", "SIGTERM"] as const) {
    process.on(signal, () => {
      console.log(`\n[${label}] ${signal}: removing the bench database`);
      drop().finally(() => process.exit(130));
    });
  }

  return {
    url,
    keep,
    /** Makes the database afresh; false when a kept one with the same mark is reused. */
    async prepare(): Promise<boolean> {
      const [existing] = await admin<{ mark: string | null }[]>`
        select shobj_description(oid, 'pg_database') as mark from pg_database where datname = ${name}`;
      if (existing && keep && existing.mark === mark) return false;
      await admin.unsafe(`drop database if exists "${name}" with (force)`);
      await admin.unsafe(`create database "${name}"`);
      return true;
    },
    /** Marks a finished database as made by this mark (a kept one is then reused). */
    async setMark() {
      await admin.unsafe(`comment on database "${name}" is '${mark.replaceAll("'", "''")}'`);
    },
    /**
     * Makes (or reuses) the database, points the app's client at it, migrates it and, when it is
     * new, seeds the demo and runs `fill`; returns the app's client modules for the timing.
     */
    async open(fill: (sql: postgres.Sql) => Promise<unknown>) {
      const fresh = await this.prepare();
      process.env.DATABASE_URL = url;
      const client = await import("../../db/client");
      const { migrate } = await import("drizzle-orm/postgres-js/migrator");
      await migrate(client.db(), { migrationsFolder: path.resolve(import.meta.dirname, "..", "..", "drizzle") });
      if (fresh) {
        console.log(`[${label}] generating in ${name} (once; BENCH_KEEP=1 keeps it for the next run)`);
        const { seedDemo } = await import("../../db/seed/demo");
        // Nobody signs in to the bench database: the password hash is never checked.
        await seedDemo(client.db(), "bench-no-sign-in");
        const started = performance.now();
        await fill(client.sqlClient());
        await this.setMark();
        console.log(`  generated in ${Math.round((performance.now() - started) / 1000)} s`);
      } else {
        console.log(`[${label}] reusing ${name} (BENCH_KEEP=1)`);
        await client.sqlClient()`analyze`;
      }
      return client;
    },
    /** Drops the database (unless kept) and closes the admin connection. */
    async close() {
      await drop().catch((error: unknown) => console.error(`[${label}] could not drop the bench database:`, error));
      await admin.end({ timeout: 5 });
    },
  };
}
