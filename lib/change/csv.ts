// Site-by-species tables from CSV text (RFC 4180: quoted fields with "" escapes and line
// breaks, CRLF or LF, optional UTF-8 byte-order mark). Header row: site column, then one
// column per species; cells are non-negative numbers, an empty cell is 0. Every problem is
// reported with the file, line and column (1-based field number) where it is, because
// people fix these files by hand in a spreadsheet.
import type { SpeciesTable } from "./types";

export class CsvError extends Error {
  override name = "CsvError";
  constructor(
    readonly file: string,
    readonly line: number | null,
    readonly column: number | null,
    readonly detail: string,
  ) {
    super(`${file}: ${line === null ? "" : `line ${line}${column === null ? "" : `, column ${column}`}: `}${detail}`);
  }
}

interface Field {
  readonly text: string;
  readonly line: number;
}

interface Row {
  readonly line: number;
  readonly fields: Field[];
}

/** Splits CSV text into rows of fields, tracking the line each field starts on. */
export function parseCsvRows(text: string, file: string): Row[] {
  const src = text.charCodeAt(0) === 0xfeff ? text.slice(1) : text;
  const rows: Row[] = [];
  let line = 1;
  let fields: Field[] = [];
  let rowLine = 1;
  let i = 0;
  const n = src.length;
  const endRow = () => {
    rows.push({ line: rowLine, fields });
    fields = [];
  };
  while (i <= n) {
    // Start of a field.
    const fieldLine = line;
    const column = fields.length + 1;
    let value = "";
    if (src[i] === '"') {
      i++;
      for (;;) {
        if (i >= n) throw new CsvError(file, fieldLine, column, "quoted field is never closed");
        const ch = src[i]!;
        if (ch === '"') {
          if (src[i + 1] === '"') {
            value += '"';
            i += 2;
            continue;
          }
          i++;
          break;
        }
        if (ch === "\n" || (ch === "\r" && src[i + 1] !== "\n")) line++;
        value += ch;
        i++;
      }
      if (i < n && src[i] !== "," && src[i] !== "\n" && src[i] !== "\r") {
        throw new CsvError(file, line, column, "unexpected text after a closing quote");
      }
    } else {
      const startAt = i;
      while (i < n && src[i] !== "," && src[i] !== "\n" && src[i] !== "\r") {
        if (src[i] === '"') throw new CsvError(file, line, column, 'a quote (") inside an unquoted field; quote the whole field');
        i++;
      }
      value = src.slice(startAt, i);
    }
    fields.push({ text: value, line: fieldLine });
    if (i >= n) {
      endRow();
      break;
    }
    const sep = src[i];
    i++;
    if (sep === ",") continue;
    if (sep === "\r" && src[i] === "\n") i++;
    endRow();
    line++;
    rowLine = line;
    if (i === n) break; // final line break: no empty last row
  }
  return rows;
}

const NUMBER = /^\+?(?:\d+(?:\.\d*)?|\.\d+)(?:[eE][+-]?\d+)?$/;
const NEGATIVE = /^-(?:\d+(?:\.\d*)?|\.\d+)(?:[eE][+-]?\d+)?$/;

function isBlank(row: Row): boolean {
  return row.fields.every((f) => f.text.trim() === "");
}

/** Parses a site-by-species CSV table; throws CsvError naming file, line and column. */
export function parseSpeciesTableCsv(text: string, file: string): SpeciesTable {
  const rows = parseCsvRows(text, file).filter((row) => !isBlank(row));
  const header = rows[0];
  if (header === undefined) throw new CsvError(file, null, null, "the file is empty (expected a header row: site, then one column per species)");
  if (header.fields.length < 2) {
    throw new CsvError(file, header.line, 2, "the header has no species columns (expected: site, then one column per species)");
  }
  const species: string[] = [];
  const speciesColumn = new Map<string, number>();
  header.fields.slice(1).forEach((f, k) => {
    const name = f.text.trim();
    const column = k + 2;
    if (name === "") throw new CsvError(file, f.line, column, "empty species name in the header");
    const seen = speciesColumn.get(name);
    if (seen !== undefined) throw new CsvError(file, f.line, column, `duplicate species "${name}" (also column ${seen})`);
    speciesColumn.set(name, column);
    species.push(name);
  });

  const sites: string[] = [];
  const values: Float64Array[] = [];
  const siteLine = new Map<string, number>();
  for (const row of rows.slice(1)) {
    if (row.fields.length !== header.fields.length) {
      const column = Math.min(row.fields.length, header.fields.length) + 1;
      throw new CsvError(file, row.line, column, `row has ${row.fields.length} fields but the header has ${header.fields.length}`);
    }
    const site = row.fields[0]!.text.trim();
    if (site === "") throw new CsvError(file, row.line, 1, "empty site id");
    const first = siteLine.get(site);
    if (first !== undefined) throw new CsvError(file, row.line, 1, `duplicate site "${site}" (first on line ${first})`);
    siteLine.set(site, row.line);
    const rowValues = new Float64Array(species.length);
    row.fields.slice(1).forEach((f, k) => {
      rowValues[k] = parseCell(f, file, k + 2, site, species[k]!);
    });
    sites.push(site);
    values.push(rowValues);
  }
  if (sites.length === 0) throw new CsvError(file, header.line, null, "the file has a header but no site rows");
  return { sites, species, values };
}

function parseCell(field: Field, file: string, column: number, site: string, species: string): number {
  const text = field.text.trim();
  if (text === "") return 0;
  const where = `(site "${site}", species "${species}")`;
  if (NEGATIVE.test(text)) {
    const v = Number(text);
    if (v === 0) return 0;
    throw new CsvError(file, field.line, column, `negative number ${text} ${where}; values must be 0 or more`);
  }
  if (!NUMBER.test(text)) throw new CsvError(file, field.line, column, `"${text}" is not a number ${where}`);
  const v = Number(text);
  if (!Number.isFinite(v)) throw new CsvError(file, field.line, column, `${text} is too large ${where}`);
  return v;
}

/** Quotes a field for CSV output when it needs it. */
export function csvField(value: string): string {
  return /[",\r\n]/.test(value) || value !== value.trim() ? `"${value.replace(/"/g, '""')}"` : value;
}
