"use client";

import { useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import { useState } from "react";
import type { TransectList } from "@/lib/queries/transects";
import { queryKeys } from "../../transects/api";
import { ApiError, api, peopleKeys, type PersonAnswer } from "../people-api";

/** The volunteer's transects: tick or untick, then save; the phone has the change at its next sync. */
export function AssignmentsPanel({ person, assigned }: { person: PersonAnswer["person"]; assigned: PersonAnswer["transects"] }) {
  const queryClient = useQueryClient();
  const all = useQuery({ queryKey: queryKeys.transects, queryFn: () => api<TransectList>("/api/network/transects") });
  const current = new Set(assigned.map((t) => t.id));
  const [chosen, setChosen] = useState<Set<string>>(current);
  const add = [...chosen].filter((id) => !current.has(id));
  const remove = [...current].filter((id) => !chosen.has(id));
  const save = useMutation({
    mutationFn: () => api<{ added: number; removed: number }>(`/api/network/people/${person.id}/assignments`, { body: { add, remove } }),
    onSuccess: () => Promise.all([queryClient.invalidateQueries({ queryKey: peopleKeys.all }), queryClient.invalidateQueries({ queryKey: queryKeys.transects })]),
  });
  const toggle = (id: string, on: boolean) => setChosen((prev) => {
    const next = new Set(prev);
    if (on) next.add(id);
    else next.delete(id);
    return next;
  });
  // Retired transects take no new volunteers, but one still assigned can be taken off.
  const choices = (all.data?.transects ?? []).filter((t) => t.active || current.has(t.id));
  return (
    <section className="card space-y-3" aria-labelledby="assignments-heading">
      <h2 id="assignments-heading" className="text-xl font-bold">Transects {person.name} walks</h2>
      {all.isPending ? (
        <p role="status">Loading transects…</p>
      ) : all.error ? (
        <p role="alert" className="font-bold text-rust-700">{all.error.message}</p>
      ) : (
        <fieldset>
          <legend className="sr-only">Transects</legend>
          <div className="grid gap-x-4 sm:grid-cols-2">
            {choices.map((t) => (
              <label key={t.id} className="flex min-h-tap items-center gap-2">
                <input type="checkbox" className="h-5 w-5" checked={chosen.has(t.id)} onChange={(e) => toggle(t.id, e.target.checked)} />
                <span className="font-mono">{t.code}</span> {t.name}{t.active ? "" : " (retired)"}
              </label>
            ))}
          </div>
        </fieldset>
      )}
      <button type="button" className="btn-primary" disabled={save.isPending || (add.length === 0 && remove.length === 0)} onClick={() => save.mutate()}>
        Save transects
      </button>
      <p role="status" className={`font-bold ${save.isError ? "text-rust-700" : "text-lichen-700"}`}>
        {save.isSuccess && add.length === 0 && remove.length === 0
          ? `Saved (${save.data.added} added, ${save.data.removed} taken off). Their phone picks it up at its next sync.`
          : save.isError
            ? save.error instanceof ApiError ? (Object.values(save.error.fields).flat()[0] ?? save.error.message) : save.error.message
            : ""}
      </p>
    </section>
  );
}
