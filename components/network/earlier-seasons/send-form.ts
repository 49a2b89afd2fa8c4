// Sends the import form (multipart: two files) to our route handlers; error answers become the
// organiser pages' ApiError, with a refused import's problems.
import type { LineProblem } from "@/lib/import/problems";
import { ApiError } from "../api";

export type ImportRefusal = { problems: LineProblem[]; moreProblems: number };

export class ImportApiError extends ApiError {
  constructor(status: number, message: string, fields: Record<string, string[]>, readonly refusal: ImportRefusal | null) {
    super(status, message, fields);
  }
}

type ErrorAnswer = { error?: { message?: string; fields?: Record<string, string[]>; problems?: LineProblem[]; moreProblems?: number } };

export async function sendForm<T>(url: string, form: FormData): Promise<T> {
  let response: Response;
  try {
    response = await fetch(url, { method: "POST", body: form });
  } catch {
    throw new ImportApiError(0, "The server could not be reached. Check the connection and try again; nothing was changed.", {}, null);
  }
  const json = (await response.json().catch(() => null)) as (T & ErrorAnswer) | null;
  if (!response.ok || json === null) {
    const e = json?.error;
    const refusal = e?.problems ? { problems: e.problems, moreProblems: e.moreProblems ?? 0 } : null;
    throw new ImportApiError(response.status, e?.message ?? `The server answered ${response.status}; nothing was changed.`, e?.fields ?? {}, refusal);
  }
  return json as T;
}
