"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import Link from "next/link";
import { useState } from "react";
import { useForm } from "react-hook-form";
import { tagSchema, type TagForm } from "@/app/(network)/network/checklist/schema";
import { api, ApiError, checklistKeys, type TagRow } from "./api";

/** One tag's form: creating a tag (no `tag`) or renaming one. */
function TagFields({ tag, onDone }: { tag?: TagRow; onDone: (text: string) => void }) {
  const queryClient = useQueryClient();
  const { register, handleSubmit, setError, reset, formState: { errors, isDirty } } = useForm<TagForm>({
    resolver: zodResolver(tagSchema),
    defaultValues: { label: tag?.label ?? "", description: tag?.description ?? "" },
  });
  const save = useMutation({
    mutationFn: (values: TagForm) => (tag ? api(`/tags/${tag.id}`, { method: "PATCH", body: values }) : api("/tags", { method: "POST", body: values })),
    onSuccess: async (_, values) => {
      onDone(tag ? `Saved ${values.label}.` : `Created the tag ${values.label}.`);
      if (!tag) reset({ label: "", description: "" });
      await queryClient.invalidateQueries({ queryKey: checklistKeys.all });
    },
    onError: (error) => {
      if (error instanceof ApiError) for (const field of ["label", "description"] as const) if (error.fields[field]) setError(field, { message: error.fields[field][0] });
    },
  });
  const idBase = tag ? `tag-${tag.id}` : "new-tag";
  return (
    <form onSubmit={handleSubmit((values) => save.mutate(values))} noValidate className="grid gap-2 sm:grid-cols-[1fr_2fr_auto] sm:items-end">
      <div>
        <label htmlFor={`${idBase}-label`} className="field-label">{tag ? `Name (slug ${tag.slug})` : "Name"}</label>
        <input id={`${idBase}-label`} className="field-input" aria-invalid={Boolean(errors.label)} {...register("label")} />
        {errors.label && <p className="field-error">{errors.label.message}</p>}
      </div>
      <div>
        <label htmlFor={`${idBase}-description`} className="field-label">Description (optional)</label>
        <input id={`${idBase}-description`} className="field-input" {...register("description")} />
        {errors.description && <p className="field-error">{errors.description.message}</p>}
      </div>
      <button type="submit" className={tag ? "btn-quiet" : "btn-primary"} disabled={save.isPending || !isDirty}>{tag ? "Save" : "Create tag"}</button>
      {save.error && !(save.error instanceof ApiError && Object.keys(save.error.fields).length) && <p role="alert" className="field-error sm:col-span-3">{save.error.message}</p>}
    </form>
  );
}

/** Species tags (used to analyse groups of species): create, rename, see how many entries carry each. */
export function TagManager() {
  const tags = useQuery({ queryKey: checklistKeys.tags, queryFn: () => api<{ tags: TagRow[] }>("/tags") });
  const [notice, setNotice] = useState<string | null>(null);
  if (tags.error) return <p role="alert" className="font-bold text-rust-700">{tags.error.message}</p>;
  if (!tags.data) return <p role="status">Loading the tags…</p>;
  return (
    <div className="space-y-4">
      <section aria-labelledby="new-tag-heading" className="card">
        <h2 id="new-tag-heading" className="mb-2 text-xl font-bold">New tag</h2>
        <TagFields onDone={setNotice} />
      </section>
      {notice && <p role="status" className="font-bold text-lichen-700">{notice}</p>}
      <section aria-labelledby="tags-heading" className="space-y-2">
        <h2 id="tags-heading" className="text-xl font-bold">Tags on the checklist</h2>
        <ul className="space-y-2">
          {tags.data.tags.map((t) => (
            <li key={`${t.id}:${t.label}:${t.description ?? ""}`} className="card">
              <TagFields tag={t} onDone={setNotice} />
              <p className="mt-1 text-sm text-shingle-700">
                {t.species} {t.species === 1 ? "entry" : "entries"} · <Link href={`/network/history?entity=species_tag&id=${t.id}`} className="underline">history</Link>
              </p>
            </li>
          ))}
        </ul>
      </section>
    </div>
  );
}
