import { parse, type CsvError } from "csv-parse/sync";
import { CHECKLIST_COLUMNS, REQUIRED_COLUMNS, isChecklistColumn, normaliseHeader, type ChecklistColumn } from "./columns";
import { MAX_CHECKLIST_FILE_BYTES } from "./limits";
import { problem, type ImportProblem } from "./problems";

/** One entry's line of the file: the line it starts on and its cells by column. */
export type CsvRow = { line: number; cells: Partial<Record<ChecklistColumn, string>> };

export type ReadResult = { ok: true; columns: ChecklistColumn[]; rows: CsvRow[] } | { ok: false; problems: ImportProblem[] };

const MB = (MAX_CHECKLIST_FILE_BYTES / (1024 * 1024)).toLocaleString("en-GB");

/** UTF-8 length without copying the text (a 10 MB file need not be encoded again to be measured). */
export function utf8Length(text: string): number {
  let bytes = 0;
  for (let i = 0; i < text.length; i++) {
    const c = text.charCodeAt(i);
    if (c < 0x80) bytes += 1;
    else if (c < 0x800) bytes += 2;
    else if (c >= 0xd800 && c <= 0xdbff && i + 1 < text.length) {
      bytes += 4;
      i++;
    } else bytes += 3;
  }
  return bytes;
}

const lineOf = (text: string, index: number) => text.slice(0, index).split("\n").length;

// A browser reading a file that is not UTF-8 (File.text()) puts U+FFFD where bytes were broken;
// a JSON body can also carry a lone surrogate, which has no UTF-8 form at all.
const NOT_UTF8 = /\uFFFD|[\uD800-\uDBFF](?![\uDC00-\uDFFF])|(?<![\uD800-\uDBFF])[\uDC00-\uDFFF]/;
// Text files hold no control characters but tab and line breaks: NUL and the rest mean binary data.
const BINARY = /[\u0000-\u0008\u000B\u000C\u000E-\u001F\u007F]/;

/** Whole-file checks: size, encoding, binary content, emptiness. */
function fileProblems(text: string): ImportProblem | null {
  const bytes = utf8Length(text);
  if (bytes > MAX_CHECKLIST_FILE_BYTES) {
    return problem(null, null, `The file is larger than ${MB} MB (${(bytes / (1024 * 1024)).toFixed(1)} MB). Split it into smaller files and import them one after another.`);
  }
  const broken = NOT_UTF8.exec(text);
  if (broken) {
    return problem(lineOf(text, broken.index), null, "The file is not UTF-8 text. Save it from your spreadsheet as \"CSV UTF-8\" and try again.");
  }
  const binary = BINARY.exec(text);
  if (binary) {
    return problem(lineOf(text, binary.index), null, "The file is not CSV text: it holds binary data (such as a spreadsheet's own format or an image). Save it as CSV and try again.");
  }
  if (text.trim() === "") return problem(null, null, "The file is empty.");
  return null;
}

function headerProblems(cells: string[]): { columns: ChecklistColumn[]; problems: ImportProblem[] } {
  const problems: ImportProblem[] = [];
  const columns: ChecklistColumn[] = [];
  if (cells.length === 1 && /[;\t]/.test(cells[0]!)) {
    return { columns, problems: [problem(1, null, "Columns must be separated by commas; this file seems to use semicolons or tabs. Save it as comma-separated CSV.")] };
  }
  const known = CHECKLIST_COLUMNS.join(", ");
  cells.forEach((cell, i) => {
    const name = normaliseHeader(cell);
    if (name === "") problems.push(problem(1, null, `Column ${i + 1} has no name. The columns are: ${known}.`));
    else if (!isChecklistColumn(name)) problems.push(problem(1, null, `Unknown column "${cell.trim()}". The columns are: ${known}.`));
    else if (columns.includes(name)) problems.push(problem(1, null, `The column ${name} appears twice.`));
    else columns.push(name);
  });
  for (const required of REQUIRED_COLUMNS) {
    if (!columns.includes(required)) problems.push(problem(1, null, `The column ${required} is missing. The first line must name the columns: ${known}.`));
  }
  return { columns, problems };
}

/** A parser error at a line, in words (RFC 4180 §2 for the quoting rules). */
function syntaxProblem(error: CsvError, text: string, lastRecordEnd: number): ImportProblem {
  const lines = Number(error.lines) || lastRecordEnd + 1;
  if (error.code === "CSV_QUOTE_NOT_CLOSED") {
    // The open quote starts the first non-empty line after the last whole record.
    const all = text.split("\n");
    let start = lastRecordEnd + 1;
    while (start <= all.length && all[start - 1]!.trim() === "") start++;
    return problem(start, null, "A quoted value is never closed: every value that starts with \" must end with \" (write \"\" for a quote inside it).");
  }
  if (error.code === "INVALID_OPENING_QUOTE" || error.code === "CSV_INVALID_CLOSING_QUOTE") {
    return problem(lines, null, "A quote is in the middle of a value. Put the whole value in quotes and write \"\" for each quote inside it.");
  }
  return problem(lines, null, "This line cannot be read as CSV.");
}

/**
 * Reads a checklist file: comma-separated, quoted as RFC 4180 says, UTF-8 with or without a byte
 * order mark, any line ending. Blank lines (or lines of empty cells, as spreadsheets leave at the
 * end) are skipped. Each row keeps the line it starts on, for messages.
 */
export function readChecklistCsv(text: string): ReadResult {
  const fileProblem = fileProblems(text);
  if (fileProblem) return { ok: false, problems: [fileProblem] };
  const normalised = text.replace(/^\uFEFF/, "").replace(/\r\n?/g, "\n");
  let lastRecordEnd = 0;
  let records: { record: string[]; info: { lines: number } }[];
  try {
    records = parse(normalised, {
      info: true,
      relax_column_count: true,
      skip_empty_lines: true,
      on_record: (record, context) => {
        lastRecordEnd = context.lines;
        return record;
      },
      // With `info`, each record comes as { record, info }.
    }) as unknown as { record: string[]; info: { lines: number } }[];
  } catch (error) {
    return { ok: false, problems: [syntaxProblem(error as CsvError, normalised, lastRecordEnd)] };
  }
  const [header, ...body] = records;
  if (!header) return { ok: false, problems: [problem(null, null, "The file is empty.")] };
  const { columns, problems } = headerProblems(header.record);
  if (problems.length) return { ok: false, problems };

  const rows: CsvRow[] = [];
  for (const { record, info } of body) {
    // csv-parse counts lines to a record's end; a quoted value can hold line breaks.
    const line = info.lines - record.reduce((n, cell) => n + (cell.match(/\n/g)?.length ?? 0), 0);
    if (record.every((cell) => cell.trim() === "")) continue;
    const extra = record.slice(columns.length);
    if (record.length < columns.length || extra.some((cell) => cell.trim() !== "")) {
      problems.push(problem(line, null, `This line has ${record.length} values but the first line names ${columns.length} columns. Check for a missing or extra comma, or a value with a comma that is not in quotes.`));
      continue;
    }
    const cells: CsvRow["cells"] = {};
    columns.forEach((column, i) => (cells[column] = record[i]!));
    rows.push({ line, cells });
  }
  if (problems.length) return { ok: false, problems };
  if (rows.length === 0) return { ok: false, problems: [problem(null, null, "The file has a first line of column names but no entries.")] };
  return { ok: true, columns, rows };
}
