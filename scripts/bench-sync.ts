// Benchmark of offline field sync (npm run bench:sync) against the RUNNING app and its database.
// 50 simulated volunteers sign in through Auth.js and each POST 20 batches (one new visit and
// 20 sightings per batch) to /api/field/sync at the same time. Then the same timed run is made in
// interleaved pairs, alone and while a few of the volunteers also send HEIC photos one after
// another through the real upload flow (scripts/bench/photo-stream.ts), and the pooled batch
// latency of the two sides is compared (target: p95 with photos at most 1.25 times p95 without;
// BENCH_PAIRS pairs, default 3). After the first run every
// sent sighting is looked up in PostgreSQL (lost or duplicated must be 0), a few batches are
// resent (must come back "unchanged" and add nothing), and the same rows are inserted as plain
// multi-row INSERTs straight into the same tables for comparison.
// Every figure printed is measured in this run; the bench deletes what it created, photos included.
//   BENCH_BASE_URL (default http://localhost:3000), DATABASE_URL (the app's database),
//   BENCH_PHOTO_SENDERS (volunteers who also send photos in the runs with photos, default 5).
import "./load-env";
import { randomBytes, randomUUID } from "node:crypto";
import { Agent, request } from "node:http";
import { gunzipSync } from "node:zlib";
import { availableParallelism, loadavg } from "node:os";
import postgres from "postgres";
import { closeDb, sqlClient } from "../db/client";
import { env } from "../lib/env";
import { hashPassword } from "../lib/auth/password";
import type { SyncResponse } from "../lib/sync/contract";
import { type PhotoCompletion, deletePhotoObjects, heicFixtures, photoKeysOf, sendPhoto, startPhotoStream } from "./bench/photo-stream";

const BASE_URL = (process.env.BENCH_BASE_URL ?? "http://localhost:3000").replace(/\/$/, "");
const VOLUNTEERS = Number(process.env.BENCH_VOLUNTEERS ?? 50);
const BATCHES_PER_VOLUNTEER = Number(process.env.BENCH_BATCHES ?? 20);
// Untimed rounds first (every volunteer sends one batch per round, all at once): a server just
// started compiles its hot code and prepares its statements on each connection during its first
// few thousand requests, and the targets are about the server in steady use. What the rounds
// stored is deleted again before timing, so the timed part meets the database as it was.
const WARM_UP_ROUNDS = Number(process.env.BENCH_WARM_UP_ROUNDS ?? 60);
const SIGHTINGS_PER_BATCH = 20;
const RESENT_BATCHES = 5;
// bcrypt on the server dominates sign-in, so more in parallel only queues; and the sign-in limit
// counts a try as failed until it succeeds (lib/auth/rate-limit.ts), so a few at a time.
const SIGN_IN_CONCURRENCY = 2;
const TARGET_RATIO = 0.3;
const TARGET_P95_MS = 300;
const PHOTO_SENDERS = Number(process.env.BENCH_PHOTO_SENDERS ?? 5);
/** The photo stream may cost the sync this much at the 95th percentile (issue 8). */
const TARGET_P95_WITH_PHOTOS = 1.25;
/** Timed runs on each side of that comparison (BENCH_PAIRS): one run is at the mercy of the machine. */
const COMPARISON_PAIRS = Number(process.env.BENCH_PAIRS ?? 3);
// Which plain-INSERT figure the ratio target is judged against (index into rawPlans below).
const RATIO_BASELINE = 0;
const RAW_RUNS = 3;
const EMAIL_DOMAIN = "bench-sync.turnstone.invalid";

type Visit = { id: string; transectId: string; visitDate: string; startTime: string; endTime: string; temperatureC: number; windBeaufort: number; completeList: boolean; clientUpdatedAt: string };
type Sighting = { id: string; visitId: string; speciesId: string; count: number; section: number; latitude: number; longitude: number; accuracyMetres: number; clientUpdatedAt: string };
type Batch = { visits: Visit[]; sightings: Sighting[] };
type Volunteer = { id: string; email: string; transectId: string; sectionCount: number; cookie?: string; batches: Batch[] };

const sql = sqlClient();
const DATABASE_URL = env().DATABASE_URL;

function percentile(sorted: number[], p: number): number {
  return sorted[Math.min(sorted.length - 1, Math.ceil((p / 100) * sorted.length) - 1)]!;
}

async function inPool<T>(items: T[], width: number, work: (item: T) => Promise<void>): Promise<void> {
  let next = 0;
  await Promise.all(Array.from({ length: width }, async () => {
    while (next < items.length) await work(items[next++]!);
  }));
}

function makeBatch(v: Volunteer, n: number, speciesIds: string[]): Batch {
  const stamp = new Date().toISOString();
  const day = String(1 + (n % 28)).padStart(2, "0");
  const visit: Visit = {
    id: randomUUID(), transectId: v.transectId, visitDate: `2026-06-${day}`, startTime: "10:30", endTime: "11:40",
    temperatureC: 18.5, windBeaufort: 2, completeList: true, clientUpdatedAt: stamp,
  };
  const sightings = Array.from({ length: SIGHTINGS_PER_BATCH }, (_, i): Sighting => ({
    id: randomUUID(), visitId: visit.id, speciesId: speciesIds[(n * SIGHTINGS_PER_BATCH + i) % speciesIds.length]!,
    count: 1 + ((i * 7 + n) % 12), section: 1 + (i % v.sectionCount), latitude: 51.1 + i / 1000, longitude: -1.2 - i / 1000,
    accuracyMetres: 6, clientUpdatedAt: stamp,
  }));
  return { visits: [visit], sightings };
}

async function removeBenchData(): Promise<void> {
  const pattern = `%@${EMAIL_DOMAIN}`;
  // The photos' stored images first: their rows go with the visits below.
  await deletePhotoObjects(env(), await photoKeysOf(sql, pattern));
  await sql`delete from visits where volunteer_id in (select id from users where email like ${pattern})`;
  await sql`delete from users where email like ${pattern}`;
  await sql`delete from sign_in_attempts where email_key like ${pattern}`;
  // Tens of thousands of rows come and go per run: clear them out so runs start alike.
  await sql`vacuum analyze visits, sightings`;
}

async function setUp(password: string): Promise<{ volunteers: Volunteer[]; speciesIds: string[] }> {
  const transects = await sql<{ id: string; sectionCount: number }[]>`select id, section_count as "sectionCount" from transects where active order by code`;
  const speciesIds = (await sql<{ id: string }[]>`select id from species order by sort_order`).map((r) => r.id);
  if (!transects.length || !speciesIds.length) throw new Error("the database has no transects or species: seed it first (npm run db:seed)");
  const hash = await hashPassword(password); // once: bcrypt is deliberately slow
  const run = randomBytes(3).toString("hex");
  const volunteers: Volunteer[] = Array.from({ length: VOLUNTEERS }, (_, i) => {
    const t = transects[i % transects.length]!;
    return { id: randomUUID(), email: `bench-${run}-${String(i + 1).padStart(2, "0")}@${EMAIL_DOMAIN}`, transectId: t.id, sectionCount: t.sectionCount, batches: [] };
  });
  await sql.begin(async (tx) => {
    // roles: the column's default, {volunteer}.
    await tx`insert into users ${tx(volunteers.map((v, i) => ({ id: v.id, email: v.email, name: `Bench volunteer ${i + 1}`, password_hash: hash, accepted_safety_at: new Date() })))}`;
    await tx`insert into transect_assignments ${tx(volunteers.map((v) => ({ transect_id: v.transectId, user_id: v.id })))}`;
  });
  return { volunteers, speciesIds };
}

async function signIn(email: string, password: string): Promise<string> {
  const csrf = await fetch(`${BASE_URL}/api/auth/csrf`);
  if (!csrf.ok) throw new Error(`GET /api/auth/csrf answered ${csrf.status}`);
  const { csrfToken } = (await csrf.json()) as { csrfToken: string };
  // The proxy and the route may both set a CSRF cookie: the last one matches the token.
  const jar = new Map(csrf.headers.getSetCookie().map((c) => { const pair = c.split(";")[0]!; return [pair.slice(0, pair.indexOf("=")), pair] as const; }));
  const csrfCookies = [...jar.values()].join("; ");
  const answer = await fetch(`${BASE_URL}/api/auth/callback/credentials`, {
    method: "POST",
    redirect: "manual",
    headers: { "content-type": "application/x-www-form-urlencoded", cookie: csrfCookies },
    body: new URLSearchParams({ csrfToken, email, password, callbackUrl: `${BASE_URL}/field` }),
  });
  const session = answer.headers.getSetCookie().find((c) => c.startsWith("authjs.session-token="));
  if (!session) throw new Error(`sign-in for ${email} gave no session cookie (HTTP ${answer.status} to ${answer.headers.get("location")})`);
  return session.split(";")[0]!;
}

/** The sign-in limit may ask a burst of sign-ins from one address to wait a moment: try again a few times. */
async function signInPatiently(email: string, password: string): Promise<string> {
  for (let attempt = 1; ; attempt++) {
    try {
      return await signIn(email, password);
    } catch (error) {
      if (attempt === 5) throw error;
      await new Promise((resolve) => setTimeout(resolve, 2000 * attempt));
    }
  }
}

// Plain node:http with keep-alive, as a phone's browser keeps its connection: the client shares
// the machine with the app and the database, and fetch costs it several times more CPU per call.
const keepAlive = new Agent({ keepAlive: true, maxSockets: VOLUNTEERS });

type RawAnswer = { status: number; raw: Buffer; gzipped: boolean };

/** Sends a serialized batch and keeps the answer's bytes; reading them is left until after timing. */
function sendBatch(cookie: string, payload: Buffer): Promise<RawAnswer> {
  return new Promise((resolve, reject) => {
    const call = request(`${BASE_URL}/api/field/sync`, {
      method: "POST",
      agent: keepAlive,
      headers: { "content-type": "application/json", "content-length": payload.length, "accept-encoding": "gzip", cookie },
    }, (response) => {
      const chunks: Buffer[] = [];
      response.on("data", (c: Buffer) => chunks.push(c));
      response.on("end", () => resolve({ status: response.statusCode ?? 0, raw: Buffer.concat(chunks), gzipped: response.headers["content-encoding"] === "gzip" }));
      response.on("error", reject);
    });
    call.on("error", reject);
    call.end(payload);
  });
}

function readAnswer({ status, raw, gzipped }: RawAnswer): { status: number; body: SyncResponse } {
  const text = (gzipped ? gunzipSync(raw) : raw).toString("utf8");
  try {
    return { status, body: JSON.parse(text) as SyncResponse };
  } catch {
    throw new Error(`sync answered HTTP ${status} with a body that is not JSON: ${text.slice(0, 200)}`);
  }
}

async function postBatch(cookie: string, batch: Batch): Promise<{ status: number; body: SyncResponse }> {
  return readAnswer(await sendBatch(cookie, Buffer.from(JSON.stringify(batch))));
}

type RawRows = { visit: Record<string, unknown>; sightings: Record<string, unknown>[] };
type RawPlan = { senders: number; connections: number; commitEachBatch: boolean };

/** The timed batches again as plain rows under fresh ids, built before any timing starts. */
function rawRowsOf(volunteers: Volunteer[]): RawRows[] {
  return volunteers.flatMap((v) => v.batches.map((b) => {
    const visit = b.visits[0]!;
    const visitId = randomUUID();
    return {
      visit: { id: visitId, transect_id: v.transectId, volunteer_id: v.id, visit_date: visit.visitDate, start_time: visit.startTime, end_time: visit.endTime, temperature_c: visit.temperatureC, wind_beaufort: visit.windBeaufort, complete_list: true, client_updated_at: visit.clientUpdatedAt },
      sightings: b.sightings.map((s) => ({ id: randomUUID(), visit_id: visitId, species_id: s.speciesId, count: s.count, section: s.section, latitude: s.latitude, longitude: s.longitude, accuracy_metres: s.accuracyMetres, client_updated_at: s.clientUpdatedAt })),
    };
  }));
}

/**
 * Seconds to write the same rows as plain multi-row INSERTs (a visit, then its 20 sightings),
 * straight into PostgreSQL: either every batch in one transaction that is rolled back (no commit
 * is ever paid), or each batch committed on its own, as the sync must before it answers.
 */
async function rawInsertSeconds(volunteers: Volunteer[], plan: RawPlan): Promise<number> {
  const batches = rawRowsOf(volunteers);
  const client = postgres(DATABASE_URL, { max: plan.connections, onnotice: () => undefined });
  const insert = async (q: postgres.Sql | postgres.TransactionSql, rows: RawRows) => {
    await q`insert into visits ${q([rows.visit])}`;
    await q`insert into sightings ${q(rows.sightings)}`;
  };
  try {
    await client`select 1`; // connect before timing
    const start = performance.now();
    if (plan.commitEachBatch) {
      let next = 0;
      await Promise.all(Array.from({ length: plan.senders }, async () => {
        while (next < batches.length) { const rows = batches[next++]!; await client.begin((tx) => insert(tx, rows)); }
      }));
      const seconds = (performance.now() - start) / 1000;
      await client`delete from visits where id = any(${batches.map((b) => b.visit.id as string)}::uuid[])`;
      return seconds;
    }
    const rollback = new Error("rollback");
    await client.begin(async (tx) => {
      for (const rows of batches) await insert(tx, rows);
      throw rollback;
    }).catch((e) => { if (e !== rollback) throw e; });
    return (performance.now() - start) / 1000;
  } finally {
    await client.end({ timeout: 5 });
  }
}

/**
 * Lost: a sent id that is not stored. Duplicated: any row in the bench's visits that the phones
 * did not send under its id (otherVisitIds: the visits the photos belong to, sent untimed) (ids are primary keys, so a double write could only appear as a row
 * under another id), or the same sighting (visit, species, section, count, position) stored twice.
 */
async function countStored(volunteers: Volunteer[], otherVisitIds: string[]) {
  const sent = volunteers.flatMap((v) => v.batches.flatMap((b) => b.sightings.map((s) => s.id)));
  const visitIds = volunteers.flatMap((v) => v.batches.map((b) => b.visits[0]!.id));
  const [found] = await sql<{ n: number }[]>`select count(*)::int as n from sightings where id = any(${sent}::uuid[])`;
  const [strays] = await sql<{ n: number }[]>`
    select count(*)::int as n from sightings where visit_id = any(${visitIds}::uuid[]) and not (id = any(${sent}::uuid[]))`;
  const [twice] = await sql<{ n: number }[]>`
    select coalesce(sum(n - 1), 0)::int as n from (
      select count(*) as n from sightings where visit_id = any(${visitIds}::uuid[])
      group by visit_id, species_id, section, count, latitude, longitude having count(*) > 1) repeated`;
  const [visitRows] = await sql<{ n: number }[]>`
    select count(*)::int as n from visits where volunteer_id = any(${volunteers.map((v) => v.id)}::uuid[]) and not (id = any(${otherVisitIds}::uuid[]))`;
  return {
    sent: sent.length,
    lost: sent.length - found!.n,
    duplicated: strays!.n + twice!.n,
    visitsExtraOrMissing: Math.abs(visitRows!.n - visitIds.length),
  };
}

/** CHECKPOINT needs a superuser or pg_checkpoint (PostgreSQL 15+); the local cluster's role has it. */
async function mayCheckpoint(): Promise<boolean> {
  const [row] = await sql<{ ok: boolean }[]>`
    select rolsuper or exists (select 1 from pg_roles r where r.rolname = 'pg_checkpoint' and pg_has_role(current_user, r.oid, 'member')) as ok
    from pg_roles where rolname = current_user`;
  return row?.ok ?? false;
}

type TimedRun = { latencies: number[]; seconds: number; startedAt: number; endedAt: number; problems: string[] };

/** Every volunteer sends its batches one after another, all volunteers at once. */
async function timedRun(volunteers: Volunteer[]): Promise<TimedRun> {
  // A phone serializes its batch and reads the answer on its own processor, not the server's:
  // the simulated phones do both outside the timed part, so they take less of the shared machine.
  const payloads = new Map(volunteers.map((v) => [v, v.batches.map((b) => Buffer.from(JSON.stringify(b)))]));
  const latencies: number[] = [];
  const answers: { batch: Batch; answer: RawAnswer }[] = [];
  const startedAt = performance.now();
  await Promise.all(volunteers.map(async (v) => {
    const bodies = payloads.get(v)!;
    for (let i = 0; i < bodies.length; i++) {
      const t0 = performance.now();
      const answer = await sendBatch(v.cookie!, bodies[i]!);
      latencies.push(performance.now() - t0);
      answers.push({ batch: v.batches[i]!, answer });
    }
  }));
  const endedAt = performance.now();
  const problems: string[] = [];
  for (const { batch, answer } of answers) {
    const { status, body } = readAnswer(answer);
    const notCreated = body.results?.filter((r) => r.status !== "created").length ?? batch.sightings.length + 1;
    if (status !== 200 || notCreated) problems.push(`HTTP ${status}, ${notCreated} items not created`);
  }
  latencies.sort((a, b) => a - b);
  return { latencies, seconds: (endedAt - startedAt) / 1000, startedAt, endedAt, problems };
}

function describeRun(label: string, run: TimedRun): string {
  const [p50, p95, p99] = [50, 95, 99].map((p) => percentile(run.latencies, p)!.toFixed(1));
  const sightings = run.latencies.length * SIGHTINGS_PER_BATCH;
  return `${label}: ${sightings} sightings in ${run.latencies.length} batches over ${run.seconds.toFixed(2)} s = ${(sightings / run.seconds).toFixed(0)} sightings/s; ` +
    `batch latency p50 ${p50} ms, p95 ${p95} ms, p99 ${p99} ms (max ${run.latencies.at(-1)!.toFixed(1)} ms)`;
}

async function main(): Promise<boolean> {
  console.log(`bench:sync against ${BASE_URL}: ${VOLUNTEERS} volunteers x ${BATCHES_PER_VOLUNTEER} batches x (1 visit + ${SIGHTINGS_PER_BATCH} sightings), after ${WARM_UP_ROUNDS} untimed rounds; timed alone, then with ${PHOTO_SENDERS} of them sending HEIC photos`);
  // App, database and this client share the machine: its load says how busy it was anyway.
  const load = () => loadavg().map((l) => l.toFixed(2)).join(" ");
  console.log(`${availableParallelism()} CPUs, load average ${load()}`);
  const health = await fetch(`${BASE_URL}/api/health`).catch(() => null);
  if (!health) throw new Error(`the app is not answering at ${BASE_URL} (start it, or set BENCH_BASE_URL)`);
  await removeBenchData(); // leftovers of an interrupted earlier run
  const password = randomBytes(18).toString("base64url");
  const { volunteers, speciesIds } = await setUp(password);
  const fixtures = heicFixtures();
  try {
    const signInStart = performance.now();
    await inPool(volunteers, SIGN_IN_CONCURRENCY, async (v) => { v.cookie = await signInPatiently(v.email, password); });
    console.log(`signed in ${volunteers.length} bench volunteers in ${((performance.now() - signInStart) / 1000).toFixed(1)} s`);

    const warmUpVisits: string[] = [];
    for (let round = 0; round < WARM_UP_ROUNDS; round++) {
      await Promise.all(volunteers.map(async (v) => {
        const b = makeBatch(v, BATCHES_PER_VOLUNTEER + round, speciesIds);
        warmUpVisits.push(b.visits[0]!.id);
        const r = await postBatch(v.cookie!, b);
        if (r.status !== 200 || r.body.results.some((x) => x.status !== "created")) throw new Error(`a warm-up batch was not fully created (HTTP ${r.status})`);
      }));
    }
    await sql`delete from visits where id = any(${warmUpVisits}::uuid[])`;

    // The visits the photos belong to, one per photo sender, stored before timing and kept.
    const photoSenders = await Promise.all(volunteers.slice(0, PHOTO_SENDERS).map(async (v) => {
      const b = makeBatch(v, BATCHES_PER_VOLUNTEER + WARM_UP_ROUNDS, speciesIds);
      const r = await postBatch(v.cookie!, b);
      if (r.status !== 200) throw new Error(`a photo sender's visit was not stored (HTTP ${r.status})`);
      return { cookie: v.cookie!, visitId: b.visits[0]!.id };
    }));
    const photoVisitIds = photoSenders.map((p) => p.visitId);
    // Untimed too: each app process's photo pool starts its threads and compiles libheif-js on
    // its first HEIC. Every sender sends every fixture once, and each must come back ready.
    const warmPhotos = (await Promise.all(photoSenders.map(async (sender) => {
      const done: PhotoCompletion[] = [];
      for (const fixture of fixtures) done.push(await sendPhoto(BASE_URL, sender, fixture));
      return done;
    }))).flat();
    const notReady = warmPhotos.filter((p) => p.status !== 200);
    if (notReady.length) throw new Error(`${notReady.length} warm-up photos were not completed (first: ${notReady[0]!.fixture} HTTP ${notReady[0]!.status} ${notReady[0]!.code ?? ""})`);
    await sql`vacuum analyze visits, sightings`;

    // Run 1: sync alone.
    for (const v of volunteers) v.batches = Array.from({ length: BATCHES_PER_VOLUNTEER }, (_, n) => makeBatch(v, n, speciesIds));
    const alone = await timedRun(volunteers);
    const timedSightings = alone.latencies.length * SIGHTINGS_PER_BATCH;
    const syncRate = timedSightings / alone.seconds;
    const p95 = percentile(alone.latencies, 95)!;

    const stored = await countStored(volunteers, photoVisitIds);
    const timed = volunteers.flatMap((v) => v.batches.map((b) => ({ v, b })));
    const step = Math.max(1, Math.floor(timed.length / RESENT_BATCHES));
    const resent = timed.filter((_, i) => i % step === 0).slice(0, RESENT_BATCHES);
    let resendChanged = 0;
    for (const { v, b } of resent) {
      const { status, body } = await postBatch(v.cookie!, b);
      if (status !== 200) resendChanged += b.sightings.length + 1;
      else resendChanged += body.results.filter((r) => r.status !== "unchanged").length;
    }
    const afterResend = await countStored(volunteers, photoVisitIds);

    const appConnections = Number(process.env.DATABASE_POOL_SIZE ?? 10) * Number(process.env.WEB_CONCURRENCY ?? availableParallelism());
    const rawPlans = [
      { label: "one connection, one transaction, rolled back (no commit ever paid)", plan: { senders: 1, connections: 1, commitEachBatch: false } },
      { label: "one connection, each batch committed", plan: { senders: 1, connections: 1, commitEachBatch: true } },
      { label: `${VOLUNTEERS} senders over ${appConnections} connections (as many as the app's processes hold), each batch committed`, plan: { senders: VOLUNTEERS, connections: appConnections, commitEachBatch: true } },
    ];
    const rawRates: number[] = [];
    // Each is short (about a second), so one run is at the mercy of the machine: take the median of three.
    for (const { plan } of rawPlans) {
      const rates: number[] = [];
      for (let run = 0; run < RAW_RUNS; run++) rates.push(timedSightings / (await rawInsertSeconds(volunteers, plan)));
      rawRates.push(rates.sort((a, b) => a - b)[Math.floor(RAW_RUNS / 2)]!);
    }
    const rawRate = rawRates[RATIO_BASELINE]!;
    const ratio = syncRate / rawRate;

    // Then the comparison: PAIRS runs without photos and PAIRS with, interleaved (alone first in
    // even pairs, photos first in odd ones) so that drift over the bench (the database growing
    // and vacuuming, a checkpoint, other load on the machine) falls on both sides alike. Each run
    // starts from the same database, and the latencies of each side are pooled.
    const timedVisitIds = () => volunteers.flatMap((v) => v.batches.map((b) => b.visits[0]!.id));
    await sql`delete from visits where id = any(${timedVisitIds()}::uuid[])`;
    const canCheckpoint = await mayCheckpoint();
    const aloneRuns: TimedRun[] = [];
    const photoRuns: TimedRun[] = [];
    const photos: PhotoCompletion[] = [];
    const storedInComparison: Awaited<ReturnType<typeof countStored>>[] = [];
    for (let pair = 0; pair < COMPARISON_PAIRS; pair++) {
      for (const withPhotoStream of pair % 2 === 0 ? [false, true] : [true, false]) {
        await sql`vacuum analyze visits, sightings`;
        if (canCheckpoint) await sql`checkpoint`;
        for (const v of volunteers) v.batches = Array.from({ length: BATCHES_PER_VOLUNTEER }, (_, n) => makeBatch(v, n, speciesIds));
        if (withPhotoStream) {
          // Timing starts once each sender has completed one photo, so the stream is flowing.
          const stream = startPhotoStream(BASE_URL, photoSenders, fixtures);
          while (stream.completions.length < photoSenders.length) await new Promise((resolve) => setTimeout(resolve, 20));
          photoRuns.push(await timedRun(volunteers));
          photos.push(...(await stream.stop()));
        } else {
          aloneRuns.push(await timedRun(volunteers));
        }
        storedInComparison.push(await countStored(volunteers, photoVisitIds));
        await sql`delete from visits where id = any(${timedVisitIds()}::uuid[])`;
      }
    }
    const pooled = (runs: TimedRun[]) => runs.flatMap((r) => r.latencies).sort((a, b) => a - b);
    const p95Alone = percentile(pooled(aloneRuns), 95)!;
    const p95WithPhotos = percentile(pooled(photoRuns), 95)!;
    const during = photos.filter((p) => photoRuns.some((r) => p.endedAt >= r.startedAt && p.endedAt <= r.endedAt));
    const photoSeconds = photoRuns.reduce((sum, r) => sum + r.seconds, 0);
    const photoMs = during.map((p) => p.ms).sort((a, b) => a - b);
    const statusOf = (p: PhotoCompletion) => `${p.status}${p.code ? ` ${p.code}` : ""}`;
    const photoStatuses = [...new Set(photos.map(statusOf))].map((k) => `${k} × ${photos.filter((p) => statusOf(p) === k).length}`);
    const photoRatio = p95WithPhotos / p95Alone;
    const comparisonProblems = [...aloneRuns, ...photoRuns].flatMap((r) => r.problems);

    console.log(`\n${describeRun("sync alone", alone)}`);
    console.log(`batches not fully created: ${alone.problems.length}${alone.problems.length ? ` (first: ${alone.problems[0]})` : ""}`);
    console.log(`PostgreSQL check of ${stored.sent} sent sightings: lost ${stored.lost}, duplicated ${stored.duplicated}, visit rows off by ${stored.visitsExtraOrMissing}`);
    console.log(`resent ${resent.length} batches: ${resendChanged} items not "unchanged"; after resend lost ${afterResend.lost}, duplicated ${afterResend.duplicated}`);
    console.log(`plain multi-row INSERTs of the same ${timedSightings} sightings and their visits, straight into PostgreSQL (median of ${RAW_RUNS} runs each):`);
    rawPlans.forEach(({ label }, i) => console.log(`  ${i === RATIO_BASELINE ? "*" : " "} ${label}: ${rawRates[i]!.toFixed(0)} sightings/s (sync / this = ${(syncRate / rawRates[i]!).toFixed(2)})`));
    console.log(`ratio sync / raw insert (*): ${ratio.toFixed(2)}`);
    console.log(`\ncomparison, ${COMPARISON_PAIRS} pairs of timed runs interleaved${canCheckpoint ? ", each after a checkpoint" : ""}:`);
    for (let pair = 0; pair < COMPARISON_PAIRS; pair++) {
      console.log(`  ${describeRun(`pair ${pair + 1}, sync alone`, aloneRuns[pair]!)}`);
      console.log(`  ${describeRun(`pair ${pair + 1}, sync with photos (${photoSenders.length} senders)`, photoRuns[pair]!)}`);
    }
    console.log(`batches not fully created: ${comparisonProblems.length}; PostgreSQL check after each run: lost ${storedInComparison.reduce((n, c) => n + c.lost, 0)}, duplicated ${storedInComparison.reduce((n, c) => n + c.duplicated, 0)}, visit rows off by ${storedInComparison.reduce((n, c) => n + c.visitsExtraOrMissing, 0)}`);
    console.log(`photos completed during the timed runs with photos: ${during.length} (${(during.length / photoSeconds).toFixed(1)}/s; fixtures ${fixtures.map((f) => `${f.name} ${(f.bytes.length / 1024).toFixed(0)} kB`).join(", ")})` +
      (during.length ? `, completion p50 ${percentile(photoMs, 50)!.toFixed(0)} ms, p95 ${percentile(photoMs, 95)!.toFixed(0)} ms` : ""));
    console.log(`photo answers in the stream: ${photoStatuses.join(", ")}`);
    console.log(`pooled p95 without photos ${p95Alone.toFixed(1)} ms, with photos ${p95WithPhotos.toFixed(1)} ms: ${photoRatio.toFixed(2)} times`);
    console.log(`load average at the end: ${load()}`);

    const checks = [
      [`ratio >= ${TARGET_RATIO}`, ratio >= TARGET_RATIO],
      [`p95 < ${TARGET_P95_MS} ms`, p95 < TARGET_P95_MS],
      [`p95 with photos <= ${TARGET_P95_WITH_PHOTOS} x p95 without`, p95WithPhotos <= TARGET_P95_WITH_PHOTOS * p95Alone],
      ["no lost or duplicated records", [stored, afterResend, ...storedInComparison].every((c) => c.lost === 0 && c.duplicated === 0 && c.visitsExtraOrMissing === 0)],
      ["every batch created, every resend unchanged", alone.problems.length === 0 && comparisonProblems.length === 0 && resendChanged === 0],
      ["photos were completing throughout, every one ready", during.length > 0 && photos.every((p) => p.status === 200)],
    ] as const;
    for (const [label, ok] of checks) console.log(`${ok ? "PASS" : "FAIL"}  ${label}`);
    return checks.every(([, ok]) => ok);
  } finally {
    await removeBenchData();
    console.log("bench volunteers, their visits, sightings, photos and sign-in attempts removed");
  }
}

try {
  const passed = await main();
  if (!passed) process.exitCode = 1;
} catch (error) {
  console.error("bench:sync failed:", error instanceof Error ? error.message : error);
  process.exitCode = 1;
} finally {
  keepAlive.destroy();
  await closeDb();
}
