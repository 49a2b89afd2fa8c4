import { AppError } from "@/lib/errors";
import { problemText, type ImportProblem } from "./problems";

/** A checklist file or edit refused: 400 with every problem, as text under `text` and as { line, column, reason }. */
export class ChecklistRefused extends AppError {
  constructor(
    readonly problems: ImportProblem[],
    message = `The file was not imported: ${problems.length === 1 ? "1 problem" : `${problems.length} problems`} to put right. Nothing was written.`,
  ) {
    super(400, "invalid_file", message, { text: problems.map(problemText) });
    this.name = "ChecklistRefused";
  }
}

/** The refusal as a 400 answer (the usual error shape, plus `problems`); anything else is rethrown for route() to answer. */
export function refusalResponse(error: unknown): Response {
  if (!(error instanceof ChecklistRefused)) throw error;
  return Response.json({ error: { code: error.code, message: error.message, fields: error.fieldErrors, problems: error.problems } }, { status: 400 });
}
