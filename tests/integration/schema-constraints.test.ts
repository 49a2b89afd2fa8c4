import { eq, sql } from "drizzle-orm";
import { beforeAll, describe, expect, it } from "vitest";
import { db } from "@/db/client";
import { seasons, sightings, species, transects, users, visits } from "@/db/schema";
import { resetToDemo } from "./support/db";

// Postgres reports a broken CHECK as SQLSTATE 23514, a unique violation as 23505 and a
// foreign-key violation as 23503 (PostgreSQL manual, appendix A "Error codes").
async function sqlState(promise: Promise<unknown>): Promise<string | undefined> {
  try {
    await promise;
    return undefined;
  } catch (error) {
    const cause = (error as { cause?: { code?: string } }).cause ?? (error as { code?: string });
    return cause.code;
  }
}

describe("database rules", () => {
  let visitId: string;
  let speciesId: string;
  let transectId: string;
  let volunteerId: string;

  beforeAll(async () => {
    await resetToDemo();
    const [v] = await db().select().from(visits).limit(1);
    const [s] = await db().select().from(species).limit(1);
    visitId = v!.id;
    transectId = v!.transectId;
    volunteerId = v!.volunteerId;
    speciesId = s!.id;
  });

  it("every migration applied: the domain's tables exist", async () => {
    const rows = await db().execute<{ tablename: string }>(sql`select tablename from pg_tables where schemaname = 'public'`);
    const names = rows.map((r) => r.tablename);
    for (const t of ["users", "species", "species_tags", "habitat_groups", "transects", "transect_assignments", "seasons", "visits", "sightings", "photos", "verification_events", "analysis_runs", "analysis_site_results", "analysis_exclusions", "analysis_chunks", "email_outbox", "newsletters", "export_log"]) {
      expect(names).toContain(t);
    }
  });

  it("refuses a negative count", async () => {
    const code = await sqlState(db().insert(sightings).values({ id: crypto.randomUUID(), visitId, speciesId, count: -1 }));
    expect(code).toBe("23514");
  });

  it("refuses wind outside the Beaufort scale 0-12 and accepts its ends", async () => {
    const base = { transectId, volunteerId, visitDate: "2026-05-01", startTime: "10:00:00" };
    expect(await sqlState(db().insert(visits).values({ ...base, id: crypto.randomUUID(), windBeaufort: 13 }))).toBe("23514");
    expect(await sqlState(db().insert(visits).values({ ...base, id: crypto.randomUUID(), windBeaufort: -1 }))).toBe("23514");
    expect(await sqlState(db().insert(visits).values({ ...base, id: crypto.randomUUID(), windBeaufort: 12 }))).toBeUndefined();
    expect(await sqlState(db().insert(visits).values({ ...base, id: crypto.randomUUID(), windBeaufort: 0 }))).toBeUndefined();
  });

  it("refuses a visit that ends before it starts", async () => {
    const code = await sqlState(
      db().insert(visits).values({ id: crypto.randomUUID(), transectId, volunteerId, visitDate: "2026-05-01", startTime: "12:00:00", endTime: "11:00:00" }),
    );
    expect(code).toBe("23514");
  });

  it("refuses a season that ends before it starts", async () => {
    const code = await sqlState(db().insert(seasons).values({ name: "Backwards", startsOn: "2027-09-01", endsOn: "2027-04-01" }));
    expect(code).toBe("23514");
  });

  it("refuses a route that is not a GeoJSON LineString", async () => {
    const [hab] = await db().select({ id: transects.habitatGroupId }).from(transects).limit(1);
    const code = await sqlState(
      db().insert(transects).values({
        code: "BAD-01",
        name: "Bad",
        habitatGroupId: hab!.id,
        route: { type: "Point", coordinates: [[0, 0]] } as never,
        sectionCount: 3,
        lengthMetres: 100,
      }),
    );
    expect(code).toBe("23514");
  });

  it("refuses half a position (latitude without longitude)", async () => {
    const code = await sqlState(db().insert(sightings).values({ id: crypto.randomUUID(), visitId, speciesId, latitude: 51 }));
    expect(code).toBe("23514");
  });

  it("treats e-mail addresses case-insensitively", async () => {
    const [u] = await db().select().from(users).limit(1);
    const code = await sqlState(db().insert(users).values({ email: u!.email.toUpperCase(), name: "Copy", roles: ["volunteer"] }));
    expect(code).toBe("23505");
  });

  it("refuses a sighting of a species that is not on the checklist", async () => {
    const code = await sqlState(db().insert(sightings).values({ id: crypto.randomUUID(), visitId, speciesId: crypto.randomUUID() }));
    expect(code).toBe("23503");
  });

  it("deleting a visit removes its sightings (cascade), nothing else", async () => {
    const id = crypto.randomUUID();
    await db().insert(visits).values({ id, transectId, volunteerId, visitDate: "2026-06-01", startTime: "10:00:00" });
    await db().insert(sightings).values({ id: crypto.randomUUID(), visitId: id, speciesId });
    await db().delete(visits).where(eq(visits.id, id));
    const left = await db().select().from(sightings).where(eq(sightings.visitId, id));
    expect(left).toHaveLength(0);
  });
});
