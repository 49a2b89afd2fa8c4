// Benchmark of the organiser's pages at network scale (npm run bench:network, issue 9).
// Makes its own database, turnstone_bench_network, on the cluster DATABASE_URL names (else the
// project's local one), migrates it, seeds the demo network and generates 5,000,000 sightings over
// five seasons plus 50,000 change-log entries in SQL (scripts/bench/network-data.ts), then times the
// query-layer functions each page calls: the organiser's home, the transect list (the list's data
// comes from GET /api/network/transects, one function), the history (first page, a filter, older
// pages) and the partner's /data. A page's server time is its queries plus rendering; only the
// queries grow with the number of sightings, and timing them in-process needs no build of the app
// on the shared machine. Target: p95 at most 300 ms for the three organiser pages.
// The database is dropped afterwards, also on failure or Ctrl-C; BENCH_KEEP=1 keeps it and a
// later BENCH_KEEP=1 run reuses it (pending migrations are applied) instead of generating again.
//   BENCH_SIGHTINGS, BENCH_TRANSECTS, BENCH_CHANGES, BENCH_RUNS (timed calls per page, default 60).
import "./server-conditions";
import "./load-env";
import postgres from "postgres";
import { defaultShape, generate } from "./bench/network-data";
import { throwawayDatabase } from "./bench/throwaway-db";
import { fmt, timeCalls, type Figures } from "./bench/timing";

const DB_NAME = "turnstone_bench_network";
const TARGET_P95_MS = 300;
const RUNS = Number(process.env.BENCH_RUNS ?? 60);
const WARM_UP = 5;
const MARK = `turnstone bench:network ${JSON.stringify(defaultShape)}`;
const bench = throwawayDatabase(DB_NAME, "bench:network", MARK);

const say = (line: string) => console.log(line);


type Page = { name: string; target: boolean; call: (i: number) => Promise<unknown> };

async function main() {
  const { closeDb, sqlClient } = await bench.open((sql) => generate(sql, defaultShape, say));
  const sql = sqlClient();
  try {
    const [counts] = await sql<{ transects: number; seasons: number; visits: number; sightings: number; changes: number }[]>`
      select (select count(*) from transects)::int as transects, (select count(*) from seasons)::int as seasons,
        (select count(*) from visits)::int as visits, (select count(*) from sightings)::int as sightings,
        (select count(*) from network_changes)::int as changes`;
    const n = (x: number) => x.toLocaleString("en-GB");
    say(`[bench:network] ${n(counts!.sightings)} sightings, ${n(counts!.visits)} walks, ${n(counts!.transects)} transects, ${n(counts!.seasons)} seasons, ${n(counts!.changes)} change-log entries`);
    say(`  timing the query-layer functions each page calls: ${WARM_UP} untimed calls, then ${RUNS} timed calls one after another`);

    const pages = await pagesToTime(sql);
    const results: { page: Page; figures: Figures }[] = [];
    for (const page of pages) results.push({ page, figures: await timeCalls(page.call, RUNS, WARM_UP) });
    say("");
    say(`  ${"page".padEnd(34)}${"p50".padStart(11)}${"p95".padStart(11)}${"max".padStart(11)}`);
    let failed = false;
    for (const { page, figures } of results) {
      const verdict = page.target ? (figures.p95 <= TARGET_P95_MS ? "PASS" : "FAIL") : "(no target)";
      if (page.target && figures.p95 > TARGET_P95_MS) failed = true;
      say(`  ${page.name.padEnd(34)}${fmt(figures.p50).padStart(11)}${fmt(figures.p95).padStart(11)}${fmt(figures.max).padStart(11)}   ${verdict}${page.target ? ` (p95 ≤ ${TARGET_P95_MS} ms)` : ""}`);
    }
    say("");
    say(failed ? "[bench:network] FAIL: a page's p95 is over the target" : `[bench:network] PASS: every organiser page's p95 is at most ${TARGET_P95_MS} ms`);
    process.exitCode = failed ? 1 : 0;
  } finally {
    await closeDb();
  }
}

/** What each page asks the query layer for, as the organiser (or the partner, for /data). */
async function pagesToTime(sql: postgres.Sql): Promise<Page[]> {
  const { homePageData } = await import("./bench/network-home");
  const { listTransects } = await import("../lib/queries/transects");
  const { listChanges } = await import("../lib/queries/change-log");
  const { verifiedDataBySeason } = await import("../lib/queries/partner");
  const [organiser] = await sql<{ id: string; roles: string[]; name: string; email: string }[]>`
    select id, roles, name, email from users where 'organiser' = any(roles) order by created_at limit 1`;
  const actor = { ...organiser!, roles: organiser!.roles as ["organiser"] };
  // Cursors of older pages, got the way the page's "Older changes" link gets them.
  const cursors: string[] = [];
  let next: string | null = null;
  for (let i = 0; i < 20; i++) {
    const page: Awaited<ReturnType<typeof listChanges>> = await listChanges({ after: next ?? undefined });
    if (!page.next) break;
    cursors.push((next = page.next));
  }
  const entities = ["transect", "season", "person", "import"] as const;
  return [
    { name: "/network (organiser's home)", target: true, call: () => homePageData(actor) },
    { name: "/network/transects (list)", target: true, call: () => listTransects(actor) },
    {
      name: "/network/history (mixed pages)",
      target: true,
      // First page, one entity's first page, an older page, in turn.
      call: (i) => (i % 3 === 0 ? listChanges({}) : i % 3 === 1 ? listChanges({ entity: entities[i % entities.length] }) : listChanges({ after: cursors[i % Math.max(1, cursors.length)] })),
    },
    { name: "/data (partner)", target: false, call: () => verifiedDataBySeason() },
  ];
}

main()
  .catch((error: unknown) => {
    console.error("[bench:network] failed:", error instanceof Error ? error.message : error);
    process.exitCode = 1;
  })
  .finally(async () => {
    await bench.close();
  });
