// Benchmark of the review queue at network scale (npm run bench:review, issue 10).
// Makes its own database, turnstone_bench_review, on the cluster DATABASE_URL names (else the
// project's local one), migrates it, seeds the demo network, generates 200,000 sightings over five
// seasons in SQL (scripts/bench/network-data.ts) and gives them a review mix: the open season mostly
// waiting, questions asked and answered, set-asides, every warning and walk-rule breach
// (scripts/bench/review-data.ts). Then times reviewQueuePage (lib/queries/review-queue.ts), the call
// behind GET /api/review/sightings, in-process, for the first and the second page of every single
// filter (each status, season, transect, habitat, a common and a rare species, volunteer, a date
// range, each warning) and every sort column: p50/p95/max, PASS/FAIL against p95 under 150 ms.
// Then EXPLAIN of the page's and the count's SQL for each: the indexes used, and any sequential
// scan of sightings or visits.
// The database is dropped afterwards, also on failure or Ctrl-C; BENCH_KEEP=1 keeps it and a
// later BENCH_KEEP=1 run reuses it (pending migrations are applied) instead of generating again.
//   BENCH_SIGHTINGS (default 200,000), BENCH_TRANSECTS (60), BENCH_RUNS (timed calls per line, default 40),
//   BENCH_ONLY (comma-separated parts of filter names: time only those, e.g. "status=accepted,sort=").
import "./server-conditions";
import "./load-env";
import postgres from "postgres";
import { PgDialect } from "drizzle-orm/pg-core";
import type { SQL } from "drizzle-orm";
import { generate, type Shape } from "./bench/network-data";
import { giveReviewMix } from "./bench/review-data";
import { throwawayDatabase } from "./bench/throwaway-db";
import { fmt, timeCalls, type Figures } from "./bench/timing";
import { queueQuerySchema, queueSorts, statusFilters, type QueueQuery } from "../lib/review/queue-filter";
import { warningFilters } from "../lib/review/warnings";

const DB_NAME = "turnstone_bench_review";
const TARGET_P95_MS = 150;
const RUNS = Number(process.env.BENCH_RUNS ?? 40);
const WARM_UP = 5;
const shape: Shape = {
  transects: Number(process.env.BENCH_TRANSECTS ?? 60),
  seasons: 5,
  weeks: 26,
  sightings: Number(process.env.BENCH_SIGHTINGS ?? 200_000),
  changes: 1_000,
};
// The mix's version is in the mark, so a kept database made by an older mix is made again.
const MARK = `turnstone bench:review mix 2 ${JSON.stringify(shape)}`;
const bench = throwawayDatabase(DB_NAME, "bench:review", MARK);

const say = (line: string) => console.log(line);
const n = (x: number) => x.toLocaleString("en-GB");


type Line = { name: string; query: QueueQuery };

async function main() {
  const { closeDb, sqlClient } = await bench.open(async () => {
    // One session (the generator's temp tables), planning each statement afresh: the warning
    // triggers' plpgsql plans would otherwise stay cached from when transect_species_seasons
    // was empty (one run spent 337 s on a season instead of 3 s). Timing uses the app's pool.
    const generating = postgres(bench.url, { max: 1, onnotice: () => undefined, connection: { plan_cache_mode: "force_custom_plan" } });
    try {
      await generate(generating, shape, say);
      await giveReviewMix(generating, say);
    } finally {
      await generating.end({ timeout: 5 });
    }
  });
  const sql = sqlClient();
  try {
    await describeData(sql);

    const lines = await linesToTime(sql);
    const { reviewQueuePage } = await import("../lib/queries/review-queue");
    say(`  timing reviewQueuePage: per line ${WARM_UP} untimed calls, then ${RUNS} timed calls one after another`);
    const results: { line: Line; figures: Figures; total: number; rows: number }[] = [];
    for (const line of lines) {
      const figures = await timeCalls(() => reviewQueuePage(line.query), RUNS, WARM_UP);
      const page = await reviewQueuePage(line.query);
      results.push({ line, figures, total: page.total, rows: page.rows.length });
    }
    say("");
    say(`  ${"filter".padEnd(40)}${"matching".padStart(9)}${"rows".padStart(6)}${"p50".padStart(10)}${"p95".padStart(10)}${"max".padStart(10)}`);
    let failed = 0;
    for (const { line, figures, total, rows } of results) {
      const pass = figures.p95 < TARGET_P95_MS;
      if (!pass) failed++;
      say(`  ${line.name.padEnd(40)}${n(total).padStart(9)}${String(rows).padStart(6)}${fmt(figures.p50).padStart(10)}${fmt(figures.p95).padStart(10)}${fmt(figures.max).padStart(10)}   ${pass ? "PASS" : "FAIL"}`);
    }

    say("");
    say("  query plans (EXPLAIN of pageIdsSql and countSql): indexes used; sequential scans of sightings or visits");
    const { countSql, pageIdsSql } = await import("../lib/queries/review-queue");
    for (const line of lines) {
      const ids = await plan(sql, pageIdsSql(line.query));
      const count = await plan(sql, countSql(line.query));
      say(`  ${line.name.padEnd(40)}page: ${describePlan(ids)}`);
      say(`  ${"".padEnd(40)}count: ${describePlan(count)}`);
    }
    say("");
    say(
      failed
        ? `[bench:review] FAIL: ${failed} of ${results.length} lines have a p95 of ${TARGET_P95_MS} ms or more`
        : `[bench:review] PASS: every line's p95 is under ${TARGET_P95_MS} ms`,
    );
    process.exitCode = failed ? 1 : 0;
  } finally {
    await closeDb();
  }
}

/** What the queue reads from: sightings by status, warning and walk-rule breach. */
async function describeData(sql: postgres.Sql) {
  const [c] = await sql<{ sightings: number; visits: number; transects: number; seasons: number; events: number; photos: number }[]>`
    select (select count(*) from sightings)::int as sightings, (select count(*) from visits)::int as visits,
      (select count(*) from transects)::int as transects, (select count(*) from seasons)::int as seasons,
      (select count(*) from verification_events)::int as events, (select count(*) from photos)::int as photos`;
  say(`[bench:review] ${n(c!.sightings)} sightings, ${n(c!.visits)} walks, ${n(c!.transects)} transects, ${n(c!.seasons)} seasons, ${n(c!.events)} history rows, ${n(c!.photos)} photos`);
  const byStatus = await sql<{ k: string; n: number }[]>`select status::text as k, count(*)::int as n from sightings group by 1 order by 1`;
  const byWarning = await sql<{ k: string; n: number }[]>`select unnest(warnings) as k, count(*)::int as n from sightings group by 1 order by 1`;
  const byBreach = await sql<{ k: string; n: number }[]>`select unnest(rule_breaches) as k, count(*)::int as n from visits group by 1 order by 1`;
  const list = (rows: { k: string; n: number }[]) => rows.map((r) => `${r.k} ${n(r.n)}`).join(", ");
  say(`  statuses: ${list(byStatus)}`);
  say(`  warnings (sightings): ${list(byWarning)}`);
  say(`  walk-rule breaches (walks): ${list(byBreach)}`);
}

/** Every single filter and every sort column, page 1 and page 2, built as the API builds them. */
async function linesToTime(sql: postgres.Sql): Promise<Line[]> {
  const [pick] = await sql<{ season: string; transect: string; transect_code: string; habitat: string; habitat_code: string; volunteer: string; volunteer_name: string }[]>`
    with open as (select id from seasons where status = 'open' order by starts_on desc limit 1),
    busiest as (
      select v.transect_id, count(*) as n from sightings s join visits v on v.id = s.visit_id
      where s.status in ('pending', 'queried') group by 1 order by n desc, 1 limit 1)
    select (select id from open) as season, t.id as transect, t.code as transect_code, h.id as habitat, h.code as habitat_code,
      (select v.volunteer_id from visits v group by 1 order by count(*) desc, 1 limit 1) as volunteer,
      (select u.name from users u where u.id = (select v.volunteer_id from visits v group by 1 order by count(*) desc, 1 limit 1)) as volunteer_name
    from busiest b join transects t on t.id = b.transect_id join habitat_groups h on h.id = t.habitat_group_id`;
  const species = await sql<{ id: string; name: string; n: number }[]>`
    select sp.id, sp.vernacular_name as name, count(*)::int as n from sightings s join species sp on sp.id = s.species_id
    group by 1, 2 order by n desc, 1`;
  const common = species[0]!, rare = species[species.length - 1]!;
  const [range] = await sql<{ from: string; to: string }[]>`
    select (current_date - 28)::text as from, current_date::text as to`;
  const p = pick!;
  const filters: { name: string; params: Record<string, string> }[] = [
    { name: "default (waiting, by date)", params: {} },
    ...statusFilters.filter((s) => s !== "waiting").map((s) => ({ name: `status=${s}`, params: { status: s } })),
    { name: "season (open)", params: { season: p.season } },
    { name: `transect ${p.transect_code}`, params: { transect: p.transect } },
    { name: `habitat ${p.habitat_code}`, params: { habitat: p.habitat } },
    { name: `species common (${common.name})`, params: { species: common.id } },
    { name: `species rare (${rare.name})`, params: { species: rare.id } },
    { name: `volunteer ${p.volunteer_name}`, params: { volunteer: p.volunteer } },
    { name: `dates ${range!.from}..${range!.to}`, params: { from: range!.from, to: range!.to } },
    ...warningFilters.map((w) => ({ name: `warning=${w}`, params: { warning: w } })),
    ...queueSorts.filter((s) => s !== "date").map((s) => ({ name: `sort=${s}`, params: { sort: s } })),
  ];
  const only = (process.env.BENCH_ONLY ?? "").split(",").map((s) => s.trim()).filter(Boolean);
  return filters
    .filter((f) => only.length === 0 || only.some((s) => f.name.includes(s)))
    .flatMap((f) => [1, 2].map((page) => ({ name: `${f.name} p${page}`, query: queueQuerySchema.parse({ ...f.params, page: String(page) }) })));
}

type PlanNode = { "Node Type": string; "Relation Name"?: string; "Index Name"?: string; Plans?: PlanNode[] };

async function plan(sql: postgres.Sql, query: SQL): Promise<PlanNode> {
  const { sql: text, params } = new PgDialect().sqlToQuery(query);
  const [row] = await sql.unsafe<{ "QUERY PLAN": unknown }[]>(`explain (format json) ${text}`, params as postgres.ParameterOrJSON<never>[]);
  const parsed = typeof row!["QUERY PLAN"] === "string" ? JSON.parse(row!["QUERY PLAN"]) : row!["QUERY PLAN"];
  return (parsed as { Plan: PlanNode }[])[0]!.Plan;
}

function describePlan(root: PlanNode): string {
  const indexes = new Set<string>();
  const seqScans = new Set<string>();
  const walk = (node: PlanNode) => {
    if (node["Index Name"]) indexes.add(node["Index Name"]);
    if (node["Node Type"] === "Seq Scan" && node["Relation Name"]) seqScans.add(node["Relation Name"]);
    for (const child of node.Plans ?? []) walk(child);
  };
  walk(root);
  const big = [...seqScans].filter((r) => r === "sightings" || r === "visits");
  const small = [...seqScans].filter((r) => r !== "sightings" && r !== "visits");
  return `${indexes.size ? [...indexes].join(", ") : "no index"}; ${big.length ? `SEQ SCAN ${big.join(", ")}` : "no seq scan of sightings/visits"}${small.length ? ` (seq scan ${small.join(", ")})` : ""}`;
}

main()
  .catch((error: unknown) => {
    console.error("[bench:review] failed:", error instanceof Error ? error.message : error);
    process.exitCode = 1;
  })
  .finally(async () => {
    await bench.close();
  });
