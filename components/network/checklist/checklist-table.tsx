"use client";

import { useQuery } from "@tanstack/react-query";
import Link from "next/link";
import { useDeferredValue, useMemo, useState } from "react";
import { formatMonths } from "@/lib/checklist/months";
import { rankLabel } from "@/lib/checklist/ranks";
import { api, checklistKeys, type ChecklistRow } from "./api";

const fold = (s: string) => s.normalize("NFKD").replace(/[\u0300-\u036f]/g, "").toLowerCase();

/** An entry matches when every word of the search starts a word of one of its names or tags. */
function matches(entry: ChecklistRow, words: string[]): boolean {
  const haystack = [entry.scientificName, entry.vernacularName, ...entry.synonyms, ...entry.tags.map((t) => t.label)].map(fold).join(" ");
  return words.every((w) => haystack.includes(w));
}

export function ChecklistTable() {
  const { data, error, isPending } = useQuery({ queryKey: checklistKeys.list, queryFn: () => api<{ entries: ChecklistRow[] }>("") });
  const [search, setSearch] = useState("");
  const deferred = useDeferredValue(search);
  const entries = useMemo(() => {
    const words = fold(deferred).split(/\s+/).filter(Boolean);
    return (data?.entries ?? []).filter((e) => matches(e, words));
  }, [data, deferred]);

  if (isPending) return <p role="status">Loading the checklist…</p>;
  if (error) return <p role="alert" className="font-bold text-rust-700">{error.message}</p>;
  return (
    <div className="space-y-3">
      <div className="max-w-md">
        <label htmlFor="checklist-search" className="field-label">Search names, synonyms and tags</label>
        <input id="checklist-search" type="search" className="field-input" value={search} onChange={(e) => setSearch(e.target.value)} autoComplete="off" />
      </div>
      <p role="status" className="text-sm text-shingle-700">
        {entries.length === data.entries.length ? `${data.entries.length} entries` : `${entries.length} of ${data.entries.length} entries`}
      </p>
      <div className="overflow-x-auto">
        <table className="w-full border-collapse bg-white text-sm">
          <thead>
            <tr className="border-b border-shingle-200 text-left">
              <th scope="col" className="p-2">Scientific name</th>
              <th scope="col" className="p-2">Vernacular name</th>
              <th scope="col" className="p-2">Rank</th>
              <th scope="col" className="p-2">Tags</th>
              <th scope="col" className="p-2">Sensitive</th>
              <th scope="col" className="p-2">Usual months</th>
              <th scope="col" className="p-2">Synonyms</th>
              <th scope="col" className="p-2">Covers</th>
              <th scope="col" className="p-2 text-right">Sightings</th>
            </tr>
          </thead>
          <tbody>
            {entries.map((e) => (
              <tr key={e.id} className="border-b border-shingle-100 align-top">
                <th scope="row" className="p-2 text-left font-normal">
                  <Link href={`/network/checklist/${e.id}`} className="italic text-tideline-800 underline">{e.scientificName}</Link>
                </th>
                <td className="p-2">{e.vernacularName}</td>
                <td className="p-2">{rankLabel[e.taxonRank]}</td>
                <td className="p-2">{e.tags.map((t) => t.label).join(", ")}</td>
                <td className="p-2">{e.sensitive ? "Yes" : "No"}</td>
                <td className="p-2">{formatMonths(e.activeMonths)}</td>
                <td className="p-2 italic">{e.synonyms.join(", ")}</td>
                <td className="p-2 italic">{e.covers.map((c) => c.scientificName).join(", ")}</td>
                <td className="p-2 text-right tabular-nums">{e.sightings.toLocaleString("en-GB")}</td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
    </div>
  );
}
