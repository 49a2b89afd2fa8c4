import { describe, expect, it } from "vitest";
import { checkImport, type ImportFiles } from "@/lib/import/first-pass";
import { MAX_IMPORT_FILE_BYTES, MAX_LISTED_PROBLEMS } from "@/lib/import/limits";
import type { LineProblem } from "@/lib/import/problems";
import type { ImportContext } from "@/lib/import/rows";

// The first pass of an earlier season's import against a small invented network: two transects
// (one whose route changed mid-season from 6 to 4 sections), three species, two people.
const ctx: ImportContext = {
  season: { name: "2024 season", startsOn: "2024-04-01", endsOn: "2024-09-30" },
  transects: new Map([
    ["chk-01", { id: "t1", code: "CHK-01", versions: [{ version: 1, validFrom: "2024-04-01", sectionCount: 6 }, { version: 2, validFrom: "2024-07-01", sectionCount: 4 }] }],
    ["wet-02", { id: "t2", code: "WET-02", versions: [{ version: 1, validFrom: "2023-04-01", sectionCount: 8 }] }],
  ]),
  species: new Map([["maniola jurtina", "s1"], ["aglais io", "s2"], ["inachis io", "s2"], ["lysandra bellargus", "s3"]]),
  people: new Map([["sam okonjo", "p1"], ["volunteer01@example.org", "p1"], ["ruth penhallow", "p2"]]),
  now: new Date("2026-01-01T12:00:00Z"),
};

const WALKS = "walk_ref,transect_code,date,start_time,end_time,temperature_c,wind_beaufort,cloud_cover_percent,sky,complete_list,recorder,notes";
const SIGHTINGS = "walk_ref,species,count,section,latitude,longitude";
const goodWalks = [WALKS, "W1,CHK-01,2024-05-14,10:30,11:45,17.5,2,30,mostly sunny,yes,Sam Okonjo,", "W2,chk-01,2024-07-14,11:00,,,,,,no,VOLUNTEER01@example.org,", "W3,WET-02,2024-06-01,10:00,11:00,19,1,0,clear,yes,Ann Newcombe,\"Dry, hot\""].join("\r\n");
const goodSightings = [SIGHTINGS, "W1,Maniola jurtina,12,6,51.08,-1.26", "W1,Inachis io,1,,,", "W2,Lysandra bellargus,3,4,,"].join("\n");

const bytes = (text: string) => new TextEncoder().encode(text);
const files = (walks: string, sightings: string): ImportFiles => ({ walks: bytes(walks), sightings: bytes(sightings) });
const withWalk = (line: string) => `${goodWalks}\r\n${line}`;
const withSighting = (line: string) => `${goodSightings}\n${line}`;

async function problemsOf(f: ImportFiles): Promise<LineProblem[]> {
  return (await checkImport(f, ctx)).problems;
}

describe("checking an earlier season's files", () => {
  it("counts a good pair: walks, the empty one, sightings, species (synonyms resolved), transects and the new recorder", async () => {
    const result = await checkImport(files(`\uFEFF${goodWalks}`, goodSightings), ctx);
    expect(result.problems).toEqual([]);
    expect(result.counts).toEqual({ walks: 3, emptyWalks: 1, sightings: 3, species: 3, transects: 2, newRecorders: 1 });
    expect(result.newRecorders).toEqual(["Ann Newcombe"]);
  });

  it("names a missing column and an unknown one", async () => {
    const problems = await problemsOf(files(goodWalks.replace(",recorder,", ",observer,"), goodSightings));
    expect(problems).toContainEqual(expect.objectContaining({ file: "walks", line: 1, column: "recorder", reason: expect.stringContaining("The column recorder is missing") }));
    expect(problems).toContainEqual(expect.objectContaining({ file: "walks", line: 1, reason: expect.stringContaining('Unknown column "observer"') }));
    const noCount = await problemsOf(files(goodWalks, goodSightings.replace(",count,", ",number,")));
    expect(noCount).toContainEqual(expect.objectContaining({ file: "sightings", line: 1, column: "count" }));
  });

  it("refuses an unknown species and an unknown transect, at their lines", async () => {
    expect(await problemsOf(files(goodWalks, withSighting("W1,Papilio imaginarius,2,1,,")))).toEqual([
      { file: "sightings", line: 5, column: "species", reason: '"Papilio imaginarius" is not on the checklist, as a scientific name or a synonym.' },
    ]);
    expect(await problemsOf(files(withWalk("W4,XYZ-99,2024-06-01,10:00,,,,,,yes,Sam Okonjo,"), goodSightings))).toEqual([
      { file: "walks", line: 5, column: "transect_code", reason: 'No transect has the code "XYZ-99". Use a code from the Transects page.' },
    ]);
  });

  it("refuses bad dates (not YYYY-MM-DD, not a calendar day) and dates outside the season", async () => {
    const bad = await problemsOf(files(withWalk("W4,CHK-01,14/05/2024,10:00,,,,,,yes,Sam Okonjo,\r\nW5,CHK-01,2024-02-30,10:00,,,,,,yes,Sam Okonjo,"), goodSightings));
    expect(bad.map((p) => [p.line, p.column])).toEqual([[5, "date"], [6, "date"]]);
    expect(bad[1]!.reason).toBe("2024-02-30 is not a day of the calendar.");
    const outside = await problemsOf(files(withWalk("W4,CHK-01,2024-10-01,10:00,,,,,,yes,Sam Okonjo,"), goodSightings));
    expect(outside).toEqual([{ file: "walks", line: 5, column: "date", reason: "2024-10-01 is outside the 2024 season (2024-04-01 to 2024-09-30)." }]);
  });

  it("refuses coordinates out of range (WGS84: latitude ±90, longitude ±180) and half a position", async () => {
    const problems = await problemsOf(files(goodWalks, withSighting("W1,Aglais io,1,1,91,-1.2\nW1,Aglais io,1,1,51.1,-180.5\nW1,Aglais io,1,1,51.1,")));
    expect(problems.map((p) => [p.line, p.column])).toEqual([[5, "latitude"], [6, "longitude"], [7, "longitude"]]);
  });

  it("checks sections against the route version in force on the walk's date", async () => {
    // W2 (14 July) falls after the change to 4 sections; W1 (14 May) had 6.
    const problems = await problemsOf(files(goodWalks, withSighting("W2,Aglais io,1,5,,\nW1,Aglais io,1,5,,")));
    expect(problems).toEqual([{ file: "sightings", line: 5, column: "section", reason: "Section 5 does not exist: the transect had 4 sections on the walk's date." }]);
  });

  it("refuses a walk_ref used twice with both line numbers, and a sighting of an unknown walk_ref", async () => {
    expect(await problemsOf(files(withWalk("w1,CHK-01,2024-06-01,10:00,,,,,,yes,Sam Okonjo,"), goodSightings))).toEqual([
      { file: "walks", line: 5, column: "walk_ref", reason: 'The walk_ref "w1" is used twice: on lines 2 and 5.' },
    ]);
    expect(await problemsOf(files(goodWalks, withSighting("W9,Aglais io,1,1,,")))).toEqual([
      { file: "sightings", line: 5, column: "walk_ref", reason: 'No walk in the walks file has the walk_ref "W9".' },
    ]);
  });

  it("needs a complete-list answer and a start time; refuses an end before the start", async () => {
    const problems = await problemsOf(files(withWalk("W4,CHK-01,2024-06-01,,,,,,,,Sam Okonjo,\r\nW5,CHK-01,2024-06-01,12:00,11:00,,,,,yes,Sam Okonjo,"), goodSightings));
    expect(problems.map((p) => [p.line, p.column])).toEqual([[5, "start_time"], [5, "complete_list"], [6, "end_time"]]);
  });

  it("refuses files that are not CSV text: a zip (an .xlsx), a PDF, NUL bytes, broken UTF-8, no header line", async () => {
    const zip = new Uint8Array([0x50, 0x4b, 0x03, 0x04, 0x14, 0x00]);
    const pdf = bytes("%PDF-1.7\n...");
    const nul = bytes(`${WALKS}\nW1\u0000,CHK-01`);
    const latin1 = new Uint8Array([...bytes(`${WALKS}\nW1,CHK-01,2024-05-14,10:30,,,,,,yes,Ren`), 0xe9, 0x0a]);
    for (const [walks, says] of [[zip, "zip archive"], [pdf, "PDF"], [nul, "binary data"], [latin1, "not UTF-8"]] as const) {
      const problems = (await checkImport({ walks, sightings: bytes(goodSightings) }, ctx)).problems;
      expect(problems).toEqual([expect.objectContaining({ file: "walks", line: null, reason: expect.stringContaining(says) })]);
    }
    const empty = await problemsOf(files(goodWalks, ""));
    expect(empty).toEqual([expect.objectContaining({ file: "sightings", line: null, reason: expect.stringContaining("is empty") })]);
  });

  it("refuses a file over 10 MB without reading its lines", async () => {
    const big = new Uint8Array(MAX_IMPORT_FILE_BYTES + 1).fill(0x41);
    const problems = (await checkImport({ walks: bytes(goodWalks), sightings: big }, ctx)).problems;
    expect(problems).toEqual([expect.objectContaining({ file: "sightings", line: null, reason: expect.stringContaining("larger than 10 MB") })]);
  });

  it("keeps line numbers right after a quoted value with a line break, and lists at most the cap of problems", async () => {
    const quoted = withWalk('W4,CHK-01,2024-06-01,10:00,,,,,,yes,Sam Okonjo,"two\r\nlines"\r\nW5,XYZ,2024-06-01,10:00,,,,,,yes,Sam Okonjo,');
    // W4 takes lines 5 and 6, so W5 is on line 7.
    expect((await problemsOf(files(quoted, goodSightings))).map((p) => p.line)).toEqual([7]);
    const many = withSighting(Array.from({ length: MAX_LISTED_PROBLEMS + 50 }, () => "W1,Nobody,1,,,").join("\n"));
    const result = await checkImport(files(goodWalks, many), ctx);
    expect(result.problems).toHaveLength(MAX_LISTED_PROBLEMS);
    expect(result.moreProblems).toBe(50);
  });
});
