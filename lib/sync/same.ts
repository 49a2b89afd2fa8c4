// Field-by-field comparison of an incoming row with the stored one, so a resend can be
// recognised as "unchanged" and cost no write.

type Comparable = string | number | boolean | Date | null | undefined;

function normalise(value: Comparable): string | number | boolean | null {
  if (value === undefined || value === null) return null;
  if (value instanceof Date) return value.getTime();
  return value;
}

export function sameFields<K extends string>(keys: readonly K[], incoming: { [P in K]?: Comparable }, stored: { [P in K]?: Comparable }): boolean {
  return keys.every((k) => normalise(incoming[k]) === normalise(stored[k]));
}

/** Postgres hands `time` back as HH:MM:SS; the phone may send HH:MM. */
export function clockWithSeconds(value: string): string;
export function clockWithSeconds(value: string | null | undefined): string | null;
export function clockWithSeconds(value: string | null | undefined): string | null {
  if (value == null) return null;
  return value.length === 5 ? `${value}:00` : value;
}

/** True when the incoming edit was made before the one the server holds. */
export function olderThanServer(incoming: Date, stored: Date | null): boolean {
  return stored !== null && incoming.getTime() < stored.getTime();
}
