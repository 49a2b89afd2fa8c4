"use client";

import { useQuery } from "@tanstack/react-query";
import { useState } from "react";
import type { SpeciesRef } from "@/lib/review/contract";
import { queueFilterSchema, statusFilters, type QueueQuery, type StatusFilter } from "@/lib/review/queue-filter";
import { warningFilters, warningLabel } from "@/lib/review/warnings";
import { ANSWERED, statusForReviewer } from "@/lib/review/words";
import { fetchOptions, reviewKeys } from "./api";
import { filterOf } from "./queue-url";
import { SpeciesPicker } from "./species-picker";

export const statusFilterLabel: Record<StatusFilter, string> = {
  waiting: "Still to decide",
  pending: statusForReviewer.pending,
  queried: statusForReviewer.queried,
  answered: `${ANSWERED} (the volunteer replied)`,
  accepted: statusForReviewer.accepted,
  rejected: statusForReviewer.rejected,
  any: "Every status",
};

type FilterKey = "status" | "season" | "transect" | "habitat" | "species" | "volunteer" | "from" | "to" | "warning";

/** The queue's filters. Each change goes straight into the address (and so into the list). */
export function QueueFilters({ query, onChange, speciesShown }: { query: QueueQuery; onChange: (next: Partial<QueueQuery>) => void; speciesShown: SpeciesRef | null }) {
  const options = useQuery({ queryKey: reviewKeys.options, queryFn: fetchOptions, staleTime: 5 * 60_000 });
  const [dateError, setDateError] = useState<string | null>(null);
  const set = (key: FilterKey, value: string) => {
    const next = { ...filterOf(query), [key]: value === "" ? undefined : value };
    const checked = queueFilterSchema.safeParse(next);
    if (!checked.success) {
      const issue = checked.error.issues[0];
      if (key === "from" || key === "to") return setDateError(issue?.message ?? "Check the dates");
    }
    setDateError(null);
    onChange({ [key]: value === "" ? undefined : value, page: 1 });
  };
  const o = options.data;
  const select = (key: FilterKey, label: string, choices: { value: string; label: string }[], anyLabel: string | null) => (
    <div>
      <label htmlFor={`filter-${key}`} className="field-label">{label}</label>
      <select id={`filter-${key}`} className="field-input" value={(query[key] as string | undefined) ?? ""} onChange={(e) => set(key, e.target.value)}>
        {anyLabel !== null && <option value="">{anyLabel}</option>}
        {choices.map((c) => (
          <option key={c.value} value={c.value}>{c.label}</option>
        ))}
        {/* A value from a shared link that the choices no longer list stays visible. */}
        {query[key] && !choices.some((c) => c.value === query[key]) && <option value={query[key] as string}>{options.isPending ? "Loading…" : "(not in the list)"}</option>}
      </select>
    </div>
  );
  const filtered = (["season", "transect", "habitat", "species", "volunteer", "from", "to", "warning"] as const).some((k) => query[k] !== undefined) || query.status !== "waiting";
  const speciesChosen = query.species ? (speciesShown?.id === query.species ? speciesShown : { id: query.species, vernacularName: "The species in the link", scientificName: "", aggregate: false }) : null;

  return (
    <form role="search" aria-label="Filter the sightings" className="card space-y-3" onSubmit={(e) => e.preventDefault()}>
      <div className="grid grid-cols-1 gap-3 sm:grid-cols-2 lg:grid-cols-4">
        {select("status", "Status", statusFilters.map((s) => ({ value: s, label: statusFilterLabel[s] })), null)}
        {select("warning", "Warning", warningFilters.map((w) => ({ value: w, label: warningLabel[w] })), "With or without warnings")}
        {select("season", "Season", (o?.seasons ?? []).map((s) => ({ value: s.id, label: s.name })), "Every season")}
        {select("transect", "Transect", (o?.transects ?? []).map((t) => ({ value: t.id, label: `${t.code} ${t.name}` })), "Every transect")}
        {select("habitat", "Habitat group", (o?.habitats ?? []).map((h) => ({ value: h.id, label: h.name })), "Every habitat group")}
        {select("volunteer", "Volunteer", (o?.volunteers ?? []).map((v) => ({ value: v.id, label: v.name })), "Every volunteer")}
        <div>
          <label htmlFor="filter-from" className="field-label">Walked from</label>
          <input id="filter-from" type="date" className="field-input" value={query.from ?? ""} onChange={(e) => set("from", e.target.value)} aria-describedby={dateError ? "filter-date-error" : undefined} />
        </div>
        <div>
          <label htmlFor="filter-to" className="field-label">Walked until</label>
          <input id="filter-to" type="date" className="field-input" value={query.to ?? ""} onChange={(e) => set("to", e.target.value)} aria-invalid={dateError ? true : undefined} aria-describedby={dateError ? "filter-date-error" : undefined} />
        </div>
      </div>
      {dateError && <p id="filter-date-error" className="field-error">{dateError}</p>}
      <div className="grid gap-3 lg:grid-cols-2">
        <SpeciesPicker label="Species" chosen={speciesChosen} onChoose={(s) => set("species", s?.id ?? "")} />
      </div>
      {options.isError && <p className="field-error">The filter choices could not be loaded: {options.error.message}</p>}
      {filtered && (
        <button type="button" className="btn-quiet" onClick={() => onChange({ status: "waiting", season: undefined, transect: undefined, habitat: undefined, species: undefined, volunteer: undefined, from: undefined, to: undefined, warning: undefined, page: 1 })}>
          Clear the filters
        </button>
      )}
    </form>
  );
}
