"use client";

import { useState } from "react";
import { searchSpecies, type ChecklistEntry } from "@/lib/field/species-search";

/** Search the checklist by either name and add the species as a new sighting line. */
export function SpeciesAdder({ checklist, onAdd }: { checklist: ChecklistEntry[]; onAdd: (entry: ChecklistEntry) => void }) {
  const [query, setQuery] = useState("");
  const matches = query.trim() ? searchSpecies(checklist, query, [], 8) : [];
  return (
    <div>
      <label htmlFor="species-search" className="field-label">Add a species (search by common or scientific name)</label>
      <input id="species-search" type="search" autoComplete="off" className="field-input" value={query} onChange={(e) => setQuery(e.target.value)} />
      {matches.length > 0 && (
        <ul className="mt-1 divide-y divide-shingle-100 rounded-lg border border-shingle-300 bg-white" aria-label="Matching species">
          {matches.map((m) => (
            <li key={m.id}>
              <button type="button" className="min-h-tap w-full px-3 py-2 text-left hover:bg-shingle-100" onClick={() => { onAdd(m); setQuery(""); }}>
                {m.vernacularName} <i className="text-shingle-600">{m.scientificName}</i>
              </button>
            </li>
          ))}
        </ul>
      )}
      {query.trim() !== "" && matches.length === 0 && <p className="mt-1 text-sm">No species on the checklist matches &quot;{query}&quot;.</p>}
    </div>
  );
}
