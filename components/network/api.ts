// The organiser pages' calls to our route handlers (used by react-query): JSON in, JSON out, and
// our error answers ({ error: { code, message, fields, problems? } }) as an ApiError the forms can show.
import type { ImportProblem } from "@/lib/checklist/problems";

export class ApiError extends Error {
  constructor(
    readonly status: number,
    message: string,
    readonly fields: Record<string, string[]> = {},
    /** For a refused file: every problem by line. */
    readonly problems: ImportProblem[] = [],
  ) {
    super(message);
    this.name = "ApiError";
  }
}

type ErrorAnswer = { error?: { message?: string; fields?: Record<string, string[]>; problems?: ImportProblem[] } };

export async function api<T>(url: string, init: { method?: string; body?: unknown } = {}): Promise<T> {
  let response: Response;
  try {
    response = await fetch(url, {
      method: init.method ?? (init.body === undefined ? "GET" : "POST"),
      headers: init.body === undefined ? undefined : { "content-type": "application/json" },
      body: init.body === undefined ? undefined : JSON.stringify(init.body),
    });
  } catch {
    throw new ApiError(0, "The server could not be reached. Check the connection and try again; nothing was changed.");
  }
  const json = (await response.json().catch(() => null)) as (T & ErrorAnswer) | null;
  if (!response.ok || json === null) {
    const error = json?.error;
    throw new ApiError(response.status, error?.message ?? `The server answered ${response.status}; nothing was changed.`, error?.fields ?? {}, error?.problems ?? []);
  }
  return json as T;
}

/** Field messages under `prefix` (e.g. every "route…" key), flattened for one place on the form. */
export function messagesUnder(error: unknown, prefix: string): string[] {
  if (!(error instanceof ApiError)) return [];
  return Object.entries(error.fields)
    .filter(([key]) => key === prefix || key.startsWith(`${prefix}.`))
    .flatMap(([, messages]) => messages);
}
