import type { z } from "zod";
import { fieldErrorsOf } from "@/lib/validation";
import type { ItemResult } from "./contract";

export type Indexed<T> = { index: number; value: T };

export type ParsedItems<T> = {
  valid: Indexed<T>[];
  /** Results for items that failed validation, by their position in the array. */
  rejected: ItemResult[];
  /** Ids named by rejected items, so their sightings can say why they cannot land. */
  rejectedIds: Set<string>;
};

function rawId(item: unknown): string | null {
  if (item && typeof item === "object" && "id" in item && typeof item.id === "string") return item.id;
  return null;
}

/**
 * Validates each item on its own so one bad record never holds back the rest. A second item
 * with an id already seen in the batch is refused: two versions of one record in one request
 * would leave the outcome to array order.
 */
export function parseItems<S extends z.ZodType<{ id: string }>>(kind: ItemResult["kind"], items: unknown[], schema: S): ParsedItems<z.infer<S>> {
  const valid: Indexed<z.infer<S>>[] = [];
  const rejected: ItemResult[] = [];
  const rejectedIds = new Set<string>();
  const seen = new Set<string>();
  items.forEach((item, index) => {
    const parsed = schema.safeParse(item);
    if (!parsed.success) {
      const id = rawId(item);
      if (id) rejectedIds.add(id);
      rejected.push({ kind, id, index, status: "invalid", errors: fieldErrorsOf(parsed.error) });
      return;
    }
    const id = parsed.data.id;
    if (seen.has(id)) {
      rejected.push({ kind, id, index, status: "invalid", errors: { id: ["This id appears more than once in the batch."] } });
      return;
    }
    seen.add(id);
    valid.push({ index, value: parsed.data });
  });
  return { valid, rejected, rejectedIds };
}
