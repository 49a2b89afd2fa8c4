"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import Link from "next/link";
import { useRouter } from "next/navigation";
import { useState } from "react";
import { Controller, useForm, useWatch } from "react-hook-form";
import { entrySchema, type EntryForm } from "@/app/(network)/network/checklist/schema";
import { AGGREGATE_RANK, rankLabel, TAXON_RANKS } from "@/lib/checklist/ranks";
import { api, ApiError, checklistKeys, type ChecklistRow, type TagRow } from "./api";
import { SpeciesPicker } from "./species-picker";
import { SynonymsField } from "./synonyms-field";

const MONTHS = ["Jan", "Feb", "Mar", "Apr", "May", "Jun", "Jul", "Aug", "Sep", "Oct", "Nov", "Dec"];

const formOf = (e: ChecklistRow): EntryForm => ({
  scientificName: e.scientificName,
  vernacularName: e.vernacularName,
  taxonRank: e.taxonRank,
  sensitive: e.sensitive,
  activeMonths: e.activeMonths,
  tagIds: e.tags.map((t) => t.id),
  synonyms: e.synonyms,
  covers: e.covers.map((c) => c.id),
});

type Notice = { ok: boolean; text: string } | null;

export function EntryEditor({ id }: { id: string }) {
  // Kept here: the form below restarts after a save, and the notice must outlive it.
  const [notice, setNotice] = useState<Notice>(null);
  const entry = useQuery({ queryKey: checklistKeys.entry(id), queryFn: () => api<{ entry: ChecklistRow }>(`/${id}`) });
  const list = useQuery({ queryKey: checklistKeys.list, queryFn: () => api<{ entries: ChecklistRow[] }>("") });
  const tags = useQuery({ queryKey: checklistKeys.tags, queryFn: () => api<{ tags: TagRow[] }>("/tags") });
  if (entry.error) return <p role="alert" className="font-bold text-rust-700">{entry.error.message}</p>;
  if (!entry.data || !list.data || !tags.data) return <p role="status">Loading the entry…</p>;
  // Keyed by the stored entry, so a saved change restarts the form from what was stored.
  return <EntryFormView key={JSON.stringify(entry.data.entry)} entry={entry.data.entry} entries={list.data.entries} tags={tags.data.tags} notice={notice} setNotice={setNotice} />;
}

function EntryFormView({ entry, entries, tags, notice, setNotice }: { entry: ChecklistRow; entries: ChecklistRow[]; tags: TagRow[]; notice: Notice; setNotice: (n: Notice) => void }) {
  const queryClient = useQueryClient();
  const router = useRouter();
  const { register, control, handleSubmit, setError, formState: { errors, isDirty } } = useForm<EntryForm>({ resolver: zodResolver(entrySchema), defaultValues: formOf(entry) });
  const save = useMutation({
    mutationFn: (values: EntryForm) => api<{ changed: boolean; entry: ChecklistRow }>(`/${entry.id}`, { method: "PATCH", body: values }),
    onSuccess: async (result) => {
      setNotice({ ok: true, text: result.changed ? "Saved. The change is in the network's history." : "Nothing had changed." });
      await queryClient.invalidateQueries({ queryKey: checklistKeys.all });
      // The page's heading is drawn on the server.
      router.refresh();
    },
    onError: (error) => {
      setNotice({ ok: false, text: error.message });
      if (error instanceof ApiError) {
        for (const [path, messages] of Object.entries(error.fields)) {
          const field = path.split(".")[0] as keyof EntryForm;
          if (field in formOf(entry)) setError(field, { message: messages[0] });
        }
      }
    },
  });
  const isAggregate = useWatch({ control, name: "taxonRank" }) === AGGREGATE_RANK;
  const coversChosen = useWatch({ control, name: "covers" }).length > 0;
  const candidates = entries.filter((e) => e.id !== entry.id && e.taxonRank !== AGGREGATE_RANK);
  const error = (name: keyof EntryForm) => {
    const e = errors[name] as { message?: string } | undefined;
    return e?.message ? <p id={`${name}-error`} className="field-error">{e.message}</p> : null;
  };

  return (
    <form onSubmit={handleSubmit((values) => save.mutate(values))} noValidate className="card grid max-w-3xl gap-4">
      <div className="grid gap-4 sm:grid-cols-2">
        <div>
          <label htmlFor="scientificName" className="field-label">Scientific name</label>
          <input id="scientificName" className="field-input italic" aria-invalid={Boolean(errors.scientificName)} {...register("scientificName")} />
          {error("scientificName")}
        </div>
        <div>
          <label htmlFor="vernacularName" className="field-label">Vernacular name</label>
          <input id="vernacularName" className="field-input" aria-invalid={Boolean(errors.vernacularName)} {...register("vernacularName")} />
          {error("vernacularName")}
        </div>
        <div>
          <label htmlFor="taxonRank" className="field-label">Rank</label>
          <select id="taxonRank" className="field-input" {...register("taxonRank")}>
            {TAXON_RANKS.map((r) => <option key={r} value={r}>{rankLabel[r]}</option>)}
          </select>
          {error("taxonRank")}
        </div>
        <div className="flex items-end">
          <label className="inline-flex min-h-tap items-center gap-2">
            <input type="checkbox" className="h-5 w-5" {...register("sensitive")} />
            Sensitive: positions withheld from volunteers and partners
          </label>
        </div>
      </div>

      <fieldset>
        <legend className="field-label">Usual months of activity</legend>
        <Controller
          control={control}
          name="activeMonths"
          render={({ field }) => (
            <div className="mt-1 flex flex-wrap gap-x-4">
              {MONTHS.map((label, i) => (
                <label key={label} className="inline-flex min-h-tap items-center gap-2">
                  <input
                    type="checkbox"
                    className="h-5 w-5"
                    checked={field.value.includes(i + 1)}
                    onChange={(e) => field.onChange(e.target.checked ? [...field.value, i + 1].sort((a, b) => a - b) : field.value.filter((m) => m !== i + 1))}
                  />
                  {label}
                </label>
              ))}
            </div>
          )}
        />
        {error("activeMonths")}
      </fieldset>

      <fieldset>
        <legend className="field-label">Tags</legend>
        <Controller
          control={control}
          name="tagIds"
          render={({ field }) => (
            <div className="mt-1 flex flex-wrap gap-x-4">
              {tags.map((t) => (
                <label key={t.id} className="inline-flex min-h-tap items-center gap-2">
                  <input type="checkbox" className="h-5 w-5" checked={field.value.includes(t.id)} onChange={(e) => field.onChange(e.target.checked ? [...field.value, t.id] : field.value.filter((v) => v !== t.id))} />
                  {t.label}
                </label>
              ))}
            </div>
          )}
        />
        <p className="text-sm text-shingle-700"><Link href="/network/checklist/tags" className="underline">Create or rename tags</Link></p>
        {error("tagIds")}
      </fieldset>

      <div>
        <label htmlFor="synonyms" className="field-label">Synonyms (one per line)</label>
        <Controller control={control} name="synonyms" render={({ field }) => <SynonymsField id="synonyms" value={field.value} onChange={field.onChange} onBlur={field.onBlur} />} />
        {error("synonyms")}
      </div>

      {(isAggregate || coversChosen) && (
        <fieldset>
          <legend className="field-label">Species this aggregate covers (at least two)</legend>
          <Controller control={control} name="covers" render={({ field }) => <SpeciesPicker id="covers-filter" options={candidates} value={field.value} onChange={field.onChange} />} />
          {error("covers")}
        </fieldset>
      )}

      <div className="flex flex-wrap items-center gap-3">
        <button type="submit" className="btn-primary" disabled={save.isPending || !isDirty}>{save.isPending ? "Saving…" : "Save changes"}</button>
        {notice && <p role="status" className={`font-bold ${notice.ok ? "text-lichen-700" : "text-rust-700"}`}>{notice.text}</p>}
      </div>
    </form>
  );
}
