"use client";

import { QueryClient, QueryClientProvider } from "@tanstack/react-query";
import { useState } from "react";
import { TileCreditProvider } from "@/components/map/tile-credit";

/** Client-side data for the review queue: react-query against the review API's route handlers. */
export function ReviewProviders({ tileCredit = null, children }: { tileCredit?: string | null; children: React.ReactNode }) {
  const [client] = useState(() => new QueryClient({ defaultOptions: { queries: { staleTime: 30_000, retry: 1, refetchOnWindowFocus: false } } }));
  return (
    <QueryClientProvider client={client}>
      <TileCreditProvider value={tileCredit}>{children}</TileCreditProvider>
    </QueryClientProvider>
  );
}
