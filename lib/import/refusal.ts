import { AppError } from "@/lib/errors";
import { lineProblemText, type LineProblem } from "./problems";

/** An import refused: 400 with the problems listed ({ file, line, column, reason }) and how many more there are. */
export class SeasonImportRefused extends AppError {
  constructor(
    readonly problems: LineProblem[],
    readonly moreProblems: number,
  ) {
    const total = problems.length + moreProblems;
    super(400, "invalid_file", `The files were not imported: ${total === 1 ? "1 problem" : `${total.toLocaleString("en-GB")} problems`} to put right. Nothing was written.`, {
      text: problems.map(lineProblemText),
    });
    this.name = "SeasonImportRefused";
  }
}

/** The refusal as a 400 answer (the usual error shape, plus `problems` and `moreProblems`); anything else is rethrown for route() to answer. */
export function importRefusalResponse(error: unknown): Response {
  if (!(error instanceof SeasonImportRefused)) throw error;
  return Response.json(
    { error: { code: error.code, message: error.message, fields: error.fieldErrors, problems: error.problems, moreProblems: error.moreProblems } },
    { status: 400 },
  );
}
