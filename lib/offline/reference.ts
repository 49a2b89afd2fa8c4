import type { FieldReference } from "@/lib/queries/field-reference";
import { fieldDb } from "./db";

export type { FieldReference };

export const REFERENCE_KEY = "field-reference";

/** Keeps the newer of two copies (by when the server made them). */
export async function keepReference(data: FieldReference): Promise<void> {
  const saved = await fieldDb().reference.get(REFERENCE_KEY);
  const savedAt = (saved?.value as FieldReference | undefined)?.savedAt ?? "";
  if (data.savedAt > savedAt) await fieldDb().reference.put({ key: REFERENCE_KEY, value: data, savedAt: data.savedAt });
}

/** Fetches a fresh copy when there is signal and keeps it on the phone. Throws when offline. */
export async function refreshReference(fetcher: typeof fetch = fetch): Promise<FieldReference> {
  const res = await fetcher("/api/field/reference", { credentials: "same-origin", cache: "no-store" });
  if (!res.ok) throw new Error(res.status === 401 ? "Sign in again to refresh your transects." : `The server answered ${res.status}.`);
  const data = (await res.json()) as FieldReference;
  await keepReference(data);
  return data;
}

export async function phoneReference(): Promise<FieldReference | null> {
  const saved = await fieldDb().reference.get(REFERENCE_KEY);
  return (saved?.value as FieldReference | undefined) ?? null;
}
