// How the outbox reads answers that carry no per-item results: a passing fault to retry later,
// or a refusal to show the volunteer. Shared by the record batches and the photo uploads.

/**
 * Statuses that say "try again later" rather than "this request is wrong": server errors, 408
 * Request Timeout (RFC 9110 §15.5.9: the client may repeat the request) and 429 Too Many Requests
 * (RFC 6585 §4).
 */
export function isPassingFault(status: number): boolean {
  return status >= 500 || status === 408 || status === 429;
}

export type ServerError = { code: string | null; message: string | null };

const MAX_MESSAGE_CHARS = 300;

type ErrorBody = { error?: { code?: unknown; message?: unknown; fields?: unknown } } | null;

function fieldMessages(fields: unknown): string[] {
  if (!fields || typeof fields !== "object") return [];
  return Object.values(fields).flatMap((messages) => (Array.isArray(messages) ? messages.filter((m): m is string => typeof m === "string") : []));
}

/**
 * The `{ error: { code, message, fields? } }` our route handlers answer with, if the body has
 * one; field messages are added to the message, as they say what to change.
 */
export async function readServerError(response: Response): Promise<ServerError> {
  try {
    const body = (await response.json()) as ErrorBody;
    const code = typeof body?.error?.code === "string" ? body.error.code : null;
    const parts = [typeof body?.error?.message === "string" ? body.error.message.trim() : "", ...fieldMessages(body?.error?.fields)].filter(Boolean);
    return { code, message: parts.length ? parts.join(" ").slice(0, MAX_MESSAGE_CHARS) : null };
  } catch {
    return { code: null, message: null };
  }
}
