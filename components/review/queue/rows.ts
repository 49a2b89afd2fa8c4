import type { QueueRow } from "@/lib/review/contract";
import type { StatusFilter } from "@/lib/review/queue-filter";
import { warningLabel } from "@/lib/review/warnings";
import { ANSWERED, CORRECTED, statusForReviewer } from "@/lib/review/words";

// Pure helpers for the queue's rows: the volunteer's tallies, what a row says, and whether a row
// still belongs in the list it was shown in.

/** Adjacent rows that are entries of one tally (same walk, species and section), or a row alone. */
export type RowGroup = { key: string; tally: QueueRow["tally"] | null; rows: QueueRow[] };

const tallyKey = (r: QueueRow) => `${r.walk.id}|${r.species.id}|${r.section ?? ""}`;

/**
 * Groups adjacent entries of the same tally. Sorted by date they arrive together; sorted some other
 * way they may not, and each entry then stands alone with its tally's sum beside its count.
 */
export function groupTallies(rows: readonly QueueRow[]): RowGroup[] {
  const groups: RowGroup[] = [];
  for (const row of rows) {
    const last = groups.at(-1);
    if (row.tally.entries > 1 && last?.tally && last.key === tallyKey(row)) last.rows.push(row);
    else groups.push({ key: row.tally.entries > 1 ? tallyKey(row) : row.id, tally: row.tally.entries > 1 ? row.tally : null, rows: [row] });
  }
  // A "group" of one entry shown alone is not a group on screen.
  return groups.map((g) => (g.rows.length > 1 ? g : { ...g, key: g.rows[0]!.id, tally: null }));
}

/** Whether a sighting still awaits a decision (so it can be confirmed, asked about, set aside or corrected). */
export const isUndecided = (r: Pick<QueueRow, "status">) => r.status === "pending" || r.status === "queried";

/** Whether a row belongs to the status filter it was listed under (after an action it may not). */
export function matchesStatus(r: Pick<QueueRow, "status" | "answered">, filter: StatusFilter): boolean {
  switch (filter) {
    case "any":
      return true;
    case "waiting":
      return isUndecided(r);
    case "answered":
      return r.answered && isUndecided(r);
    default:
      return r.status === filter;
  }
}

/** The status in words, with its marks ("Answered", "Corrected"). */
export function statusWords(r: Pick<QueueRow, "status" | "answered" | "corrected">): { status: string; marks: string[] } {
  const marks = [r.answered ? ANSWERED : null, r.corrected ? CORRECTED : null].filter((m): m is string => m !== null);
  return { status: statusForReviewer[r.status], marks };
}

/** The row's warnings in words: the sighting's own, then the walk's when it broke the walk rules. */
export const warningWords = (r: Pick<QueueRow, "warnings" | "walk">): string[] => [...r.warnings.map((w) => warningLabel[w]), ...(r.walk.breaches.length > 0 ? [warningLabel.walk_rules] : [])];

export const hasWarnings = (r: Pick<QueueRow, "warnings" | "walk">) => warningWords(r).length > 0;

/** "Section 4", or nothing recorded. */
export const sectionWords = (section: number | null) => (section === null ? "no section" : `section ${section}`);
