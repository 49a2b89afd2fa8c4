// The checklist pages' calls to their route handlers (app/(network)/api/network/checklist/**).
import { api as call } from "@/components/network/api";

export { ApiError } from "@/components/network/api";

/** A call to a checklist route handler, by its path under /api/network/checklist. */
export function api<T>(path: string, init?: { method: string; body: unknown }): Promise<T> {
  return call<T>(`/api/network/checklist${path}`, init);
}

export const checklistKeys = {
  all: ["checklist"] as const,
  list: ["checklist", "list"] as const,
  entry: (id: string) => ["checklist", "entry", id] as const,
  tags: ["checklist", "tags"] as const,
};

export type { ChecklistRow } from "@/lib/queries/checklist";
export type { TagRow } from "@/lib/queries/checklist-tags";
