"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import Link from "next/link";
import { useState } from "react";
import { useForm, useWatch } from "react-hook-form";
import { mergeSchema, type MergeForm as MergeValues } from "@/app/(network)/network/checklist/schema";
import { api, ApiError, checklistKeys, type ChecklistRow } from "./api";

const plural = (n: number, word: string) => `${n.toLocaleString("en-GB")} ${word}${n === 1 ? "" : "s"}`;

/** Fold one checklist entry into another: pick both, read what will happen, confirm. */
export function MergeForm({ keepId }: { keepId?: string }) {
  const queryClient = useQueryClient();
  const list = useQuery({ queryKey: checklistKeys.list, queryFn: () => api<{ entries: ChecklistRow[] }>("") });
  const [understood, setUnderstood] = useState(false);
  const [done, setDone] = useState<{ keep: ChecklistRow; fold: ChecklistRow; moved: number } | null>(null);
  const { register, control, handleSubmit, setError, reset, formState: { errors } } = useForm<MergeValues>({ resolver: zodResolver(mergeSchema), defaultValues: { keepId: keepId ?? "", foldId: "" } });
  const merge = useMutation({
    mutationFn: (values: MergeValues) => api<{ keptId: string; sightingsMoved: number }>("/merge", { method: "POST", body: values }),
    onError: (error) => {
      if (!(error instanceof ApiError)) return;
      for (const field of ["keepId", "foldId"] as const) if (error.fields[field]) setError(field, { message: error.fields[field][0] });
    },
  });

  const [keepChoice, foldChoice] = useWatch({ control, name: ["keepId", "foldId"] });

  if (list.error) return <p role="alert" className="font-bold text-rust-700">{list.error.message}</p>;
  if (!list.data) return <p role="status">Loading the checklist…</p>;
  const entries = list.data.entries;
  const keep = entries.find((e) => e.id === keepChoice);
  const fold = entries.find((e) => e.id === foldChoice);
  const option = (e: ChecklistRow) => <option key={e.id} value={e.id}>{e.scientificName} ({e.vernacularName})</option>;

  const onSubmit = handleSubmit((values) =>
    merge.mutate(values, {
      onSuccess: async (result) => {
        setDone({ keep: keep!, fold: fold!, moved: result.sightingsMoved });
        setUnderstood(false);
        reset({ keepId: values.keepId, foldId: "" });
        await queryClient.invalidateQueries({ queryKey: checklistKeys.all });
      },
    }),
  );

  return (
    <form onSubmit={onSubmit} noValidate className="card grid max-w-3xl gap-4">
      <div>
        <label htmlFor="foldId" className="field-label">Entry to fold in (its name becomes a synonym)</label>
        <select id="foldId" className="field-input" aria-invalid={Boolean(errors.foldId)} {...register("foldId")}>
          <option value="">Choose an entry</option>
          {entries.map(option)}
        </select>
        {errors.foldId && <p className="field-error">{errors.foldId.message}</p>}
      </div>
      <div>
        <label htmlFor="keepId" className="field-label">Entry to keep</label>
        <select id="keepId" className="field-input" aria-invalid={Boolean(errors.keepId)} {...register("keepId")}>
          <option value="">Choose an entry</option>
          {entries.map(option)}
        </select>
        {errors.keepId && <p className="field-error">{errors.keepId.message}</p>}
      </div>
      {keep && fold && keep.id !== fold.id && (
        <div className="space-y-2 rounded-lg bg-shingle-100 p-3">
          <p>
            {plural(fold.sightings, "sighting")} of <i>{fold.scientificName}</i> will name <i>{keep.scientificName}</i> instead
            (which has {plural(keep.sightings, "sighting")} now). <i>{fold.scientificName}</i>
            {fold.synonyms.length > 0 ? <> and its synonyms ({fold.synonyms.join(", ")}) will become synonyms</> : " will become a synonym"} of <i>{keep.scientificName}</i>;
            its tags join the kept entry&apos;s{fold.coveredBy.length > 0 && <>, and aggregates that covered it will cover <i>{keep.scientificName}</i></>}.
            The merge is kept in both names&apos; history. It cannot be undone.
          </p>
          <label className="inline-flex min-h-tap items-center gap-2">
            <input type="checkbox" className="h-5 w-5" checked={understood} onChange={(e) => setUnderstood(e.target.checked)} />
            I want to merge these two entries
          </label>
        </div>
      )}
      <div className="flex flex-wrap items-center gap-3">
        <button type="submit" className="btn-primary" disabled={!understood || merge.isPending}>{merge.isPending ? "Merging…" : "Merge the entries"}</button>
        {merge.error && <p role="alert" className="font-bold text-rust-700">{merge.error.message}</p>}
        {done && (
          <p role="status" className="font-bold text-lichen-700">
            Merged <i>{done.fold.scientificName}</i> into <i>{done.keep.scientificName}</i>: {plural(done.moved, "sighting")} re-pointed.{" "}
            <Link href={`/network/history?entity=species&id=${done.keep.id}`} className="underline">See it in the history</Link>.
          </p>
        )}
      </div>
    </form>
  );
}
