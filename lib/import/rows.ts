// A line of each file read into the values a walk or sighting is stored with, or its problems.
// Both passes of an import read lines through these, so what is written is what was checked.
import { versionOn, type VersionSpan } from "@/lib/geo/versions";
import { MAX_PERSON_NAME_LENGTH, MAX_VISIT_NOTES_LENGTH } from "@/lib/limits/text";
import { latestRecordDate } from "@/lib/validation/fields";
import { readCloud, readCount, readDate, readLabel, readLatitude, readLongitude, readOptionalText, readSectionNumber, readSky, readTemperature, readTime, readWind, readYesNo, type Cell, type Sky } from "./cells";
import type { SightingColumn, WalkColumn } from "./columns";
import { MAX_WALK_REF_LENGTH } from "./limits";
import type { CsvLine } from "./read-csv";

/** What an import is checked against: the season, and the network's transects, checklist and people, by lower-case key. */
export type ImportContext = {
  season: { name: string; startsOn: string; endsOn: string };
  transects: ReadonlyMap<string, { id: string; code: string; versions: readonly VersionSpan[] }>;
  species: ReadonlyMap<string, string>;
  /** Lower-case name or e-mail → the person, or "ambiguous" when two people share the name. */
  people: ReadonlyMap<string, string | "ambiguous">;
  /** Defaults to now: the latest date a record can carry is tomorrow (lib/validation/fields.ts). */
  now?: Date;
};

export type ColumnProblem<C> = { column: C | null; reason: string };

export type WalkValues = {
  ref: string;
  transectId: string;
  visitDate: string;
  startTime: string;
  endTime: string | null;
  temperatureC: number | null;
  windBeaufort: number | null;
  cloudCoverPercent: number | null;
  sky: Sky | null;
  completeList: boolean;
  /** The person's id, or null for a new recorder without an account. */
  recorderId: string | null;
  recorderName: string;
  notes: string | null;
  sectionCount: number;
};

/** Takes a cell's value, or records its problem and answers undefined. */
function taker<C>(problems: ColumnProblem<C>[]) {
  return <T>(column: C, cell: Cell<T>): T | undefined => {
    if ("error" in cell) {
      problems.push({ column, reason: cell.error });
      return undefined;
    }
    return cell.value;
  };
}

export const refKey = (ref: string) => ref.toLowerCase();

/** The walk_ref alone (a walk line with other problems still names its walk for the sightings file). */
export const readWalkRef = (cell: string | undefined) => readLabel(cell, "walk_ref", MAX_WALK_REF_LENGTH);

export function readWalkLine({ cells }: CsvLine<WalkColumn>, ctx: ImportContext): { values: WalkValues } | { problems: ColumnProblem<WalkColumn>[] } {
  const problems: ColumnProblem<WalkColumn>[] = [];
  const take = taker(problems);
  const ref = take("walk_ref", readWalkRef(cells.walk_ref));
  const code = take("transect_code", readLabel(cells.transect_code, "transect code", 60));
  const transect = code === undefined ? undefined : ctx.transects.get(code.toLowerCase());
  if (code !== undefined && !transect) problems.push({ column: "transect_code", reason: `No transect has the code "${code}". Use a code from the Transects page.` });
  const visitDate = take("date", readDate(cells.date));
  if (visitDate !== undefined) {
    const { startsOn, endsOn, name } = ctx.season;
    const latest = latestRecordDate(ctx.now);
    if (visitDate < startsOn || visitDate > endsOn) problems.push({ column: "date", reason: `${visitDate} is outside the ${name} (${startsOn} to ${endsOn}).` });
    else if (visitDate > latest) problems.push({ column: "date", reason: `${visitDate} is in the future.` });
  }
  const startTime = take("start_time", readTime(cells.start_time, true));
  const endTime = take("end_time", readTime(cells.end_time, false));
  if (startTime && endTime && endTime < startTime) problems.push({ column: "end_time", reason: "The walk cannot end before it starts." });
  const temperatureC = take("temperature_c", readTemperature(cells.temperature_c));
  const windBeaufort = take("wind_beaufort", readWind(cells.wind_beaufort));
  const cloudCoverPercent = take("cloud_cover_percent", readCloud(cells.cloud_cover_percent));
  const sky = take("sky", readSky(cells.sky));
  const completeList = take("complete_list", readYesNo(cells.complete_list));
  const recorderName = take("recorder", readLabel(cells.recorder, "recorder's name", MAX_PERSON_NAME_LENGTH));
  const recorder = recorderName === undefined ? undefined : ctx.people.get(recorderName.toLowerCase());
  if (recorder === "ambiguous") problems.push({ column: "recorder", reason: `More than one person is called "${recorderName}": write that person's e-mail instead.` });
  const notes = take("notes", readOptionalText(cells.notes, MAX_VISIT_NOTES_LENGTH));
  if (problems.length) return { problems };
  const version = versionOn(transect!.versions, visitDate!);
  return {
    values: {
      ref: ref!,
      transectId: transect!.id,
      visitDate: visitDate!,
      startTime: startTime!,
      endTime: endTime ?? null,
      temperatureC: temperatureC ?? null,
      windBeaufort: windBeaufort ?? null,
      cloudCoverPercent: cloudCoverPercent ?? null,
      sky: sky ?? null,
      completeList: completeList!,
      recorderId: recorder ?? null,
      recorderName: recorderName!,
      notes: notes ?? null,
      sectionCount: version?.sectionCount ?? 0,
    },
  };
}

export type SightingValues = { ref: string; speciesId: string; count: number; section: number | null; latitude: number | null; longitude: number | null };

/** A walk as the sightings file needs it: its section count on the walk's date, or null when the walk line was refused. */
export type WalkOfSighting = { sectionCount: number | null };

export function readSightingLine(
  { cells }: CsvLine<SightingColumn>,
  ctx: ImportContext,
  walkOf: (ref: string) => WalkOfSighting | undefined,
): { values: SightingValues } | { problems: ColumnProblem<SightingColumn>[] } {
  const problems: ColumnProblem<SightingColumn>[] = [];
  const take = taker(problems);
  const ref = take("walk_ref", readWalkRef(cells.walk_ref));
  const walk = ref === undefined ? undefined : walkOf(ref);
  if (ref !== undefined && !walk) problems.push({ column: "walk_ref", reason: `No walk in the walks file has the walk_ref "${ref}".` });
  const name = take("species", readLabel(cells.species, "species", 200));
  const speciesId = name === undefined ? undefined : ctx.species.get(name.toLowerCase());
  if (name !== undefined && !speciesId) problems.push({ column: "species", reason: `"${name}" is not on the checklist, as a scientific name or a synonym.` });
  const count = take("count", readCount(cells.count));
  const section = take("section", readSectionNumber(cells.section));
  if (section != null && walk && walk.sectionCount !== null && section > walk.sectionCount) {
    problems.push({ column: "section", reason: `Section ${section} does not exist: the transect had ${walk.sectionCount} sections on the walk's date.` });
  }
  const latitude = take("latitude", readLatitude(cells.latitude));
  const longitude = take("longitude", readLongitude(cells.longitude));
  if (latitude !== undefined && longitude !== undefined && (latitude === null) !== (longitude === null)) {
    problems.push({ column: latitude === null ? "latitude" : "longitude", reason: "Give both latitude and longitude, or neither." });
  }
  if (problems.length) return { problems };
  return { values: { ref: ref!, speciesId: speciesId!, count: count!, section: section ?? null, latitude: latitude ?? null, longitude: longitude ?? null } };
}
