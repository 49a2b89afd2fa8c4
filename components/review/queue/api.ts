// The review queue's calls to the review API (lib/review/contract.ts): JSON in, JSON out. Our error
// answers are { error: { code, message, fields? } } (lib/http/route.ts); a 409 on an action also
// carries the sighting as it stands now, so the screen can show it.
import type { ActionResult, BulkInput, BulkResult, Conflict, QueueOptions, QueuePage, ReviewActionInput, SightingDetail, SpeciesChoice } from "@/lib/review/contract";

export class ReviewApiError extends Error {
  constructor(
    readonly status: number,
    message: string,
    readonly fields: Record<string, string[]> = {},
  ) {
    super(message);
    this.name = "ReviewApiError";
  }
}

/** An action refused because someone else changed the sighting first (409); the screen shows who. */
export class ChangedError extends Error {
  constructor(readonly conflict: Conflict) {
    super(conflict.error.message);
    this.name = "ChangedError";
  }
}

type ErrorAnswer = { error?: { code?: string; message?: string; fields?: Record<string, string[]> } };

async function send(url: string, body?: unknown): Promise<{ response: Response; json: unknown }> {
  let response: Response;
  try {
    response = await fetch(url, body === undefined ? undefined : { method: "POST", headers: { "content-type": "application/json" }, body: JSON.stringify(body) });
  } catch {
    throw new ReviewApiError(0, "The server could not be reached. Check the connection and try again; nothing was changed.");
  }
  return { response, json: await response.json().catch(() => null) };
}

function failure(response: Response, json: unknown): ReviewApiError {
  const error = (json as ErrorAnswer | null)?.error;
  return new ReviewApiError(response.status, error?.message ?? `The server answered ${response.status}; nothing was changed.`, error?.fields ?? {});
}

async function getJson<T>(url: string): Promise<T> {
  const { response, json } = await send(url);
  if (!response.ok || json === null) throw failure(response, json);
  return json as T;
}

export const fetchQueue = (search: string) => getJson<QueuePage>(`/api/review/sightings${search ? `?${search}` : ""}`);
export const fetchSighting = (id: string) => getJson<SightingDetail>(`/api/review/sightings/${encodeURIComponent(id)}`);
export const fetchOptions = () => getJson<QueueOptions>("/api/review/options");
export const fetchSpecies = (q: string) => getJson<{ species: SpeciesChoice[] }>(`/api/review/species?q=${encodeURIComponent(q)}`);

export type ActionOutcome = { kind: "done"; row: ActionResult["row"] } | { kind: "changed"; conflict: Conflict };

/** One action on one sighting. A 409 is an answer, not a failure: someone else changed it first. */
export async function postAction(id: string, input: ReviewActionInput): Promise<ActionOutcome> {
  const { response, json } = await send(`/api/review/sightings/${encodeURIComponent(id)}/actions`, input);
  if (response.status === 409 && (json as Conflict | null)?.row) return { kind: "changed", conflict: json as Conflict };
  if (!response.ok || json === null) throw failure(response, json);
  return { kind: "done", row: (json as ActionResult).row };
}

export async function postBulk(input: BulkInput): Promise<BulkResult> {
  const { response, json } = await send("/api/review/bulk", input);
  if (!response.ok || json === null) throw failure(response, json);
  return json as BulkResult;
}

/** The messages for one field of a refused request (e.g. "message" or "reason"). */
export const fieldMessages = (error: unknown, field: string): string[] => (error instanceof ReviewApiError ? (error.fields[field] ?? []) : []);

/** Messages for fields the form does not show one by one, so that none is lost. */
export function otherMessages(error: unknown, shown: readonly string[]): string[] {
  if (!(error instanceof ReviewApiError)) return [];
  return Object.entries(error.fields)
    .filter(([key]) => !shown.includes(key))
    .flatMap(([, messages]) => messages);
}

export const reviewKeys = {
  all: ["review"] as const,
  queues: ["review", "queue"] as const,
  queue: (search: string) => ["review", "queue", search] as const,
  sighting: (id: string) => ["review", "sighting", id] as const,
  options: ["review", "options"] as const,
  species: (q: string) => ["review", "species", q] as const,
};
