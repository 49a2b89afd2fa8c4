import type { TransactionSql } from "postgres";
import { beforeAll, describe, expect, it } from "vitest";
import { sqlClient } from "@/db/client";
import { ALPHA, PERMUTATIONS } from "@/lib/limits/analysis";
import { BEAUFORT_FORCE, CLOUD_COVER_PERCENT, SECTIONS, SIGHTING_COUNT, TEMPERATURE_C, type Range } from "@/lib/limits/counts";
import { resetToDemo } from "./support/db";

// PostgreSQL itself holds the limits of lib/limits: a value at each edge is stored, one just past
// it is refused by the table's check constraint (SQLSTATE 23514, check_violation: PostgreSQL
// manual, Appendix A). Every attempt runs in a transaction that is rolled back.

const ROLLED_BACK = new Error("rolled back on purpose");

/** "stored" when PostgreSQL took the write, else the name of the check constraint that refused it. */
async function attempt(write: (tx: TransactionSql) => Promise<unknown>): Promise<string> {
  try {
    await sqlClient().begin(async (tx) => {
      await write(tx);
      throw ROLLED_BACK;
    });
  } catch (error) {
    if (error === ROLLED_BACK) return "stored";
    const e = error as { code?: string; constraint_name?: string };
    if (e.code === "23514") return e.constraint_name ?? "check";
    throw error;
  }
  throw new Error("unreachable");
}

/** The outcomes of writing a range's edges and the values just past them (by `step`). */
async function edges(write: (tx: TransactionSql, value: number) => Promise<unknown>, range: Range, step = 1) {
  return {
    atMin: await attempt((tx) => write(tx, range.min)),
    atMax: await attempt((tx) => write(tx, range.max)),
    belowMin: await attempt((tx) => write(tx, range.min - step)),
    aboveMax: await attempt((tx) => write(tx, range.max + step)),
  };
}

describe("the database holds the limits of lib/limits", () => {
  let visitId: string;
  let sightingId: string;
  let transectId: string;
  let seasonIds: [string, string];

  beforeAll(async () => {
    await resetToDemo();
    const sql = sqlClient();
    [{ id: visitId }] = (await sql`select id from visits limit 1`) as unknown as [{ id: string }];
    [{ id: sightingId }] = (await sql`select id from sightings limit 1`) as unknown as [{ id: string }];
    [{ id: transectId }] = (await sql`select id from transects limit 1`) as unknown as [{ id: string }];
    const seasons = await sql`select id from seasons order by starts_on limit 2`;
    seasonIds = [seasons[0]!.id, seasons[1]!.id];
  });

  it("a visit's wind, cloud cover and temperature", async () => {
    const visitSet = (column: string) => (tx: TransactionSql, value: number) => tx`update visits set ${tx(column)} = ${value} where id = ${visitId}`;
    expect(await edges(visitSet("wind_beaufort"), BEAUFORT_FORCE)).toEqual({ atMin: "stored", atMax: "stored", belowMin: "visits_wind_beaufort", aboveMax: "visits_wind_beaufort" });
    expect(await edges(visitSet("cloud_cover_percent"), CLOUD_COVER_PERCENT)).toEqual({ atMin: "stored", atMax: "stored", belowMin: "visits_cloud_percent", aboveMax: "visits_cloud_percent" });
    expect(await edges(visitSet("temperature_c"), TEMPERATURE_C, 0.1)).toEqual({
      atMin: "stored", atMax: "stored", belowMin: "visits_temperature_plausible", aboveMax: "visits_temperature_plausible",
    });
  });

  it("a sighting's count and section, and a transect's sections", async () => {
    const sightingSet = (column: string) => (tx: TransactionSql, value: number) => tx`update sightings set ${tx(column)} = ${value} where id = ${sightingId}`;
    expect((await edges(sightingSet("count"), SIGHTING_COUNT)).belowMin).toBe("sightings_count_nonnegative");
    expect((await edges(sightingSet("section"), SECTIONS)).belowMin).toBe("sightings_section_positive");
    const sections = (tx: TransactionSql, value: number) => tx`update transects set section_count = ${value} where id = ${transectId}`;
    expect(await edges(sections, SECTIONS)).toEqual({ atMin: "stored", atMax: "stored", belowMin: "transects_sections_positive", aboveMax: "transects_sections_positive" });
  });

  it("an analysis run's permutations (0 to 99,999) and alpha (strictly between 0 and 1)", async () => {
    const run = (tx: TransactionSql, permutations: number, alpha: number) =>
      tx`insert into analysis_runs (baseline_season_id, comparison_season_id, permutations, alpha) values (${seasonIds[0]}, ${seasonIds[1]}, ${permutations}, ${alpha})`;
    expect(await edges((tx, n) => run(tx, n, ALPHA.default), PERMUTATIONS)).toEqual({
      atMin: "stored", atMax: "stored", belowMin: "analysis_runs_permutations", aboveMax: "analysis_runs_permutations",
    });
    const alphas = await Promise.all([1e-9, 0.999999, ALPHA.above, ALPHA.below].map((a) => attempt((tx) => run(tx, PERMUTATIONS.default, a))));
    expect(alphas).toEqual(["stored", "stored", "analysis_runs_alpha", "analysis_runs_alpha"]);
  });
});
