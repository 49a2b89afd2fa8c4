import { lineProblemText, type LineProblem } from "@/lib/import/problems";

/** Every listed problem by file and line, and how many more were found. */
export function ProblemList({ problems, more }: { problems: LineProblem[]; more: number }) {
  return (
    <>
      <ul className="mt-2 list-disc space-y-1 pl-6" data-testid="import-problems">
        {problems.map((p, i) => <li key={i}>{lineProblemText(p)}</li>)}
      </ul>
      {more > 0 && <p className="mt-2 font-bold">…and {more.toLocaleString("en-GB")} more problems not listed. Put these right and preview again.</p>}
    </>
  );
}
