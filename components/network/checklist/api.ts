// The checklist pages' calls to their route handlers (app/(network)/api/network/checklist/**).
import type { ImportProblem } from "@/lib/checklist/problems";

/** A refusal from a route: its message, field messages and, for a file, every problem by line. */
export class ApiError extends Error {
  constructor(
    readonly status: number,
    message: string,
    readonly fields: Record<string, string[]> = {},
    readonly problems: ImportProblem[] = [],
  ) {
    super(message);
  }
}

export async function api<T>(path: string, init?: { method: string; body: unknown }): Promise<T> {
  let res: Response;
  try {
    res = await fetch(`/api/network/checklist${path}`, init ? { method: init.method, headers: { "content-type": "application/json" }, body: JSON.stringify(init.body) } : undefined);
  } catch {
    throw new ApiError(0, "The server could not be reached. Check the connection and try again; nothing was changed.");
  }
  const json = (await res.json().catch(() => null)) as (T & { error?: { message: string; fields?: Record<string, string[]>; problems?: ImportProblem[] } }) | null;
  if (!res.ok || !json) {
    const error = json?.error;
    throw new ApiError(res.status, error?.message ?? "Something went wrong on our side. Nothing was changed.", error?.fields, error?.problems);
  }
  return json;
}

export const checklistKeys = {
  all: ["checklist"] as const,
  list: ["checklist", "list"] as const,
  entry: (id: string) => ["checklist", "entry", id] as const,
  tags: ["checklist", "tags"] as const,
};

export type { ChecklistRow } from "@/lib/queries/checklist";
export type { TagRow } from "@/lib/queries/checklist-tags";
