"use client";

import { useQuery } from "@tanstack/react-query";
import { useEffect } from "react";
import { phoneStore } from "@/lib/offline/phone-store";
import { keepReference, referenceKey, refreshReference, type FieldReference } from "@/lib/offline/reference";
import { useFieldUserId } from "./field-providers";
import { useLive } from "./use-live";

/**
 * The field screens' reference data (transects, checklist, rules), newest copy first: the one the
 * page was rendered with, the phone's own, or a fresh one fetched in the background. Screens render
 * from whatever is already here and never wait for the network when the phone has a copy.
 */
export function useFieldReference(initial?: FieldReference) {
  const userId = useFieldUserId();
  const saved = useLive(async () => (await phoneStore().reference.get(referenceKey(userId)))?.value as FieldReference | undefined ?? null, [userId]);
  const fresh = useQuery({ queryKey: ["field-reference", userId], queryFn: () => refreshReference() });
  useEffect(() => {
    if (initial) void keepReference(initial);
  }, [initial]);
  const candidates = [initial, saved ?? undefined, fresh.data].filter((c): c is FieldReference => Boolean(c));
  const data = candidates.sort((a, b) => b.savedAt.localeCompare(a.savedAt))[0] ?? null;
  return {
    data,
    loading: !data && (saved === undefined || fresh.isPending),
    offlineCopy: Boolean(data) && fresh.isError,
    error: !data && saved === null && fresh.isError ? (fresh.error as Error).message || "No copy of your transects on this phone yet. Open Turnstone once with a signal." : null,
  };
}
