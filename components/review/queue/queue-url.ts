"use client";

import { useSearchParams } from "next/navigation";
import { useCallback, useMemo } from "react";
import { queueQuerySchema, queueSearchParams, type QueueFilter, type QueueQuery } from "@/lib/review/queue-filter";

// The queue's filters, sort and page live in the page's address, so a view can be bookmarked or
// shared; the API takes the same parameters (lib/review/queue-filter.ts).

export type UrlQuery = { query: QueueQuery; ignored: string[] };

const keys = ["status", "season", "transect", "habitat", "species", "volunteer", "from", "to", "warning", "sort", "dir", "page", "pageSize"] as const;

/** Reads the address; a part that does not parse is left out (and named), the rest still applies. */
export function readQuery(params: URLSearchParams): UrlQuery {
  const raw: Record<string, string> = {};
  for (const key of keys) {
    const value = params.get(key);
    if (value !== null && value !== "") raw[key] = value;
  }
  const ignored: string[] = [];
  for (;;) {
    const parsed = queueQuerySchema.safeParse(raw);
    if (parsed.success) return { query: parsed.data, ignored };
    const bad = [...new Set(parsed.error.issues.map((i) => String(i.path[0] ?? "")))].filter((k) => k in raw);
    // An issue on no key of ours: fall back to the defaults.
    if (bad.length === 0) return { query: queueQuerySchema.parse({}), ignored: Object.keys(raw) };
    for (const k of bad) {
      ignored.push(k);
      delete raw[k];
    }
  }
}

/** The filter part alone (what a bulk action over "all that match" sends). */
export function filterOf(q: QueueQuery): QueueFilter {
  const { sort: _s, dir: _d, page: _p, pageSize: _ps, ...filter } = q;
  return filter;
}

/**
 * The query in the address, and a way to change it. The address is replaced through the
 * browser's history, which Next's router follows (useSearchParams sees it), without asking the
 * server for the page again: router.replace would re-render the server page on every filter.
 */
export function useQueueUrl(): [UrlQuery, (next: Partial<QueueQuery>) => void] {
  const params = useSearchParams();
  const search = params?.toString() ?? "";
  const current = useMemo(() => readQuery(new URLSearchParams(search)), [search]);
  const update = useCallback(
    (next: Partial<QueueQuery>) => {
      const merged = { ...current.query, ...next } as QueueQuery;
      const qs = queueSearchParams(merged).toString();
      // State null, as Next's docs show: a state carrying the router's own marker is passed through
      // without updating useSearchParams.
      window.history.replaceState(null, "", `${window.location.pathname}${qs ? `?${qs}` : ""}`);
    },
    [current],
  );
  return [current, update];
}
