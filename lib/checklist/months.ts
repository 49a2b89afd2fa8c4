// Usual months of activity: the CSV's spelling ("4-9", "4;5;6", "11-2" across the new year) and
// the short form pages show ("Apr–Sep").

const SHORT = ["Jan", "Feb", "Mar", "Apr", "May", "Jun", "Jul", "Aug", "Sep", "Oct", "Nov", "Dec"] as const;

export type MonthsResult = { months: number[] } | { error: string };

/** Reads `4-9`, `4;5;6`, `3-5;9` or `11-2` (a run across the new year); empty means none. */
export function parseMonths(cell: string): MonthsResult {
  const set = new Set<number>();
  const text = cell.trim();
  if (text === "") return { months: [] };
  for (const raw of text.split(";")) {
    const part = raw.trim();
    const run = /^(\d{1,2})\s*[-–]\s*(\d{1,2})$/.exec(part);
    const single = /^\d{1,2}$/.test(part) ? [part, part] : null;
    const ends = run ? [run[1]!, run[2]!] : single;
    if (!ends) return { error: `"${part}" is not a month or a run of months: write months as numbers, e.g. 4-9 or 4;5;6.` };
    const [from, to] = ends.map(Number) as [number, number];
    for (const m of [from, to]) {
      if (m < 1 || m > 12) return { error: `${m} is not a month: months are 1 (January) to 12 (December).` };
    }
    // 11-2 runs November to February.
    for (let m = from, steps = 0; steps < 12; m = (m % 12) + 1, steps++) {
      set.add(m);
      if (m === to) break;
    }
  }
  return { months: [...set].sort((a, b) => a - b) };
}

/** Months as runs for reading: [4,5,6,7,8,9] is "Apr–Sep", [1,2,11,12] is "Nov–Feb", [] is "". */
export function formatMonths(months: readonly number[]): string {
  const on = new Set(months.filter((m) => m >= 1 && m <= 12));
  if (on.size === 0) return "";
  if (on.size === 12) return "all year";
  // Start each run where the month before is off, so a run across the new year stays whole.
  const runs: string[] = [];
  for (let m = 1; m <= 12; m++) {
    const before = m === 1 ? 12 : m - 1;
    if (!on.has(m) || on.has(before)) continue;
    let end = m;
    while (on.has((end % 12) + 1)) end = (end % 12) + 1;
    runs.push(end === m ? SHORT[m - 1]! : `${SHORT[m - 1]}–${SHORT[end - 1]}`);
  }
  return runs.join(", ");
}
