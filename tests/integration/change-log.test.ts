import { sql } from "drizzle-orm";
import { describe, expect, it } from "vitest";
import { db } from "@/db/client";
import { networkChanges, users } from "@/db/schema";
import { listChanges, logChanges } from "@/lib/queries/change-log";
import { resetToDemo } from "./support/db";

describe("the network change log", () => {
  it("takes an import's worth of rows in one call (past PostgreSQL's 65,535 parameters per statement) and pages them newest first", async () => {
    await resetToDemo();
    await db().delete(networkChanges);
    const [someone] = await db().select({ id: users.id }).from(users).limit(1);
    const entries = Array.from({ length: 10_000 }, (_, i) => ({ entity: "species" as const, entityId: `s${i}`, action: "create", summary: `Added entry ${i}`, after: { i } }));
    await db().transaction((tx) => logChanges(tx, someone!, entries));
    const [{ n }] = await db().select({ n: sql<number>`count(*)`.mapWith(Number) }).from(networkChanges) as [{ n: number }];
    expect(n).toBe(10_000);

    const first = await listChanges({ entity: "species" });
    expect(first.rows).toHaveLength(50);
    expect(first.next).not.toBeNull();
    const second = await listChanges({ entity: "species", after: first.next! });
    const seen = new Set([...first.rows, ...second.rows].map((r) => r.id));
    expect(seen.size).toBe(100); // no row twice across the page boundary
    expect(await listChanges({ entity: "species", entityId: "s42" })).toMatchObject({ rows: [{ summary: "Added entry 42" }], next: null });
  }, 120_000);
});
