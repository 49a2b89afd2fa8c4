import { readFileSync } from "node:fs";
import { describe, expect, it } from "vitest";
import { MAX_CHECKLIST_FILE_BYTES } from "@/lib/checklist/limits";
import { problemText } from "@/lib/checklist/problems";
import { readChecklistCsv, utf8Length, type ReadResult } from "@/lib/checklist/read-csv";

const HEADER = "scientific_name,vernacular_name,taxon_rank,tags,sensitive,active_months,synonyms,covers";
const fixture = (name: string) => readFileSync(`tests/fixtures/checklist/${name}`, "utf8");

function refused(result: ReadResult): string[] {
  expect(result.ok).toBe(false);
  return result.ok ? [] : result.problems.map(problemText);
}

describe("reading a checklist file", () => {
  it("reads the good fixture: CRLF line ends, a quoted value holding a comma (RFC 4180 §2, rules 6)", () => {
    const result = readChecklistCsv(fixture("checklist-good.csv"));
    if (!result.ok) throw new Error(result.problems.map(problemText).join("\n"));
    expect(result.columns).toHaveLength(8);
    expect(result.rows.map((r) => r.line)).toEqual([2, 3, 4, 5, 6, 7]);
    expect(result.rows[3]!.cells.vernacular_name).toBe("Wood White, Cryptic Wood White");
    expect(result.rows[3]!.cells.covers).toBe("Leptidea sinapis;Leptidea juvernica");
  });

  it("reads doubled quotes inside a quoted value as one quote (RFC 4180 §2, rule 7)", () => {
    const result = readChecklistCsv(`scientific_name,vernacular_name\nAglais io,"The ""eyed"" one"\n`);
    expect(result.ok && result.rows[0]!.cells.vernacular_name).toBe('The "eyed" one');
  });

  it("skips a byte order mark, blank lines and spreadsheets' trailing rows of empty cells", () => {
    const result = readChecklistCsv(`\uFEFFScientific Name,Vernacular-Name\n\nAglais io,Peacock\n,\n  \n`);
    expect(result).toEqual({ ok: true, columns: ["scientific_name", "vernacular_name"], rows: [{ line: 3, cells: { scientific_name: "Aglais io", vernacular_name: "Peacock" } }] });
  });

  it("numbers a row by the line it starts on when a quoted value spans lines", () => {
    const result = readChecklistCsv(`scientific_name,vernacular_name\n"Aglais\nio",Peacock\nManiola jurtina,Meadow Brown\n`);
    expect(result.ok && result.rows.map((r) => r.line)).toEqual([2, 4]);
  });

  it("allows the optional columns to be left out, in any order", () => {
    const result = readChecklistCsv(`vernacular_name,scientific_name,sensitive\nPeacock,Aglais io,no\n`);
    expect(result.ok && result.columns).toEqual(["vernacular_name", "scientific_name", "sensitive"]);
  });

  it("refuses a missing required column, naming it and the columns expected", () => {
    const [message] = refused(readChecklistCsv(`scientific_name,taxon_rank\nAglais io,species\n`));
    expect(message).toBe(`Line 1: The column vernacular_name is missing. The first line must name the columns: ${HEADER.replaceAll(",", ", ")}.`);
  });

  it("refuses an unknown, a nameless and a repeated column", () => {
    expect(refused(readChecklistCsv(`scientific_name,vernacular_name,synonym,,tags,TAGS\nAglais io,Peacock,,,,\n`))).toEqual([
      expect.stringMatching(/^Line 1: Unknown column "synonym"\. The columns are: scientific_name, /),
      expect.stringMatching(/^Line 1: Column 4 has no name\./),
      "Line 1: The column tags appears twice.",
    ]);
  });

  it("refuses a file separated by semicolons, saying how to fix it", () => {
    expect(refused(readChecklistCsv(`scientific_name;vernacular_name\nAglais io;Peacock\n`))).toEqual([
      "Line 1: Columns must be separated by commas; this file seems to use semicolons or tabs. Save it as comma-separated CSV.",
    ]);
  });

  it("refuses a line with too many or too few values, by line number", () => {
    expect(refused(readChecklistCsv(`scientific_name,vernacular_name\nAglais io,Peacock\nManiola jurtina\nPieris napi,Green-veined White,extra\n`))).toEqual([
      expect.stringMatching(/^Line 3: This line has 1 values but the first line names 2 columns\./),
      expect.stringMatching(/^Line 4: This line has 3 values but the first line names 2 columns\./),
    ]);
  });

  it("refuses a quote that is never closed, at the line where it opens", () => {
    expect(refused(readChecklistCsv(`scientific_name,vernacular_name\nAglais io,Peacock\n\n"Maniola jurtina,Meadow Brown\nPieris napi,Green-veined White\n`))).toEqual([
      expect.stringMatching(/^Line 4: A quoted value is never closed/),
    ]);
  });

  it("refuses a quote in the middle of a value (RFC 4180 §2, rule 5: fields with quotes are enclosed in quotes)", () => {
    expect(refused(readChecklistCsv(`scientific_name,vernacular_name\nAglais io,Peacock\nManiola jurtina,Meadow "Brown"\n`))).toEqual([
      expect.stringMatching(/^Line 3: A quote is in the middle of a value/),
    ]);
  });

  it("refuses an empty file, a file of blank lines and a file with a header only", () => {
    expect(refused(readChecklistCsv(""))).toEqual(["The file is empty."]);
    expect(refused(readChecklistCsv("\n \r\n"))).toEqual(["The file is empty."]);
    expect(refused(readChecklistCsv(`${HEADER}\r\n`))).toEqual(["The file has a first line of column names but no entries."]);
  });

  it("refuses binary content: NUL bytes, or a spreadsheet's own format read as text", () => {
    // An .xlsx file is a ZIP archive: it starts with "PK\x03\x04" (PKWARE's APPNOTE.TXT, §4.3.7, from memory).
    expect(refused(readChecklistCsv("PK\u0003\u0004\u0014\u0000\u0006\u0000"))).toEqual([expect.stringMatching(/^Line 1: The file is not CSV text: it holds binary data/)]);
    expect(refused(readChecklistCsv(`${HEADER}\nAglais io\u0000,Peacock,,,,,,\n`))).toEqual([expect.stringMatching(/^Line 2: The file is not CSV text/)]);
  });

  it("refuses text that was not UTF-8 (the replacement character a browser puts for broken bytes) or holds a lone surrogate", () => {
    // A Latin-1 "é" (0xE9) is not valid UTF-8; decoding it as UTF-8 gives U+FFFD (WHATWG Encoding, "UTF-8 decode").
    const latin1 = new TextDecoder("utf-8").decode(Uint8Array.from([...Buffer.from(`${HEADER}\nAglais io,Paon du jour,,,,,,\nPieris napi,Pi`, "latin1"), 0xe9, 0x72, 0x69, 0x64, 0x65]));
    expect(refused(readChecklistCsv(latin1))).toEqual([expect.stringMatching(/^Line 3: The file is not UTF-8 text\. Save it from your spreadsheet as "CSV UTF-8"/)]);
    expect(refused(readChecklistCsv(`${HEADER}\nAglais io,Pea\uD800cock,,,,,,\n`))).toEqual([expect.stringMatching(/^Line 2: The file is not UTF-8 text/)]);
  });

  it("refuses a file over 10 MB, counting UTF-8 bytes", () => {
    const row = "Aglais io,Peacock\n";
    const big = `scientific_name,vernacular_name\n${row.repeat(Math.ceil(MAX_CHECKLIST_FILE_BYTES / row.length))}`;
    expect(refused(readChecklistCsv(big))).toEqual([expect.stringMatching(/^The file is larger than 10 MB \(10\.0 MB\)\. Split it/)]);
  });

  it("measures UTF-8 as the encoder does (RFC 3629: 1 to 4 bytes a character)", () => {
    for (const text of ["", "Aglais io", "Paon-du-jour é", "蝶", "🦋 butterfly", "a\uD83E\uDD8Bb"]) {
      expect(utf8Length(text)).toBe(new TextEncoder().encode(text).length);
    }
  });
});
