import { sql } from "drizzle-orm";
import { beforeAll, describe, expect, it } from "vitest";
import { db } from "@/db/client";
import { resetToDemo } from "./support/db";

type Row = { habitat: string; code: string; year: number; richness: number };

describe("the demo network", () => {
  let rows: Row[];

  beforeAll(async () => {
    await resetToDemo();
    // Accepted species per transect and season year.
    rows = await db().execute<Row>(sql`
      select h.code as habitat, t.code, extract(year from v.visit_date)::int as year, count(distinct s.species_id)::int as richness
      from sightings s join visits v on v.id = s.visit_id join transects t on t.id = v.transect_id
      join habitat_groups h on h.id = t.habitat_group_id
      where s.status in ('accepted', 'pending', 'queried')
      group by 1, 2, 3`);
  });

  it("has the shape the brief asks for", async () => {
    const [counts] = await db().execute<Record<string, number>>(sql`select
      (select count(*)::int from transects) as transects,
      (select count(*)::int from habitat_groups) as habitats,
      (select count(*)::int from species where taxon_rank = 'species') as species,
      (select count(*)::int from seasons) as seasons,
      (select count(*)::int from users where roles = '{volunteer}') as volunteers,
      (select count(*)::int from users where roles <> '{volunteer}') as staff`);
    expect(counts).toEqual({ transects: 24, habitats: 4, species: 47, seasons: 2, volunteers: 12, staff: 3 });
  });

  it("last season is fully checked; this season is partly waiting", async () => {
    const rows = await db().execute<{ year: number; status: string; n: number }>(sql`
      select extract(year from v.visit_date)::int as year, s.status, count(*)::int as n
      from sightings s join visits v on v.id = s.visit_id group by 1, 2`);
    expect(rows.filter((r) => r.year === 2025 && (r.status === "pending" || r.status === "queried"))).toHaveLength(0);
    expect(rows.find((r) => r.year === 2026 && r.status === "pending")?.n ?? 0).toBeGreaterThan(50);
  });

  it("tells its story: chalk downland gains species, wetland margins lose them", () => {
    const change = (habitat: string) => {
      const sum = (year: number) => rows.filter((r) => r.habitat === habitat && r.year === year).reduce((a, r) => a + r.richness, 0);
      return sum(2026) - sum(2025);
    };
    expect(change("CHK")).toBeGreaterThan(10);
    expect(change("WET")).toBeLessThan(-10);
  });

  it("is deterministic: reseeding gives identical rows", async () => {
    const fingerprint = async () =>
      (await db().execute<{ f: string }>(sql`select md5(string_agg(id::text || species_id::text || count::text || status::text, ',' order by id)) as f from sightings`))[0]!.f;
    const first = await fingerprint();
    await resetToDemo();
    expect(await fingerprint()).toBe(first);
  });
});
