/** One reason a checklist file is refused: where (line and column when known) and why. */
export type ImportProblem = { line: number | null; column: string | null; reason: string };

export const problem = (line: number | null, column: string | null, reason: string): ImportProblem => ({ line, column, reason });

/** "Line 4, column active_months: …", "Line 1: …" or the reason alone for the whole file. */
export function problemText(p: ImportProblem): string {
  if (p.line === null) return p.reason;
  return p.column === null ? `Line ${p.line}: ${p.reason}` : `Line ${p.line}, column ${p.column}: ${p.reason}`;
}

/** Problems in file order: by line, the file's own problems first. */
export function sortProblems(problems: ImportProblem[]): ImportProblem[] {
  return [...problems].sort((a, b) => (a.line ?? 0) - (b.line ?? 0));
}
