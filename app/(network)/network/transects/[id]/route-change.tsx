"use client";

import { useMutation, useQueryClient } from "@tanstack/react-query";
import { useId, useState } from "react";
import { RoutesMap } from "@/components/map/lazy";
import type { TransectDetail } from "@/lib/queries/transects";
import { latestRecordDate } from "@/lib/validation/fields";
import { api, messagesUnder, queryKeys } from "../api";
import { distance } from "../format";
import { RouteBuilder, draftSections, type RouteDraft } from "../route-builder";
import { routeChangeSchema } from "../schema";

type Answer = { version: { version: number; validFrom: string; unchanged: boolean; warnings: string[] } };

function draftOf(t: TransectDetail): RouteDraft {
  const coordinates = t.route.type === "LineString" ? t.route.coordinates : [];
  return { coordinates, boundaries: t.sections.slice(0, -1).map((s) => s.to), habitats: t.sections.map((s) => s.habitat) };
}

/** The current route and its sections, and a new version of them from a chosen date. */
export function RouteChange({ transect, tileUrl }: { transect: TransectDetail; tileUrl: string | null }) {
  const queryClient = useQueryClient();
  const ids = useId();
  const [editing, setEditing] = useState(false);
  const [draft, setDraft] = useState<RouteDraft>(() => draftOf(transect));
  const [validFrom, setValidFrom] = useState(() => new Date().toISOString().slice(0, 10));
  const [dateError, setDateError] = useState<string | null>(null);

  const change = useMutation({
    mutationFn: (body: unknown) => api<Answer>(`/api/network/transects/${transect.id}/versions`, { body }),
    onSuccess: async () => {
      await queryClient.invalidateQueries({ queryKey: queryKeys.transect(transect.id) });
      await queryClient.invalidateQueries({ queryKey: queryKeys.transects });
      setEditing(false);
    },
  });

  const submit = (e: React.FormEvent) => {
    e.preventDefault();
    const parsed = routeChangeSchema.safeParse({ validFrom, route: { sections: draftSections(draft) } });
    const dateIssue = parsed.success ? null : parsed.error.issues.find((i) => i.path[0] === "validFrom");
    setDateError(dateIssue?.message ?? null);
    if (parsed.success) change.mutate(parsed.data);
  };

  const answer = change.data?.version;
  if (!editing) {
    return (
      <div className="space-y-3">
        <RoutesMap
          tileUrl={tileUrl}
          label={`Map of transect ${transect.code}`}
          routes={transect.sections.map((s) => ({ id: `${s.number}`, label: `Section ${s.number}`, colour: transect.habitatColour, coordinates: s.coordinates, dashed: s.number % 2 === 0, detail: `${distance(s.lengthMetres)}${s.habitat ? ` · ${s.habitat}` : ""}` }))}
        />
        <ol className="grid gap-1 text-sm sm:grid-cols-2">
          {transect.sections.map((s) => (
            <li key={s.number}>
              <strong>Section {s.number}</strong>: {distance(s.lengthMetres)}
              {s.habitat ? `, ${s.habitat}` : ""}
            </li>
          ))}
        </ol>
        {answer && (
          <p role="status" className="font-bold text-lichen-700">
            {answer.unchanged ? "That is the route already in use: nothing changed." : `Saved as route version ${answer.version}, walked from ${answer.validFrom}.`} {answer.warnings.join(" ")}
          </p>
        )}
        <button type="button" className="btn-quiet" onClick={() => { setDraft(draftOf(transect)); setEditing(true); change.reset(); }}>Change the route or its sections</button>
      </div>
    );
  }
  return (
    <form noValidate onSubmit={submit} className="space-y-3">
      <p className="text-sm text-shingle-700">
        A change becomes a new route version from the date you choose: walks before it keep the route they were walked on. Choosing the date of the latest version corrects that version.
      </p>
      <div>
        <label htmlFor={`${ids}-from`} className="field-label">First day walked on the new route</label>
        <input id={`${ids}-from`} type="date" className="field-input w-48" max={latestRecordDate()} value={validFrom} onChange={(e) => setValidFrom(e.target.value)} />
        {(dateError || messagesUnder(change.error, "validFrom")[0]) && <p className="field-error">{dateError ?? messagesUnder(change.error, "validFrom")[0]}</p>}
      </div>
      <RouteBuilder draft={draft} onChange={setDraft} colour={transect.habitatColour} tileUrl={tileUrl} serverErrors={messagesUnder(change.error, "route")} />
      {change.error && messagesUnder(change.error, "route").length === 0 && messagesUnder(change.error, "validFrom").length === 0 && (
        <p role="alert" className="font-bold text-rust-700">{change.error.message}</p>
      )}
      <div className="flex gap-2">
        <button type="submit" className="btn-primary" disabled={change.isPending}>{change.isPending ? "Saving…" : "Save the new route"}</button>
        <button type="button" className="btn-quiet" onClick={() => setEditing(false)}>Cancel</button>
      </div>
    </form>
  );
}
