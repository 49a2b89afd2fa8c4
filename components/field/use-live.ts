"use client";

import { liveQuery } from "dexie";
import { useEffect, useState } from "react";

/** Re-renders whenever the IndexedDB rows the query reads change (in this tab or another). */
export function useLive<T>(query: () => Promise<T>, deps: unknown[]): T | undefined {
  const [value, setValue] = useState<T | undefined>(undefined);
  useEffect(() => {
    const subscription = liveQuery(query).subscribe({ next: setValue, error: () => setValue(undefined) });
    return () => subscription.unsubscribe();
    // eslint-disable-next-line react-hooks/exhaustive-deps -- the caller names the query's inputs in `deps`, as with useEffect
  }, deps);
  return value;
}
