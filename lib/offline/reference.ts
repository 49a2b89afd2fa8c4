import type { FieldReference } from "@/lib/queries/field-reference";
import { fieldDb } from "./db";

export type { FieldReference };

const KEY = "field-reference";

/** Fetches the reference data when there is signal and keeps the last good copy on the phone. */
export async function loadReference(fetcher: typeof fetch = fetch): Promise<{ data: FieldReference; fromPhone: boolean }> {
  try {
    const res = await fetcher("/api/field/reference", { credentials: "same-origin", cache: "no-store" });
    if (res.ok) {
      const data = (await res.json()) as FieldReference;
      await fieldDb().reference.put({ key: KEY, value: data, savedAt: new Date().toISOString() });
      return { data, fromPhone: false };
    }
  } catch {
    // offline: fall through to the phone's copy
  }
  const saved = await fieldDb().reference.get(KEY);
  if (!saved) throw new Error("No copy of your transects on this phone yet. Open Turnstone once with a signal.");
  return { data: saved.value as FieldReference, fromPhone: true };
}
