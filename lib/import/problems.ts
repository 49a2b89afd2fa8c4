import type { ImportFileKind } from "./columns";
import { MAX_LISTED_PROBLEMS } from "./limits";

/** One reason an import is refused: which file, where (line and column when known) and why. */
export type LineProblem = { file: ImportFileKind; line: number | null; column: string | null; reason: string };

/** Problems as they are found: the first MAX_LISTED_PROBLEMS kept, the rest only counted. */
export class ProblemList {
  readonly listed: LineProblem[] = [];
  total = 0;

  add(file: ImportFileKind, line: number | null, column: string | null, reason: string): void {
    this.total++;
    if (this.listed.length < MAX_LISTED_PROBLEMS) this.listed.push({ file, line, column, reason });
  }

  get more(): number {
    return this.total - this.listed.length;
  }
}

/** "walks file, line 4, column date: …" */
export function lineProblemText(p: LineProblem): string {
  const where = [p.file === "walks" ? "Walks file" : "Sightings file", p.line === null ? null : `line ${p.line}`, p.column === null ? null : `column ${p.column}`].filter(Boolean).join(", ");
  return `${where}: ${p.reason}`;
}
