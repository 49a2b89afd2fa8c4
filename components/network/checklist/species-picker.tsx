"use client";

import { useMemo, useState } from "react";

type Option = { id: string; scientificName: string; vernacularName: string };

/** Chooses several entries from the checklist: the chosen ones first, then those matching the filter. */
export function SpeciesPicker({ id, options, value, onChange }: { id: string; options: Option[]; value: string[]; onChange: (ids: string[]) => void }) {
  const [filter, setFilter] = useState("");
  const chosen = useMemo(() => options.filter((o) => value.includes(o.id)), [options, value]);
  const matching = useMemo(() => {
    const f = filter.trim().toLowerCase();
    if (!f) return [];
    return options.filter((o) => !value.includes(o.id) && `${o.scientificName} ${o.vernacularName}`.toLowerCase().includes(f)).slice(0, 20);
  }, [options, value, filter]);
  const toggle = (optionId: string, on: boolean) => onChange(on ? [...value, optionId] : value.filter((v) => v !== optionId));
  const row = (o: Option, on: boolean) => (
    <li key={o.id}>
      <label className="inline-flex min-h-tap items-center gap-2">
        <input type="checkbox" className="h-5 w-5" checked={on} onChange={(e) => toggle(o.id, e.target.checked)} />
        <span><i>{o.scientificName}</i> ({o.vernacularName})</span>
      </label>
    </li>
  );
  return (
    <div className="space-y-2">
      <ul aria-label="Species covered">{chosen.map((o) => row(o, true))}</ul>
      <label htmlFor={id} className="field-label">Find a species to add</label>
      <input id={id} type="search" className="field-input" value={filter} onChange={(e) => setFilter(e.target.value)} autoComplete="off" />
      {matching.length > 0 && <ul aria-label="Matching species">{matching.map((o) => row(o, false))}</ul>}
    </div>
  );
}
