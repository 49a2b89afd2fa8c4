// Dates and times as reviewers read them. Walk dates are calendar days (YYYY-MM-DD) and must not
// shift with the reader's time zone, so they are formatted as UTC days.
const day = new Intl.DateTimeFormat("en-GB", { day: "numeric", month: "short", year: "numeric", timeZone: "UTC" });
const moment = new Intl.DateTimeFormat("en-GB", { day: "numeric", month: "short", year: "numeric", hour: "2-digit", minute: "2-digit" });

export function walkDate(iso: string): string {
  const d = new Date(`${iso}T00:00:00Z`);
  return Number.isNaN(d.getTime()) ? iso : day.format(d);
}

export function when(iso: string): string {
  const d = new Date(iso);
  return Number.isNaN(d.getTime()) ? iso : moment.format(d);
}

/** "10:45" from "10:45:00". */
export const clock = (t: string | null) => (t ? t.slice(0, 5) : null);
