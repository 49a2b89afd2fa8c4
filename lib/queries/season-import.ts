import "server-only";
import { createHash, randomUUID } from "node:crypto";
import { desc, eq, isNull, sql } from "drizzle-orm";
import { db, type Database, type Transaction } from "@/db/client";
import { seasonImports, seasons, sightings, speciesMerges, transectRouteVersions, transects, users, visits } from "@/db/schema";
import type { Actor } from "@/lib/auth/guard";
import { conflict, notFound } from "@/lib/errors";
import { checkImport, sightingsSpec, walksSpec, type FirstPass, type ImportCounts, type ImportFiles } from "@/lib/import/first-pass";
import { WRITE_CHUNK_ROWS } from "@/lib/import/limits";
import { ProblemList } from "@/lib/import/problems";
import { readCsvLines } from "@/lib/import/read-csv";
import { SeasonImportRefused } from "@/lib/import/refusal";
import { readSightingLine, readWalkLine, refKey, type ImportContext } from "@/lib/import/rows";
import { logChange } from "./change-log";
import { speciesNameIndex } from "./checklist";
import { lockChecklist } from "./checklist-lock";

export type RecordStatus = (typeof seasonImports.$inferInsert)["recordStatus"];

export type SeasonImportInput = {
  seasonId: string;
  recordStatus: RecordStatus;
  walks: { fileName: string; bytes: Uint8Array };
  sightings: { fileName: string; bytes: Uint8Array };
};

export type SeasonImportPreview = FirstPass & { season: { id: string; name: string; status: string }; previewHash: string | null };

const sha256 = (bytes: Uint8Array | string) => createHash("sha256").update(bytes).digest("hex");

/** Both files' bytes, whichever season they go to: kept on the import to catch the same files twice. */
const contentHashOf = (input: SeasonImportInput) => sha256(`${sha256(input.walks.bytes)}:${sha256(input.sightings.bytes)}`);

/** Names what the preview showed (the files, the season, the status): confirm writes only that. */
const previewHashOf = (input: SeasonImportInput) => sha256(`${contentHashOf(input)}:${input.seasonId}:${input.recordStatus}`);

const filesOf = (input: SeasonImportInput): ImportFiles => ({ walks: input.walks.bytes, sightings: input.sightings.bytes });

async function seasonOf(tx: Database | Transaction, seasonId: string) {
  const [season] = await tx.select().from(seasons).where(eq(seasons.id, seasonId));
  if (!season) throw notFound("That season");
  return season;
}

/** The transects (retired ones too: an earlier season may have walked them), checklist names and people an import is checked against. */
async function loadContext(tx: Database | Transaction, season: { name: string; startsOn: string; endsOn: string }): Promise<ImportContext> {
  const [transectRows, versionRows, names, merged, people] = await Promise.all([
    tx.select({ id: transects.id, code: transects.code }).from(transects),
    tx.select({ transectId: transectRouteVersions.transectId, version: transectRouteVersions.version, validFrom: transectRouteVersions.validFrom, sectionCount: transectRouteVersions.sectionCount }).from(transectRouteVersions),
    speciesNameIndex(tx),
    tx.select({ name: speciesMerges.fromScientificName, into: speciesMerges.intoSpeciesId }).from(speciesMerges),
    tx.select({ id: users.id, name: users.name, email: users.email }).from(users).where(isNull(users.erasedAt)),
  ]);
  const versions = new Map<string, { version: number; validFrom: string; sectionCount: number }[]>();
  for (const { transectId, ...v } of versionRows) versions.set(transectId, [...(versions.get(transectId) ?? []), v]);
  const species = new Map<string, string>();
  for (const [name, entry] of names) species.set(name, entry.id);
  // A name merged away still finds the entry it was folded into, unless it names an entry itself.
  for (const m of merged) if (!species.has(m.name.toLowerCase())) species.set(m.name.toLowerCase(), m.into);
  const byName = new Map<string, string | "ambiguous">();
  for (const p of people) {
    const key = p.name.trim().toLowerCase();
    byName.set(key, byName.has(key) && byName.get(key) !== p.id ? "ambiguous" : p.id);
  }
  for (const p of people) byName.set(p.email.toLowerCase(), p.id);
  return {
    season,
    transects: new Map(transectRows.map((t) => [t.code.toLowerCase(), { id: t.id, code: t.code, versions: versions.get(t.id) ?? [] }])),
    species,
    people: byName,
  };
}

async function refuseRepeat(tx: Database | Transaction, input: SeasonImportInput): Promise<void> {
  const [earlier] = await tx
    .select({ at: seasonImports.createdAt, season: seasons.name })
    .from(seasonImports)
    .innerJoin(seasons, eq(seasons.id, seasonImports.seasonId))
    .where(eq(seasonImports.contentHash, contentHashOf(input)))
    .limit(1);
  if (earlier) throw conflict(`These two files were already imported into the ${earlier.season} on ${earlier.at.toISOString().slice(0, 10)}; importing them again would count every walk twice.`);
}

/** What importing these files would write, with every problem found (the first ones listed); writes nothing. */
export async function previewSeasonImport(input: SeasonImportInput): Promise<SeasonImportPreview> {
  const season = await seasonOf(db(), input.seasonId);
  await refuseRepeat(db(), input);
  const checked = await checkImport(filesOf(input), await loadContext(db(), season));
  const clean = checked.problems.length === 0;
  return { ...checked, season: { id: season.id, name: season.name, status: season.status }, previewHash: clean ? previewHashOf(input) : null };
}

type VisitRow = typeof visits.$inferInsert;
type SightingRow = typeof sightings.$inferInsert;

/** The second pass: both files read again as streams and written in multi-row INSERTs of WRITE_CHUNK_ROWS. */
async function writeRows(tx: Transaction, input: SeasonImportInput, ctx: ImportContext, importId: string, recorderIds: Map<string, string>, reviewer: { id: string; at: Date } | null) {
  const problems = new ProblemList();
  const visitIds = new Map<string, { id: string; sectionCount: number }>();
  let visitRows: VisitRow[] = [];
  const now = new Date();
  for await (const line of readCsvLines(input.walks.bytes, walksSpec, problems)) {
    const read = readWalkLine(line, ctx);
    if ("problems" in read) throw new Error(`walks line ${line.line} changed between the passes`);
    const { ref, sectionCount, recorderId, recorderName, ...walk } = read.values;
    const id = randomUUID();
    visitIds.set(refKey(ref), { id, sectionCount });
    visitRows.push({ ...walk, id, volunteerId: recorderId ?? recorderIds.get(recorderName.toLowerCase())!, seasonId: input.seasonId, importId, submittedAt: now });
    if (visitRows.length >= WRITE_CHUNK_ROWS) {
      await tx.insert(visits).values(visitRows);
      visitRows = [];
    }
  }
  if (visitRows.length) await tx.insert(visits).values(visitRows);
  visitRows = [];

  let sightingRows: SightingRow[] = [];
  const status = reviewer ? "accepted" : "pending";
  for await (const line of readCsvLines(input.sightings.bytes, sightingsSpec, problems)) {
    const read = readSightingLine(line, ctx, (ref) => visitIds.get(refKey(ref)));
    if ("problems" in read) throw new Error(`sightings line ${line.line} changed between the passes`);
    const { ref, ...sighting } = read.values;
    sightingRows.push({ ...sighting, id: randomUUID(), visitId: visitIds.get(refKey(ref))!.id, status, reviewedById: reviewer?.id ?? null, reviewedAt: reviewer?.at ?? null });
    if (sightingRows.length >= WRITE_CHUNK_ROWS) {
      await tx.insert(sightings).values(sightingRows);
      sightingRows = [];
    }
  }
  if (sightingRows.length) await tx.insert(sightings).values(sightingRows);
  if (problems.total) throw new Error("the files changed between the passes");
}

/**
 * Imports an earlier season in ONE transaction: the files are checked again against the network
 * as it stands (under the checklist lock, so no entry goes away mid-import), and written only
 * when they are the ones previewed (409 otherwise) and without a single problem (400, nothing
 * written). New recorders become people without an account; the import is logged.
 */
export async function importSeason(actor: Pick<Actor, "id">, input: SeasonImportInput & { previewHash: string }): Promise<{ importId: string; counts: ImportCounts }> {
  if (previewHashOf(input) !== input.previewHash) {
    throw conflict("The files, the season or the status differ from the preview. Look at the new preview before importing.");
  }
  return db().transaction(async (tx) => {
    await tx.execute(sql`select pg_advisory_xact_lock(hashtext('turnstone.season-import'))`);
    await lockChecklist(tx);
    const season = await seasonOf(tx, input.seasonId);
    await refuseRepeat(tx, input);
    const ctx = await loadContext(tx, season);
    const checked = await checkImport(filesOf(input), ctx);
    if (checked.problems.length) throw new SeasonImportRefused(checked.problems, checked.moreProblems);

    const recorderIds = new Map<string, string>();
    if (checked.newRecorders.length) {
      // No password and a reserved domain (.invalid: RFC 2606 §2, RFC 6761 §6.4): nobody signs in as them.
      const created = await tx
        .insert(users)
        .values(checked.newRecorders.map((name) => ({ name, email: `recorder-${randomUUID()}@import.invalid`, roles: ["volunteer" as const], active: false, passwordHash: null })))
        .returning({ id: users.id, name: users.name });
      for (const c of created) recorderIds.set(c.name.toLowerCase(), c.id);
    }
    const [row] = await tx
      .insert(seasonImports)
      .values({
        seasonId: season.id,
        recordStatus: input.recordStatus,
        walksFileName: input.walks.fileName,
        sightingsFileName: input.sightings.fileName,
        contentHash: contentHashOf(input),
        walks: checked.counts.walks,
        sightings: checked.counts.sightings,
        createdById: actor.id,
      })
      .returning({ id: seasonImports.id });
    const importId = row!.id;
    await writeRows(tx, input, ctx, importId, recorderIds, input.recordStatus === "accepted" ? { id: actor.id, at: new Date() } : null);

    const c = checked.counts;
    await logChange(tx, actor, {
      entity: "import",
      entityId: importId,
      action: "import",
      summary:
        `Imported an earlier season into the ${season.name} (${season.status}) from ${input.walks.fileName} and ${input.sightings.fileName}: ` +
        `${c.walks} walks (${c.emptyWalks} empty), ${c.sightings} sightings of ${c.species} species on ${c.transects} transects, as ${input.recordStatus === "accepted" ? "accepted" : "waiting for review"}` +
        (checked.newRecorders.length ? `; new recorders without an account: ${checked.newRecorders.join(", ")}` : ""),
      after: { seasonId: season.id, seasonStatus: season.status, recordStatus: input.recordStatus, walksFile: input.walks.fileName, sightingsFile: input.sightings.fileName, counts: c, newRecorders: checked.newRecorders },
    });
    return { importId, counts: c };
  });
}

/** Where an imported walk came from, in words: "imported from walks-2019.csv on 2026-03-02". */
export function importedFromText(row: { walksFileName: string; createdAt: Date }): string {
  return `imported from ${row.walksFileName} on ${row.createdAt.toISOString().slice(0, 10)}`;
}


/** Earlier imports, newest first, for the import page. */
export function listSeasonImports() {
  return db()
    .select({
      id: seasonImports.id,
      season: seasons.name,
      recordStatus: seasonImports.recordStatus,
      walksFileName: seasonImports.walksFileName,
      sightingsFileName: seasonImports.sightingsFileName,
      walks: seasonImports.walks,
      sightings: seasonImports.sightings,
      createdAt: seasonImports.createdAt,
      by: users.name,
    })
    .from(seasonImports)
    .innerJoin(seasons, eq(seasons.id, seasonImports.seasonId))
    .leftJoin(users, eq(users.id, seasonImports.createdById))
    .orderBy(desc(seasonImports.createdAt))
    .limit(50);
}
