// One cell of an import file, read into its value or the reason it cannot be read. Empty cells
// of optional columns read as null.
import { BEAUFORT_FORCE, CLOUD_COVER_PERCENT, SECTIONS, SIGHTING_COUNT, TEMPERATURE_C, inRange, type Range } from "@/lib/limits/counts";
import { hasControlCharacter, hasLoneSurrogate } from "@/lib/validation/text";

export type Cell<T> = { value: T } | { error: string };

const ok = <T>(value: T): Cell<T> => ({ value });
const fail = (error: string): Cell<never> => ({ error });

/** Text on one line, spaces folded, 1 to max characters. */
export function readLabel(cell: string | undefined, what: string, max: number): Cell<string> {
  const text = (cell ?? "").trim().replace(/[ \t]+/g, " ");
  if (text === "") return fail(`Enter the ${what}.`);
  if (/[\r\n]/.test(text)) return fail(`The ${what} must be on one line.`);
  if (text.length > max) return fail(`The ${what} can be at most ${max} characters.`);
  if (hasControlCharacter(text) || hasLoneSurrogate(text)) return fail(`The ${what} holds characters that cannot be stored.`);
  return ok(text);
}

/** Free text that may be empty (notes): at most max characters. */
export function readOptionalText(cell: string | undefined, max: number): Cell<string | null> {
  const text = (cell ?? "").trim();
  if (text === "") return ok(null);
  if (text.length > max) return fail(`At most ${max} characters.`);
  if (hasControlCharacter(text) || hasLoneSurrogate(text)) return fail("Holds characters that cannot be stored.");
  return ok(text);
}

function isCalendarDay(year: number, month: number, day: number): boolean {
  const d = new Date(Date.UTC(year, month - 1, day));
  return d.getUTCFullYear() === year && d.getUTCMonth() === month - 1 && d.getUTCDate() === day;
}

/** A day as YYYY-MM-DD (ISO 8601's extended calendar date) that exists in the calendar. */
export function readDate(cell: string | undefined): Cell<string> {
  const text = (cell ?? "").trim();
  if (text === "") return fail("Enter the date as YYYY-MM-DD.");
  const m = /^(\d{4})-(\d{2})-(\d{2})$/.exec(text);
  if (!m) return fail(`"${text}" is not a date written as YYYY-MM-DD (such as 2024-06-15).`);
  if (!isCalendarDay(Number(m[1]), Number(m[2]), Number(m[3]))) return fail(`${text} is not a day of the calendar.`);
  return ok(text);
}

/** A time of day as HH:MM or HH:MM:SS (24-hour clock), answered as HH:MM:SS. */
export function readTime(cell: string | undefined, required: boolean): Cell<string | null> {
  const text = (cell ?? "").trim();
  if (text === "") return required ? fail("Enter the time as HH:MM (24-hour clock).") : ok(null);
  const m = /^(\d{1,2}):(\d{2})(?::(\d{2}))?$/.exec(text);
  if (!m || Number(m[1]) > 23 || Number(m[2]) > 59 || Number(m[3] ?? 0) > 59) return fail(`"${text}" is not a time written as HH:MM (such as 10:30).`);
  return ok(`${m[1]!.padStart(2, "0")}:${m[2]}:${m[3] ?? "00"}`);
}

const DECIMAL = /^[+-]?(\d+(\.\d*)?|\.\d+)$/;

/** A decimal number within range; empty is null unless required. */
export function readNumber(cell: string | undefined, range: Range, what: string, options: { integer?: boolean; required?: boolean } = {}): Cell<number | null> {
  const text = (cell ?? "").trim();
  if (text === "") return options.required ? fail(`Enter the ${what}.`) : ok(null);
  if (!DECIMAL.test(text)) return fail(`"${text}" is not a number.`);
  const value = Number(text);
  if (options.integer && !Number.isInteger(value)) return fail(`The ${what} must be a whole number.`);
  if (!inRange(value, range)) return fail(`The ${what} must be between ${range.min} and ${range.max} (it is ${text}).`);
  return ok(value);
}

export const readTemperature = (cell: string | undefined) => readNumber(cell, TEMPERATURE_C, "temperature");
export const readWind = (cell: string | undefined) => readNumber(cell, BEAUFORT_FORCE, "wind force", { integer: true });
export const readCloud = (cell: string | undefined) => readNumber(cell, CLOUD_COVER_PERCENT, "cloud cover", { integer: true });
export const readCount = (cell: string | undefined) => readNumber(cell, SIGHTING_COUNT, "count", { integer: true, required: true }) as Cell<number>;
export const readSectionNumber = (cell: string | undefined) => readNumber(cell, SECTIONS, "section", { integer: true });
/** WGS84 decimal degrees (EPSG:4326): latitude −90 to 90, longitude −180 to 180. */
export const readLatitude = (cell: string | undefined) => readNumber(cell, { min: -90, max: 90 }, "latitude");
export const readLongitude = (cell: string | undefined) => readNumber(cell, { min: -180, max: 180 }, "longitude");

const TRUE = new Set(["yes", "true", "y"]);
const FALSE = new Set(["no", "false", "n"]);

/** yes or no, required: whether a list was complete is never guessed. */
export function readYesNo(cell: string | undefined): Cell<boolean> {
  const word = (cell ?? "").trim().toLowerCase();
  if (TRUE.has(word)) return ok(true);
  if (FALSE.has(word)) return ok(false);
  return fail(word === "" ? "Enter yes or no." : `"${(cell ?? "").trim()}" is not yes or no.`);
}

export const SKY_VALUES = ["clear", "mostly_sunny", "broken_cloud", "mostly_cloudy", "overcast"] as const;
export type Sky = (typeof SKY_VALUES)[number];

export function readSky(cell: string | undefined): Cell<Sky | null> {
  const word = (cell ?? "").trim().toLowerCase().replace(/[\s-]+/g, "_");
  if (word === "") return ok(null);
  return (SKY_VALUES as readonly string[]).includes(word) ? ok(word as Sky) : fail(`"${(cell ?? "").trim()}" is not a sky: use ${SKY_VALUES.map((s) => s.replace(/_/g, " ")).join(", ")}.`);
}
