import { isUtf8 } from "node:buffer";
import { MAX_IMPORT_FILE_BYTES } from "./limits";

const MB = (MAX_IMPORT_FILE_BYTES / (1024 * 1024)).toLocaleString("en-GB");

// Magic numbers of what spreadsheets are most often saved as instead of CSV: a zip container
// (.xlsx, .ods: "PK\x03\x04", PKWARE's APPNOTE §4.3.7) and PDF ("%PDF-", ISO 32000-1 §7.5.2).
const MAGIC: { bytes: number[]; what: string }[] = [
  { bytes: [0x50, 0x4b, 0x03, 0x04], what: "a zip archive (such as a spreadsheet's own .xlsx or .ods format)" },
  { bytes: [0x25, 0x50, 0x44, 0x46, 0x2d], what: "a PDF document" },
  // The OLE2 compound file of old .xls workbooks (MS-CFB §2.2).
  { bytes: [0xd0, 0xcf, 0x11, 0xe0, 0xa1, 0xb1, 0x1a, 0xe1], what: "an old-style Excel workbook (.xls)" },
];

const startsWith = (bytes: Uint8Array, magic: number[]) => magic.every((b, i) => bytes[i] === b);

/** Whether a file of this many bytes is over the cap (the route answers 413 for it). */
export const overFileCap = (bytes: number) => bytes > MAX_IMPORT_FILE_BYTES;

export const fileCapMessage = (label: string, bytes: number) =>
  `The ${label} is larger than ${MB} MB (${(bytes / (1024 * 1024)).toFixed(1)} MB). Split the season into smaller files and import them one after another.`;

/**
 * Whether the bytes are CSV text at all, before any parsing: not a zip or PDF, UTF-8 (a byte
 * order mark is fine), no NUL or other control characters but tab and line breaks. Answers the
 * reason it is not, or null. Reads the bytes without decoding them into a string.
 */
export function notTextReason(bytes: Uint8Array, label: string): string | null {
  for (const m of MAGIC) if (startsWith(bytes, m.bytes)) return `The ${label} is not a CSV file: it is ${m.what}. Save it from your spreadsheet as "CSV UTF-8" and choose it again.`;
  if (!isUtf8(bytes)) return `The ${label} is not UTF-8 text. Save it from your spreadsheet as "CSV UTF-8" and choose it again.`;
  for (let i = 0; i < bytes.length; i++) {
    const b = bytes[i]!;
    // C0 controls but tab, LF and CR, and DEL; multi-byte UTF-8 sequences never hold these bytes.
    if ((b < 0x20 && b !== 0x09 && b !== 0x0a && b !== 0x0d) || b === 0x7f) {
      return `The ${label} is not CSV text: it holds binary data (a control character such as NUL). Save it as CSV and choose it again.`;
    }
  }
  return null;
}
