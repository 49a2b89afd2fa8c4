import type { FieldReference } from "@/lib/queries/field-reference";
import { phoneStore, fieldUser } from "./phone-store";

export type { FieldReference };

/**
 * Where the signed-in volunteer's copy is kept: one per volunteer, so a phone passed to someone
 * else never shows them the previous volunteer's transects while it has no signal.
 */
export function referenceKey(userId: string | null = fieldUser()): string {
  return `field-reference:${userId ?? "unknown"}`;
}

/** Keeps the newer of two copies (by when the server made them). */
export async function keepReference(data: FieldReference): Promise<void> {
  const saved = await phoneStore().reference.get(referenceKey());
  const savedAt = (saved?.value as FieldReference | undefined)?.savedAt ?? "";
  if (data.savedAt > savedAt) await phoneStore().reference.put({ key: referenceKey(), value: data, savedAt: data.savedAt });
}

/** Fetches a fresh copy when there is signal and keeps it on the phone. Throws when offline. */
export async function refreshReference(fetcher: typeof fetch = fetch): Promise<FieldReference> {
  const res = await fetcher("/api/field/reference", { credentials: "same-origin", cache: "no-store" });
  if (!res.ok) throw new Error(res.status === 401 ? "Sign in again to refresh your transects." : `Your transects could not be loaded just now (${res.status}).`);
  const data = (await res.json()) as FieldReference;
  await keepReference(data);
  return data;
}

export async function phoneReference(): Promise<FieldReference | null> {
  const saved = await phoneStore().reference.get(referenceKey());
  return (saved?.value as FieldReference | undefined) ?? null;
}
