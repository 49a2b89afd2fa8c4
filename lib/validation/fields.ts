import { z } from "zod";
import { hasControlCharacter, hasLoneSurrogate, TEXT_PROBLEMS } from "./text";

// zod fields shared by every edge that stores what people type or send. Each refuses, with a
// field message, the values PostgreSQL would reject inside a write (which would otherwise fail
// the whole request with a 500): NUL and unpaired surrogates in text, years it cannot hold.

/**
 * Free text, trimmed, at most `max` characters, without control characters (tab and line
 * breaks are allowed) or broken characters. Pass `base` to keep a custom "not a string" message.
 */
export function safeText(max: number, base: z.ZodString = z.string()) {
  return base
    .trim()
    .max(max, { message: `At most ${max} characters.` })
    .refine((text) => !hasControlCharacter(text), { message: TEXT_PROBLEMS.control })
    .refine((text) => !hasLoneSurrogate(text), { message: TEXT_PROBLEMS.brokenCharacter });
}

/** Our choice: earlier than this is a typing slip, not a record (historical notebooks are not entered here). */
export const EARLIEST_RECORD_DATE = "1900-01-01";

/**
 * The latest date a record can carry: tomorrow by the server's UTC clock. A phone's local date
 * can run up to 14 hours ahead of UTC (UTC+14), so "today on the phone" is never later than this.
 */
export function latestRecordDate(now: Date = new Date()): string {
  return new Date(now.getTime() + 24 * 60 * 60 * 1000).toISOString().slice(0, 10);
}

/** A calendar day of a record (YYYY-MM-DD), from 1900-01-01 to tomorrow. */
export function recordDate(formatMessage: string) {
  return z.iso.date({ message: formatMessage }).superRefine((day, ctx) => {
    const latest = latestRecordDate();
    if (day < EARLIEST_RECORD_DATE || day > latest) {
      ctx.addIssue({ code: "custom", input: day, message: `Must be a date between ${EARLIEST_RECORD_DATE} and ${latest}.` });
    }
  });
}

const EARLIEST_INSTANT = Date.parse("1900-01-01T00:00:00Z");
const END_OF_LATEST_DAY = Date.parse("2101-01-01T00:00:00Z");
export const INSTANT_RANGE_MESSAGE = "Must be a time between 1900-01-01 and 2100-12-31.";

/**
 * An ISO 8601 timestamp with Z or an offset, between 1900-01-01 and 2100-12-31 (UTC): wide
 * enough for any real phone clock, and inside what PostgreSQL's timestamptz and JavaScript's
 * Date both read the same way (year 0000 is refused by PostgreSQL, for one).
 */
export function plausibleInstant(formatMessage: string) {
  return z.iso.datetime({ offset: true, message: formatMessage }).refine(
    (stamp) => {
      const at = Date.parse(stamp);
      return at >= EARLIEST_INSTANT && at < END_OF_LATEST_DAY;
    },
    { message: INSTANT_RANGE_MESSAGE },
  );
}
