// Week arithmetic on calendar days (YYYY-MM-DD), pure and dependency-free: the sync (a weather
// report's week), the phone (this week's report) and the organiser's effort grid share it.
// Weeks start on Monday, as ISO 8601 weeks do; days are handled as UTC dates so no time zone or
// daylight-saving change can shift them.

const DAY_MS = 24 * 60 * 60 * 1000;

const toDate = (day: string) => new Date(`${day}T00:00:00Z`);
const toDay = (date: Date) => date.toISOString().slice(0, 10);

/** The day `n` days after `day` (before it when negative). */
export function addDays(day: string, n: number): string {
  return toDay(new Date(toDate(day).getTime() + n * DAY_MS));
}

/** ISO weekday: 1 = Monday … 7 = Sunday. */
export function isoWeekday(day: string): number {
  return ((toDate(day).getUTCDay() + 6) % 7) + 1;
}

/** The Monday that starts `day`'s week (the day itself when it is a Monday). */
export function mondayOf(day: string): string {
  return addDays(day, 1 - isoWeekday(day));
}

/** Whole days from `from` to `to` (negative when `to` is earlier). */
export function daysBetween(from: string, to: string): number {
  return Math.round((toDate(to).getTime() - toDate(from).getTime()) / DAY_MS);
}

/**
 * The ISO 8601 week of a day: the week belongs to the year that holds its Thursday, so the first
 * days of January can be in the previous year's last week and the last days of December in next
 * year's week 1.
 */
export function isoWeek(day: string): { year: number; week: number } {
  const thursday = addDays(mondayOf(day), 3);
  const year = Number(thursday.slice(0, 4));
  const week = Math.floor(daysBetween(`${year}-01-01`, thursday) / 7) + 1;
  return { year, week };
}

/** The Mondays of every week that holds a day of [startsOn, endsOn], in order (a mid-week start still gets its week). */
export function weekStartsBetween(startsOn: string, endsOn: string): string[] {
  const weeks: string[] = [];
  for (let monday = mondayOf(startsOn); monday <= endsOn; monday = addDays(monday, 7)) weeks.push(monday);
  return weeks;
}

/** The phone's local date today, YYYY-MM-DD (the volunteer's calendar day, not UTC's). */
export function localToday(now: Date = new Date()): string {
  const pad = (n: number) => String(n).padStart(2, "0");
  return `${now.getFullYear()}-${pad(now.getMonth() + 1)}-${pad(now.getDate())}`;
}
