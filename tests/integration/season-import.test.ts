import { eq, inArray, sql } from "drizzle-orm";
import { beforeEach, describe, expect, it, vi } from "vitest";
import { db } from "@/db/client";
import { networkChanges, seasonImports, seasons, sightings, transects, users, visits } from "@/db/schema";
import { MAX_IMPORT_FILE_BYTES } from "@/lib/import/limits";
import { resetToDemo } from "./support/db";

// The earlier-seasons import through its two route handlers against the demo network, with a
// 2024 season added before the demo's two. Only Auth.js's cookie decoding is replaced.
const session = vi.hoisted(() => ({ userId: null as string | null }));
vi.mock("@/lib/auth/session", () => ({ sessionUserId: async () => session.userId }));

const { POST: previewRoute } = await import("@/app/(network)/api/network/earlier-seasons/preview/route");
const { POST: importRoute } = await import("@/app/(network)/api/network/earlier-seasons/route");
const noParams = { params: Promise.resolve({}) };

const WALKS = "walk_ref,transect_code,date,start_time,end_time,temperature_c,wind_beaufort,cloud_cover_percent,sky,complete_list,recorder,notes";
const goodWalks = [
  WALKS,
  "A1,CHK-01,2024-05-14,10:30,11:45,17.5,2,30,mostly sunny,yes,sam okonjo,",
  "A2,CHK-01,2024-06-11,11:00,12:00,19,3,80,mostly cloudy,yes,volunteer02@harrowmere.example,",
  "A3,WDR-01,2024-07-02,10:15,11:10,21,1,10,clear,no,Agnes Threlkeld,Empty walk: too hot",
].join("\n");
const goodSightings = ["walk_ref,species,count,section", "A1,Maniola jurtina,12,1", "A1,Lysandra bellargus,3,2", "A2,aglais io,1,"].join("\n");

type Problem = { file: string; line: number | null; column: string | null; reason: string };
type Body = { error?: { code: string; message: string; problems?: Problem[] } } & Record<string, unknown>;

let seasonId = "";

function form(walks: string | Uint8Array<ArrayBuffer>, sightingsFile: string | Uint8Array<ArrayBuffer>, extra: Record<string, string> = {}) {
  const f = new FormData();
  f.set("seasonId", seasonId);
  f.set("recordStatus", "accepted");
  f.set("walks", new File([walks], "walks-2024.csv", { type: "text/csv" }));
  f.set("sightings", new File([sightingsFile], "sightings-2024.csv", { type: "text/csv" }));
  for (const [k, v] of Object.entries(extra)) f.set(k, v);
  return f;
}
const post = (path: string, body: FormData) => new Request(`http://localhost/api/network/${path}`, { method: "POST", body });

async function preview(f: FormData) {
  const res = await previewRoute(post("earlier-seasons/preview", f), noParams);
  return { status: res.status, json: (await res.json()) as Body & { previewHash: string | null; counts: Record<string, number>; newRecorders: string[]; problems: Problem[] } };
}
async function confirm(f: FormData) {
  const res = await importRoute(post("earlier-seasons", f), noParams);
  return { status: res.status, json: (await res.json()) as Body & { imported: { importId: string; counts: Record<string, number> } } };
}

async function rowCounts() {
  const n = async (table: typeof visits | typeof sightings | typeof users | typeof seasonImports | typeof networkChanges) => (await db().select({ n: sql<number>`count(*)::int` }).from(table))[0]!.n;
  return { visits: await n(visits), sightings: await n(sightings), users: await n(users), imports: await n(seasonImports), changes: await n(networkChanges) };
}

async function signInAs(email: string) {
  const [u] = await db().select({ id: users.id }).from(users).where(eq(users.email, email));
  session.userId = u!.id;
  return u!.id;
}

beforeEach(async () => {
  await resetToDemo();
  const [s] = await db()
    .insert(seasons)
    .values({ name: "2024 season", startsOn: "2024-04-01", endsOn: "2024-09-30", status: "closed", openedAt: new Date("2024-04-01T00:00:00Z"), closedAt: new Date("2024-10-01T00:00:00Z") })
    .returning();
  seasonId = s!.id;
  await signInAs("organiser@harrowmere.example");
});

describe("importing an earlier season", () => {
  it("previews without writing, then imports the right counts with import_id, the chosen status and a new recorder", async () => {
    const before = await rowCounts();
    const shown = await preview(form(goodWalks, goodSightings));
    expect(shown.status).toBe(200);
    expect(shown.json.problems).toEqual([]);
    expect(shown.json.counts).toEqual({ walks: 3, emptyWalks: 1, sightings: 3, species: 3, transects: 2, newRecorders: 1 });
    expect(shown.json.newRecorders).toEqual(["Agnes Threlkeld"]);
    expect(await rowCounts()).toEqual(before);

    const organiserId = session.userId!;
    const done = await confirm(form(goodWalks, goodSightings, { previewHash: shown.json.previewHash! }));
    expect(done.status).toBe(200);
    const importId = done.json.imported.importId;
    const after = await rowCounts();
    expect(after).toEqual({ visits: before.visits + 3, sightings: before.sightings + 3, users: before.users + 1, imports: 1, changes: before.changes + 1 });

    const walks = await db().select().from(visits).where(eq(visits.importId, importId));
    expect(walks).toHaveLength(3);
    expect(new Set(walks.map((w) => w.seasonId))).toEqual(new Set([seasonId]));
    const records = await db().select().from(sightings).where(inArray(sightings.visitId, walks.map((w) => w.id)));
    expect(records.map((r) => r.status)).toEqual(["accepted", "accepted", "accepted"]);
    expect(new Set(records.map((r) => r.reviewedById))).toEqual(new Set([organiserId]));
    const [recorder] = await db().select().from(users).where(eq(users.name, "Agnes Threlkeld"));
    expect(recorder).toMatchObject({ active: false, passwordHash: null });
    expect(recorder!.email).toMatch(/^recorder-[0-9a-f-]{36}@import\.invalid$/);
    expect(walks.find((w) => w.visitDate === "2024-07-02")!.volunteerId).toBe(recorder!.id);
    const [log] = await db().select().from(networkChanges).where(eq(networkChanges.entityId, importId));
    expect(log).toMatchObject({ entity: "import", action: "import" });
    expect(log!.summary).toContain("walks-2024.csv");
  });

  it("stores waiting records unreviewed when asked to", async () => {
    const f = () => form(goodWalks, goodSightings, { recordStatus: "pending" });
    const shown = await preview(f());
    const done = await confirm(form(goodWalks, goodSightings, { recordStatus: "pending", previewHash: shown.json.previewHash! }));
    expect(done.status).toBe(200);
    const walkIds = (await db().select({ id: visits.id }).from(visits).where(eq(visits.importId, done.json.imported.importId))).map((w) => w.id);
    const records = await db().select({ status: sightings.status, reviewedAt: sightings.reviewedAt }).from(sightings).where(inArray(sightings.visitId, walkIds));
    expect(records).toEqual([{ status: "pending", reviewedAt: null }, { status: "pending", reviewedAt: null }, { status: "pending", reviewedAt: null }]);
  });

  it("refuses a bad pair and writes nothing: every problem by file and line", async () => {
    const [chk] = await db().select({ sections: transects.sectionCount }).from(transects).where(eq(transects.code, "CHK-01"));
    const badWalks = `${goodWalks}\nA4,NOPE-1,2024-05-01,10:00,,,,,,yes,Sam Okonjo,\nA5,CHK-01,2023-05-01,10:00,,,,,,yes,Sam Okonjo,`;
    const badSightings = `${goodSightings}\nA1,Papilio imaginarius,1,1\nA1,Aglais io,1,${chk!.sections + 1}\nA9,Aglais io,1,1`;
    const before = await rowCounts();
    const shown = await preview(form(badWalks, badSightings));
    expect(shown.status).toBe(200);
    expect(shown.json.previewHash).toBeNull();
    expect(shown.json.problems!.map((p) => [p.file, p.line, p.column])).toEqual([
      ["walks", 5, "transect_code"],
      ["walks", 6, "date"],
      ["sightings", 5, "species"],
      ["sightings", 6, "section"],
      ["sightings", 7, "walk_ref"],
    ]);
    // Confirming the bad pair anyway, with the hash of the good pair's preview, is refused.
    const good = await preview(form(goodWalks, goodSightings));
    const refused = await confirm(form(badWalks, badSightings, { previewHash: good.json.previewHash! }));
    expect(refused.status).toBe(409);
    expect(await rowCounts()).toEqual(before);
  });

  it("refuses in the write step too (400 with the problems) when the network changed after the preview", async () => {
    const shown = await preview(form(goodWalks, goodSightings));
    // The season is moved so that the walks no longer fall inside it.
    await db().update(seasons).set({ startsOn: "2024-06-01" }).where(eq(seasons.id, seasonId));
    const before = await rowCounts();
    const refused = await confirm(form(goodWalks, goodSightings, { previewHash: shown.json.previewHash! }));
    expect(refused.status).toBe(400);
    expect(refused.json.error!.problems).toEqual([expect.objectContaining({ file: "walks", line: 2, column: "date" })]);
    expect(await rowCounts()).toEqual(before);
  });

  it("refuses a hash that does not match the files, and the same files a second time", async () => {
    const shown = await preview(form(goodWalks, goodSightings));
    const before = await rowCounts();
    const changed = await confirm(form(goodWalks.replace("17.5", "18"), goodSightings, { previewHash: shown.json.previewHash! }));
    expect(changed.status).toBe(409);
    const otherStatus = await confirm(form(goodWalks, goodSightings, { recordStatus: "pending", previewHash: shown.json.previewHash! }));
    expect(otherStatus.status).toBe(409);
    expect(await rowCounts()).toEqual(before);
    expect((await confirm(form(goodWalks, goodSightings, { previewHash: shown.json.previewHash! }))).status).toBe(200);
    const again = await preview(form(goodWalks, goodSightings));
    expect(again.status).toBe(409);
    expect(again.json.error!.message).toContain("already imported");
  });

  it("answers 413 for a file over 10 MB, before reading its lines", async () => {
    const big = new Uint8Array(MAX_IMPORT_FILE_BYTES + 10).fill(0x41);
    const res = await preview(form(goodWalks, big));
    expect(res.status).toBe(413);
    expect(res.json.error!.message).toContain("sightings file is larger than 10 MB");
  });

  it("refuses non-organisers: a reviewer and a volunteer get 403 and nothing is written", async () => {
    const shown = await preview(form(goodWalks, goodSightings));
    const before = await rowCounts();
    for (const email of ["checker@harrowmere.example", "volunteer01@harrowmere.example"]) {
      await signInAs(email);
      expect((await preview(form(goodWalks, goodSightings))).status).toBe(403);
      expect((await confirm(form(goodWalks, goodSightings, { previewHash: shown.json.previewHash! }))).status).toBe(403);
    }
    expect(await rowCounts()).toEqual(before);
  });

  it("answers 400 with field messages for a form without files or season", async () => {
    const f = new FormData();
    f.set("recordStatus", "sometimes");
    const res = await preview(f);
    expect(res.status).toBe(400);
    expect(Object.keys((res.json.error as unknown as { fields: Record<string, string[]> }).fields).sort()).toEqual(["recordStatus", "seasonId", "sightings", "walks"]);
  });
});
