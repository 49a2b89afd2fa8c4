import { sql } from "drizzle-orm";
import { beforeAll, describe, expect, it } from "vitest";
import { db } from "@/db/client";
import { CONFIRMED_ONLY, countedSql, countingNote } from "@/lib/queries/counting";
import { verifiedDataBySeason } from "@/lib/queries/partner";
import { resetToDemo } from "./support/db";

// The counting rule against the demo's sightings, counted by hand by status.
describe("the counting rule", () => {
  let byStatus: Record<string, number>;

  beforeAll(async () => {
    await resetToDemo();
    const rows = await db().execute<{ status: string; n: number }>(sql`select status, count(*)::int as n from sightings group by status`);
    byStatus = Object.fromEntries(rows.map((r) => [r.status, r.n]));
    expect(Object.keys(byStatus).sort()).toEqual(["accepted", "pending", "queried", "rejected"]); // every status is there to be told apart
  });

  const counted = async (includeWaiting: boolean) => {
    const [row] = await db().execute<{ n: number }>(sql`select count(*)::int as n from sightings s where ${countedSql(sql`s.status`, { includeWaiting })}`);
    return row!.n;
  };

  it("counts confirmed sightings only, unless waiting ones are chosen; never the set-aside ones", async () => {
    expect(await counted(false)).toBe(byStatus.accepted);
    expect(await counted(true)).toBe(byStatus.accepted! + byStatus.pending! + byStatus.queried!);
  });

  it("makes a result with waiting sightings say so, and one without say nothing", () => {
    expect(countingNote(CONFIRMED_ONLY)).toBeNull();
    expect(countingNote({ includeWaiting: true })).toMatch(/waiting for review/);
  });

  it("is what the partners' season summary counts", async () => {
    const seasons = await verifiedDataBySeason();
    expect(seasons.reduce((n, s) => n + s.acceptedRecords, 0)).toBe(byStatus.accepted);
  });
});
