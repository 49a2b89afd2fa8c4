import { describe, expect, it } from "vitest";
import { CsvError, csvField, parseCsvRows, parseSpeciesTableCsv } from "../../../lib/change/csv";

const parse = (text: string) => parseSpeciesTableCsv(text, "T1.csv");
const values = (text: string) => parse(text).values.map((row) => Array.from(row));

function errorOf(text: string): CsvError {
  try {
    parse(text);
  } catch (error) {
    if (error instanceof CsvError) return error;
    throw error;
  }
  throw new Error("expected a CsvError");
}

describe("CSV parsing", () => {
  it("reads header, sites and numbers; empty cells are 0", () => {
    const t = parse("site,Turdus merula,Erithacus rubecula\nT01,3,\nT02,0.5,2\n");
    expect(t.sites).toEqual(["T01", "T02"]);
    expect(t.species).toEqual(["Turdus merula", "Erithacus rubecula"]);
    expect(t.values.map((r) => Array.from(r))).toEqual([[3, 0], [0.5, 2]]);
  });

  it("handles a byte-order mark, CRLF, quoted fields with commas, quotes and line breaks", () => {
    const t = parse('\uFEFFsite,"Parus major, s.l.","say ""hi"""\r\n"T,01","1","2e1"\r\n"multi\r\nline",,7\r\n');
    expect(t.species).toEqual(["Parus major, s.l.", 'say "hi"']);
    expect(t.sites).toEqual(["T,01", "multi\r\nline"]);
    expect(t.values.map((r) => Array.from(r))).toEqual([[1, 20], [0, 7]]);
  });

  it("counts lines across quoted line breaks when reporting errors", () => {
    const e = errorOf('site,a\n"two\nlines",1\nT2,x\n');
    expect([e.line, e.column]).toEqual([4, 2]);
  });

  it("skips blank lines and trims spaces around cells", () => {
    expect(values("site,a,b\n\n T1 , 1 ,2\n,,\n\nT2,,3")).toEqual([[1, 2], [0, 3]]);
  });

  it.each([
    ["site,a\nT1,abc\n", 2, 2, /"abc" is not a number \(site "T1", species "a"\)/],
    ["site,a,b\nT1,1,-2\n", 2, 3, /negative number -2/],
    ["site,a\nT1,1\nT1,2\n", 3, 1, /duplicate site "T1" \(first on line 2\)/],
    ["site,a,b,a\nT1,1,2,3\n", 1, 4, /duplicate species "a" \(also column 2\)/],
    ["site,a,b\nT1,1\n", 2, 3, /row has 2 fields but the header has 3/],
    ["site,a,b\nT1,1,2,3\n", 2, 4, /row has 4 fields but the header has 3/],
    ["site,a\n,1\n", 2, 1, /empty site id/],
    ["site,a,\nT1,1,2\n", 1, 3, /empty species name/],
    ['site,a\nT1,"1\n', 2, 2, /never closed/],
    ['site,a\nT1,"1"x\n', 2, 2, /after a closing quote/],
    ['site,a\nT1,1"2\n', 2, 2, /inside an unquoted field/],
    ["site,a\nT1,1e999\n", 2, 2, /too large/],
    ["site,a\nT1,0x10\n", 2, 2, /not a number/],
    ["site,a\nT1,NaN\n", 2, 2, /not a number/],
  ])("reports %j at line %i, column %i", (text, line, column, message) => {
    const e = errorOf(text);
    expect(e.line).toBe(line);
    expect(e.column).toBe(column);
    expect(e.message).toMatch(message);
    expect(e.message).toContain(`T1.csv: line ${line}, column ${column}: `);
  });

  it("reports empty files and files without sites or species", () => {
    expect(errorOf("").message).toMatch(/T1.csv: the file is empty/);
    expect(errorOf("\uFEFF\r\n\n").message).toMatch(/the file is empty/);
    expect(errorOf("site,a,b\n").message).toMatch(/line 1: the file has a header but no site rows/);
    expect(errorOf("site\nT1\n").message).toMatch(/no species columns/);
  });

  it("accepts -0 as zero and a lone CR as a line break", () => {
    expect(values("site,a\rT1,-0\r")).toEqual([[0]]);
  });

  it("splits rows without a trailing line break", () => {
    expect(parseCsvRows("a,b\nc", "f").map((r) => r.fields.map((f) => f.text))).toEqual([["a", "b"], ["c"]]);
  });

  it("quotes output fields only when needed", () => {
    expect(csvField("T01")).toBe("T01");
    expect(csvField('a,"b"')).toBe('"a,""b"""');
    expect(parseCsvRows([csvField('x,"y"\nz'), csvField("plain")].join(","), "f")[0]!.fields.map((f) => f.text)).toEqual(['x,"y"\nz', "plain"]);
  });
});
