"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useMutation, useQueryClient } from "@tanstack/react-query";
import { useForm } from "react-hook-form";
import { ApiError, api, seasonKeys, type SeasonRow } from "./api";
import { seasonSchema, type SeasonInput, type SeasonPatch, type SeasonValues } from "./schema";

const fields = ["name", "startsOn", "endsOn", "targetVisits", "minVisits"] as const;
type Field = (typeof fields)[number];

/**
 * A new season, or an existing one's changes (only the fields touched are sent). Dates are fixed
 * once a season has opened, so they are shown but not editable then; the server says the same.
 */
export function SeasonForm({ season, onDone }: { season?: SeasonRow; onDone?: () => void }) {
  const queryClient = useQueryClient();
  const editing = season !== undefined;
  const datesFixed = editing && season.status !== "planning";
  const { register, handleSubmit, reset, setError, formState: { errors, dirtyFields } } = useForm<SeasonInput, unknown, SeasonValues>({
    // Edits show every field, so the full schema checks them; only the touched ones are sent.
    resolver: zodResolver(seasonSchema),
    defaultValues: season
      ? { name: season.name, startsOn: season.startsOn, endsOn: season.endsOn, targetVisits: season.targetVisits, minVisits: season.minVisits }
      : { name: "", startsOn: "", endsOn: "", targetVisits: 8, minVisits: 4 },
  });
  const save = useMutation({
    mutationFn: (values: SeasonValues | SeasonPatch) =>
      editing ? api(`/api/network/seasons/${season.id}`, { method: "PATCH", body: values }) : api("/api/network/seasons", { body: values }),
    onSuccess: async () => {
      if (!editing) reset();
      await queryClient.invalidateQueries({ queryKey: seasonKeys.overview });
      onDone?.();
    },
    onError: (error) => {
      if (error instanceof ApiError) for (const f of fields) if (error.fields[f]) setError(f, { message: error.fields[f]![0]! });
    },
  });
  const submit = handleSubmit((values) => {
    if (!editing) return save.mutate(values);
    const changed = Object.fromEntries(fields.filter((f) => dirtyFields[f]).map((f) => [f, values[f]])) as SeasonPatch;
    if (Object.keys(changed).length === 0) return onDone?.();
    save.mutate(changed);
  });
  const prefix = season ? `season-${season.id}` : "new-season";
  const fieldError = (f: Field) => errors[f]?.message;
  const otherError = save.error && !(save.error instanceof ApiError && fields.some((f) => save.error instanceof ApiError && save.error.fields[f])) ? save.error.message : null;

  return (
    <form noValidate onSubmit={submit} className="space-y-3">
      <div>
        <label htmlFor={`${prefix}-name`} className="field-label">Name</label>
        <input id={`${prefix}-name`} className="field-input" placeholder="e.g. 2027 season" {...register("name")} />
        {fieldError("name") && <p className="field-error">{fieldError("name")}</p>}
      </div>
      <div className="grid gap-3 sm:grid-cols-2">
        <div>
          <label htmlFor={`${prefix}-starts`} className="field-label">First day</label>
          <input id={`${prefix}-starts`} type="date" className="field-input" readOnly={datesFixed} aria-readonly={datesFixed} {...register("startsOn")} />
          {fieldError("startsOn") && <p className="field-error">{fieldError("startsOn")}</p>}
        </div>
        <div>
          <label htmlFor={`${prefix}-ends`} className="field-label">Last day</label>
          <input id={`${prefix}-ends`} type="date" className="field-input" readOnly={datesFixed} aria-readonly={datesFixed} {...register("endsOn")} />
          {fieldError("endsOn") && <p className="field-error">{fieldError("endsOn")}</p>}
        </div>
      </div>
      {datesFixed && <p className="text-sm text-shingle-700">The season has opened, so its dates are fixed.</p>}
      <div className="grid gap-3 sm:grid-cols-2">
        <div>
          <label htmlFor={`${prefix}-target`} className="field-label">Target walks per transect</label>
          <input id={`${prefix}-target`} type="number" inputMode="numeric" min={1} max={100} className="field-input" {...register("targetVisits", { valueAsNumber: true })} />
          {fieldError("targetVisits") && <p className="field-error">{fieldError("targetVisits")}</p>}
        </div>
        <div>
          <label htmlFor={`${prefix}-min`} className="field-label">Fewest walks for a transect to be compared</label>
          <input id={`${prefix}-min`} type="number" inputMode="numeric" min={1} max={100} className="field-input" {...register("minVisits", { valueAsNumber: true })} />
          {fieldError("minVisits") && <p className="field-error">{fieldError("minVisits")}</p>}
        </div>
      </div>
      {otherError && <p role="alert" className="font-bold text-rust-700">{otherError}</p>}
      <div className="flex flex-wrap gap-2">
        <button type="submit" className="btn-primary" disabled={save.isPending}>{editing ? "Save season" : "Create season"}</button>
        {onDone && <button type="button" className="btn-quiet" onClick={onDone}>Cancel</button>}
      </div>
    </form>
  );
}
