// The first pass of an import: both files read as streams and every line checked, keeping only
// a compact record per walk (walk_ref → line, section count, sightings seen) and the counts.
import { REQUIRED_SIGHTING_COLUMNS, REQUIRED_WALK_COLUMNS, SIGHTING_COLUMNS, WALK_COLUMNS, fileLabel, type ImportFileKind } from "./columns";
import { fileCapMessage, notTextReason, overFileCap } from "./file-check";
import { ProblemList, type LineProblem } from "./problems";
import { readCsvLines } from "./read-csv";
import { readSightingLine, readWalkLine, readWalkRef, refKey, type ImportContext } from "./rows";

export type ImportFiles = { walks: Uint8Array; sightings: Uint8Array };

export type ImportCounts = { walks: number; emptyWalks: number; sightings: number; species: number; transects: number; newRecorders: number };

export type FirstPass = {
  counts: ImportCounts;
  /** Names that match nobody: each becomes a recorder without an account. */
  newRecorders: string[];
  problems: LineProblem[];
  /** Problems beyond the ones listed. */
  moreProblems: number;
};

type WalkState = { line: number; sectionCount: number | null; sightings: number };

export const walksSpec = { file: "walks" as const, columns: WALK_COLUMNS, required: REQUIRED_WALK_COLUMNS };
export const sightingsSpec = { file: "sightings" as const, columns: SIGHTING_COLUMNS, required: REQUIRED_SIGHTING_COLUMNS };

/** Whole-file problems (size, not text): checked before any line is read. */
export function fileProblems(files: ImportFiles, problems: ProblemList): void {
  for (const file of ["walks", "sightings"] as ImportFileKind[]) {
    const bytes = files[file];
    if (overFileCap(bytes.byteLength)) problems.add(file, null, null, fileCapMessage(fileLabel[file], bytes.byteLength));
    else {
      const reason = notTextReason(bytes, fileLabel[file]);
      if (reason) problems.add(file, null, null, reason);
    }
  }
}

/** Checks both files line by line against the context; writes nothing. */
export async function checkImport(files: ImportFiles, ctx: ImportContext): Promise<FirstPass> {
  const problems = new ProblemList();
  const walks = new Map<string, WalkState>();
  const transects = new Set<string>();
  const newRecorders = new Map<string, string>();
  const species = new Set<string>();
  let sightings = 0;
  const result = (): FirstPass => {
    const empty = [...walks.values()].filter((w) => w.sightings === 0).length;
    return {
      counts: { walks: walks.size, emptyWalks: empty, sightings, species: species.size, transects: transects.size, newRecorders: newRecorders.size },
      newRecorders: [...newRecorders.values()].sort((a, b) => a.localeCompare(b)),
      problems: problems.listed,
      moreProblems: problems.more,
    };
  };

  fileProblems(files, problems);
  if (problems.total) return result();

  for await (const line of readCsvLines(files.walks, walksSpec, problems)) {
    const read = readWalkLine(line, ctx);
    // A refused line still names its walk, so its sightings are not called unknown too.
    const refCell = readWalkRef(line.cells.walk_ref);
    const ref = "value" in refCell ? refCell.value : null;
    if (ref !== null) {
      const seen = walks.get(refKey(ref));
      if (seen) problems.add("walks", line.line, "walk_ref", `The walk_ref "${ref}" is used twice: on lines ${seen.line} and ${line.line}.`);
      else walks.set(refKey(ref), { line: line.line, sectionCount: "values" in read ? read.values.sectionCount : null, sightings: 0 });
    }
    if ("problems" in read) {
      for (const p of read.problems) problems.add("walks", line.line, p.column, p.reason);
      continue;
    }
    transects.add(read.values.transectId);
    if (read.values.recorderId === null) {
      const key = read.values.recorderName.toLowerCase();
      if (!newRecorders.has(key)) newRecorders.set(key, read.values.recorderName);
    }
  }
  const walkHeaderRefused = problems.listed.some((p) => p.file === "walks" && p.line === 1);

  for await (const line of readCsvLines(files.sightings, sightingsSpec, problems)) {
    // With the walks file's columns refused, every walk_ref would look unknown: check the rest only.
    const read = readSightingLine(line, ctx, (ref) => (walkHeaderRefused ? { sectionCount: null } : walks.get(refKey(ref))));
    if ("problems" in read) {
      for (const p of read.problems) problems.add("sightings", line.line, p.column, p.reason);
      continue;
    }
    sightings++;
    species.add(read.values.speciesId);
    const walk = walks.get(refKey(read.values.ref));
    if (walk) walk.sightings++;
  }
  return result();
}
