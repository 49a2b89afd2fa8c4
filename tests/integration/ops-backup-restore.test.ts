import { spawnSync } from "node:child_process";
import { randomUUID } from "node:crypto";
import { mkdtempSync, readFileSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import { DeleteObjectCommand, HeadObjectCommand, PutObjectCommand } from "@aws-sdk/client-s3";
import postgres from "postgres";
import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";
import { closeDb } from "@/db/client";
import { photoBucket, s3 } from "@/lib/storage/s3";
import { repoRoot } from "../support/ops-shell";
import { resetToDemo } from "./support/db";

// npm run db:backup, then npm run db:restore into a new, empty database: every table comes back
// with every row (counts, and checksums of the rows of the tables people's work lives in), and the
// app's health check passes on the copy. pg_dump's custom format is one consistent snapshot of the
// database, restored by pg_restore (PostgreSQL docs, "pg_dump" and "pg_restore").
const sourceUrl = process.env.DATABASE_URL!;
const restoredName = `${new URL(sourceUrl).pathname.slice(1)}_restored`;
const restoredUrl = Object.assign(new URL(sourceUrl), { pathname: `/${restoredName}` }).toString();
const backupDir = mkdtempSync(path.join(tmpdir(), "turnstone-backup-"));
const prefix = `ops-backup-test/${randomUUID()}/`;
const uploaded = [`${prefix}a.txt`, `${prefix}b.txt`];

function run(script: string, args: string[], databaseUrl = sourceUrl) {
  return spawnSync("bash", [`scripts/${script}`, ...args], {
    cwd: repoRoot,
    env: { ...process.env, DATABASE_URL: databaseUrl, TURNSTONE_BACKUP_DIR: backupDir },
    encoding: "utf8",
    timeout: 120_000,
    stdio: ["ignore", "pipe", "pipe"],
  });
}

type Counts = Record<string, number>;

/** Every table of the app's schemas (the migrations' own table included) with its row count. */
async function rowCounts(url: string): Promise<Counts> {
  const sql = postgres(url, { max: 1, onnotice: () => undefined });
  try {
    const tables = await sql<{ name: string }[]>`select format('%I.%I', schemaname, tablename) as name from pg_tables
      where schemaname not in ('pg_catalog', 'information_schema') order by 1`;
    const counts: Counts = {};
    for (const { name } of tables) counts[name] = (await sql.unsafe(`select count(*)::int as n from ${name}`))[0]!.n as number;
    return counts;
  } finally {
    await sql.end();
  }
}

/** An md5 over every row of each table, in a fixed order. */
async function checksums(url: string, tables: string[]) {
  const sql = postgres(url, { max: 1, onnotice: () => undefined });
  try {
    const sums: Record<string, string> = {};
    for (const table of tables) {
      sums[table] = (await sql.unsafe(`select md5(coalesce(string_agg(t::text, E'\\n' order by t::text), '')) as sum from ${table} t`))[0]!.sum as string;
    }
    return sums;
  } finally {
    await sql.end();
  }
}

async function onMaintenance(statement: string) {
  const admin = postgres(Object.assign(new URL(sourceUrl), { pathname: "/postgres" }).toString(), { max: 1, onnotice: () => undefined });
  try {
    await admin.unsafe(statement);
  } finally {
    await admin.end();
  }
}

describe("npm run db:backup and npm run db:restore", () => {
  let dump: string;
  let objectList: string;

  beforeAll(async () => {
    await resetToDemo();
    for (const key of uploaded) await s3().send(new PutObjectCommand({ Bucket: photoBucket(), Key: key, Body: `contents of ${key}` }));
    await onMaintenance(`drop database if exists "${restoredName}" with (force)`);
    await onMaintenance(`create database "${restoredName}"`);
  });

  afterAll(async () => {
    for (const key of uploaded) await s3().send(new DeleteObjectCommand({ Bucket: photoBucket(), Key: key }));
    await onMaintenance(`drop database if exists "${restoredName}" with (force)`);
    rmSync(backupDir, { recursive: true, force: true });
  });

  it("writes a dump and the photo store's object list, named with the time, and prints both paths", async () => {
    const backup = run("db-backup.sh", []);
    // (stderr may carry the AWS SDK's notice about Node 20's support ending.)
    expect(backup.stderr).not.toMatch(/ERROR/);
    expect(backup.status).toBe(0);
    dump = backup.stdout.match(/Database dump: (\S+)$/m)![1]!;
    objectList = backup.stdout.match(/Photo store's object list: (\S+)$/m)![1]!;
    expect(path.dirname(dump)).toBe(backupDir);
    expect(path.basename(dump)).toMatch(/^turnstone-\d{4}-\d{2}-\d{2}T\d{6}Z\.dump$/);
    expect(path.basename(objectList)).toBe(path.basename(dump).replace(/\.dump$/, ".objects.json"));
    // The custom format starts with the bytes "PGDMP" (the archive magic of PostgreSQL's pg_backup_archiver.c; from memory).
    expect(readFileSync(dump).subarray(0, 5).toString()).toBe("PGDMP");

    const listed = JSON.parse(readFileSync(objectList, "utf8")) as { bucket: string; objects: { key: string; size: number; etag: string; lastModified: string }[] };
    expect(listed.bucket).toBe(photoBucket());
    for (const key of uploaded) {
      const head = await s3().send(new HeadObjectCommand({ Bucket: photoBucket(), Key: key }));
      const entry = listed.objects.find((o) => o.key === key);
      expect(entry).toEqual({ key, size: head.ContentLength, etag: head.ETag, lastModified: head.LastModified!.toISOString() });
    }
  }, 180_000);

  it("asks before restoring, and without a terminal needs --yes", async () => {
    const unasked = run("db-restore.sh", [dump], restoredUrl);
    expect(unasked.status).toBe(2);
    expect(unasked.stderr).toMatch(/add --yes/);
    expect(await rowCounts(restoredUrl)).toEqual({});
  }, 120_000);

  it("restores every row into an empty database", async () => {
    const restore = run("db-restore.sh", [dump, "--yes"], restoredUrl);
    expect(restore.stderr).not.toMatch(/ERROR|error/);
    expect(restore.status).toBe(0);
    const [before, after] = [await rowCounts(sourceUrl), await rowCounts(restoredUrl)];
    expect(Object.keys(before).length).toBeGreaterThan(15);
    expect(before["public.sightings"]).toBeGreaterThan(1000);
    expect(after).toEqual(before);
    const tables = ["public.users", "public.visits", "public.sightings", "public.verification_events", "drizzle.__drizzle_migrations"];
    expect(await checksums(restoredUrl, tables)).toEqual(await checksums(sourceUrl, tables));
  }, 180_000);

  it("refuses a database that is not empty", async () => {
    const again = run("db-restore.sh", [dump, "--yes"], restoredUrl);
    expect(again.status).not.toBe(0);
    expect(again.stderr).toMatch(/is not empty/);
  }, 120_000);

  it("leaves the app healthy on the restored copy", async () => {
    await closeDb();
    vi.stubEnv("DATABASE_URL", restoredUrl);
    vi.resetModules();
    try {
      const { healthReport } = await import("@/lib/health");
      const { db } = await import("@/db/client");
      const report = await healthReport();
      expect(report.checks.database.status).toBe("ok");
      expect(report.status).toBe("ok");
      const rows = await db().execute<{ db: string }>((await import("drizzle-orm")).sql`select current_database() as db`);
      expect(rows[0]!.db).toBe(restoredName);
    } finally {
      const { closeDb: closeRestored } = await import("@/db/client");
      await closeRestored();
      vi.unstubAllEnvs();
    }
  }, 60_000);
});
