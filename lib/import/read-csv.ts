import { Readable } from "node:stream";
import { parse, type CsvError } from "csv-parse";
import { fileLabel, normaliseHeader, type ImportFileKind } from "./columns";
import type { ProblemList } from "./problems";

/** One line of a file: the line it starts on and its cells by column name. */
export type CsvLine<C extends string> = { line: number; cells: Partial<Record<C, string>> };

// Small slices, so that csv-parse (a transform stream) emits records as the loop takes them
// instead of parsing a whole 10 MB chunk into records at once.
const SLICE = 64 * 1024;
function* slices(bytes: Uint8Array) {
  for (let at = 0; at < bytes.length; at += SLICE) yield bytes.subarray(at, at + SLICE);
}

const breaks = (cell: string) => cell.match(/\r\n|\r|\n/g)?.length ?? 0;
const crlfs = (cell: string) => cell.match(/\r\n/g)?.length ?? 0;

function syntaxReason(error: CsvError): string {
  if (error.code === "CSV_QUOTE_NOT_CLOSED") return "A quoted value is never closed: every value that starts with \" must end with \" (write \"\" for a quote inside it).";
  if (error.code === "INVALID_OPENING_QUOTE" || error.code === "CSV_INVALID_CLOSING_QUOTE") return "A quote is in the middle of a value. Put the whole value in quotes and write \"\" for each quote inside it.";
  return "This line cannot be read as CSV.";
}

type Spec<C extends string> = { file: ImportFileKind; columns: readonly C[]; required: readonly C[] };

/**
 * Reads a CSV file as a stream (comma-separated, quoted as RFC 4180 says, UTF-8 with or without
 * a byte order mark, any line ending), yielding one line at a time. The header is checked first:
 * unknown, repeated or missing columns are problems and no line is yielded. Blank lines are
 * skipped; a line with the wrong number of values is a problem and is not yielded. A syntax error
 * ends the file with a problem at its line. Nothing but the current record is held.
 */
export async function* readCsvLines<C extends string>(bytes: Uint8Array, spec: Spec<C>, problems: ProblemList): AsyncGenerator<CsvLine<C>> {
  const label = fileLabel[spec.file];
  const parser = Readable.from(slices(bytes)).pipe(
    parse({ bom: true, info: true, relax_column_count: true, skip_empty_lines: true, record_delimiter: ["\r\n", "\n", "\r"] }),
  );
  let columns: C[] | null = null;
  // csv-parse counts a CRLF inside a quoted value as two lines; this undoes it for later lines.
  let drift = 0;
  let lastLine = 1;
  try {
    for await (const { record, info } of parser as AsyncIterable<{ record: string[]; info: { lines: number } }>) {
      const inCells = record.reduce((n, c) => n + breaks(c), 0);
      const crlfInCells = record.reduce((n, c) => n + crlfs(c), 0);
      const line = info.lines - drift - crlfInCells - inCells;
      drift += crlfInCells;
      lastLine = line;
      if (columns === null) {
        columns = headerOf(record, spec, problems);
        if (columns === null) return;
        continue;
      }
      if (record.every((cell) => cell.trim() === "")) continue;
      const extra = record.slice(columns.length);
      if (record.length < columns.length || extra.some((cell) => cell.trim() !== "")) {
        problems.add(spec.file, line, null, `This line has ${record.length} values but the first line names ${columns.length} columns. Check for a missing or extra comma, or a value with a comma that is not in quotes.`);
        continue;
      }
      const cells: Partial<Record<C, string>> = {};
      columns.forEach((column, i) => (cells[column] = record[i]!));
      yield { line, cells };
    }
  } catch (error) {
    const csvError = error as CsvError;
    if (typeof csvError.code !== "string" || !(csvError.code.startsWith("CSV_") || csvError.code.startsWith("INVALID_"))) throw error;
    problems.add(spec.file, Number(csvError.lines) || lastLine + 1, null, syntaxReason(csvError));
    return;
  } finally {
    parser.destroy();
  }
  if (columns === null) problems.add(spec.file, null, null, `The ${label} is empty: its first line must name the columns (${spec.columns.join(", ")}).`);
}

/** The file's columns in order, or null with every problem of its first line. */
function headerOf<C extends string>(cells: string[], spec: Spec<C>, problems: ProblemList): C[] | null {
  const label = fileLabel[spec.file];
  const known = spec.columns.join(", ");
  if (cells.length === 1 && /[;\t]/.test(cells[0]!)) {
    problems.add(spec.file, 1, null, `Columns must be separated by commas; this ${label} seems to use semicolons or tabs. Save it as comma-separated CSV.`);
    return null;
  }
  const before = problems.total;
  const columns: C[] = [];
  cells.forEach((cell, i) => {
    const name = normaliseHeader(cell);
    if (name === "") problems.add(spec.file, 1, null, `Column ${i + 1} has no name. The columns of the ${label} are: ${known}.`);
    else if (!(spec.columns as readonly string[]).includes(name)) problems.add(spec.file, 1, cell.trim(), `Unknown column "${cell.trim()}". The columns of the ${label} are: ${known}.`);
    else if (columns.includes(name as C)) problems.add(spec.file, 1, name, `The column ${name} appears twice.`);
    else columns.push(name as C);
  });
  for (const required of spec.required) {
    if (!columns.includes(required)) problems.add(spec.file, 1, required, `The column ${required} is missing. The first line of the ${label} must name at least: ${spec.required.join(", ")}.`);
  }
  return problems.total > before ? null : columns;
}
