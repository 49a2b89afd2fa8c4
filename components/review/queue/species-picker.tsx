"use client";

import { useQuery } from "@tanstack/react-query";
import { useEffect, useId, useState } from "react";
import type { SpeciesChoice, SpeciesRef } from "@/lib/review/contract";
import { fetchSpecies, reviewKeys } from "./api";

/** "Aggregate of A, B and C": an aggregate is a group of similar species named together. */
export function aggregateWords(s: Pick<SpeciesChoice, "aggregate" | "members">): string | null {
  if (!s.aggregate) return null;
  if (s.members.length === 0) return "Aggregate of similar species";
  const names = s.members.length > 1 ? `${s.members.slice(0, -1).join(", ")} and ${s.members.at(-1)}` : s.members[0];
  return `Aggregate of ${names}`;
}

/**
 * Search the checklist (GET /api/review/species?q=) by either name and pick one species or
 * aggregate. Used by the species filter and by a correction.
 */
export function SpeciesPicker({ label, chosen, onChoose, error, describedBy }: { label: string; chosen: SpeciesRef | null; onChoose: (s: SpeciesChoice | null) => void; error?: string[]; describedBy?: string }) {
  const id = useId();
  const [text, setText] = useState("");
  const [q, setQ] = useState("");
  useEffect(() => {
    const t = setTimeout(() => setQ(text.trim()), 200);
    return () => clearTimeout(t);
  }, [text]);
  const found = useQuery({ queryKey: reviewKeys.species(q), queryFn: () => fetchSpecies(q), enabled: q.length >= 2, staleTime: 5 * 60_000 });
  const choices = q.length >= 2 ? (found.data?.species ?? []) : [];
  const errorId = `${id}-error`;
  return (
    <div>
      <label htmlFor={`${id}-q`} className="field-label">{label}</label>
      {chosen && (
        <p className="mt-1 flex flex-wrap items-center gap-2 rounded-lg bg-tideline-50 px-3 py-2">
          <span>
            <strong>{chosen.vernacularName}</strong> <i className="text-shingle-600">{chosen.scientificName}</i>
            {chosen.aggregate && <span className="ml-1 rounded bg-sand-100 px-1 text-sm text-sand-800">aggregate</span>}
          </span>
          <button type="button" className="btn-quiet ml-auto min-h-0 py-1 text-sm" onClick={() => onChoose(null)}>
            Clear<span className="sr-only"> {chosen.vernacularName}</span>
          </button>
        </p>
      )}
      <input
        id={`${id}-q`}
        type="search"
        autoComplete="off"
        className="field-input"
        placeholder="Common or scientific name"
        value={text}
        onChange={(e) => setText(e.target.value)}
        aria-invalid={error && error.length > 0 ? true : undefined}
        aria-describedby={[error?.length ? errorId : null, describedBy].filter(Boolean).join(" ") || undefined}
      />
      {found.isFetching && q.length >= 2 && <p className="mt-1 text-sm text-shingle-600">Searching…</p>}
      {found.isError && <p className="field-error">The checklist could not be searched: {found.error.message}</p>}
      {choices.length > 0 && (
        <ul className="mt-1 max-h-64 divide-y divide-shingle-100 overflow-auto rounded-lg border border-shingle-400 bg-white" aria-label={`Species matching “${q}”`}>
          {choices.map((s) => (
            <li key={s.id}>
              <button
                type="button"
                className="min-h-tap w-full px-3 py-2 text-left hover:bg-shingle-100"
                onClick={() => {
                  onChoose(s);
                  setText("");
                  setQ("");
                }}
              >
                {s.vernacularName} <i className="text-shingle-600">{s.scientificName}</i>
                {aggregateWords(s) && <span className="block text-sm text-sand-800">{aggregateWords(s)}</span>}
              </button>
            </li>
          ))}
        </ul>
      )}
      {q.length >= 2 && found.isSuccess && choices.length === 0 && <p className="mt-1 text-sm">No species on the checklist matches “{q}”.</p>}
      {error?.map((m) => (
        <p key={m} id={errorId} className="field-error">{m}</p>
      ))}
    </div>
  );
}
