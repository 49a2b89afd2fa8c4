"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useMutation, useQueryClient } from "@tanstack/react-query";
import Link from "next/link";
import { useState } from "react";
import { useForm } from "react-hook-form";
import type { z } from "zod";
import type { HabitatGroupRow } from "@/lib/queries/habitat-groups";
import { ApiError, api, queryKeys } from "../transects/api";
import { HabitatSwatch } from "../transects/habitat-swatch";
import { useHabitatGroups } from "../transects/use-habitats";
import { ColourPicker } from "./colour-picker";
import { habitatGroupPatchSchema, habitatGroupSchema, type HabitatGroupInput, type HabitatGroupPatch, type HabitatGroupValues } from "./schema";

const fields = ["code", "name", "colour", "description"] as const;

function showServerErrors(error: unknown, setError: (name: (typeof fields)[number], e: { message: string }) => void) {
  if (error instanceof ApiError) for (const f of fields) if (error.fields[f]) setError(f, { message: error.fields[f]![0]! });
}

function NewGroupForm() {
  const queryClient = useQueryClient();
  const { register, handleSubmit, reset, setError, formState: { errors } } = useForm<HabitatGroupInput, unknown, HabitatGroupValues>({
    resolver: zodResolver(habitatGroupSchema),
    defaultValues: { code: "", name: "", colour: "estuary", description: "" },
  });
  const create = useMutation({
    mutationFn: (values: HabitatGroupValues) => api("/api/network/habitats", { body: values }),
    onSuccess: async () => {
      reset();
      await queryClient.invalidateQueries({ queryKey: queryKeys.habitats });
    },
    onError: (error) => showServerErrors(error, setError),
  });
  return (
    <form noValidate onSubmit={handleSubmit((v) => create.mutate(v))} className="space-y-3">
      <div className="grid gap-3 sm:grid-cols-3">
        <div>
          <label htmlFor="new-habitat-code" className="field-label">Code</label>
          <input id="new-habitat-code" className="field-input uppercase" {...register("code")} />
          {errors.code && <p className="field-error">{errors.code.message}</p>}
        </div>
        <div className="sm:col-span-2">
          <label htmlFor="new-habitat-name" className="field-label">Name</label>
          <input id="new-habitat-name" className="field-input" {...register("name")} />
          {errors.name && <p className="field-error">{errors.name.message}</p>}
        </div>
      </div>
      <ColourPicker register={register("colour")} legend="Colour on maps" error={errors.colour?.message} />
      <div>
        <label htmlFor="new-habitat-description" className="field-label">Description (optional)</label>
        <textarea id="new-habitat-description" rows={2} className="field-input" {...register("description")} />
        {errors.description && <p className="field-error">{errors.description.message}</p>}
      </div>
      {create.error && !(create.error instanceof ApiError && Object.keys(create.error.fields).length) && <p role="alert" className="font-bold text-rust-700">{create.error.message}</p>}
      <button type="submit" className="btn-primary" disabled={create.isPending}>Add habitat group</button>
    </form>
  );
}

function GroupRow({ group }: { group: HabitatGroupRow }) {
  const queryClient = useQueryClient();
  const [editing, setEditing] = useState(false);
  const { register, handleSubmit, setError, formState: { errors, dirtyFields } } = useForm<z.input<typeof habitatGroupPatchSchema>, unknown, HabitatGroupPatch>({
    resolver: zodResolver(habitatGroupPatchSchema),
    defaultValues: { code: group.code, name: group.name, colour: group.colour as HabitatGroupValues["colour"], description: group.description ?? "" },
  });
  const refresh = async () => {
    await queryClient.invalidateQueries({ queryKey: queryKeys.habitats });
    await queryClient.invalidateQueries({ queryKey: queryKeys.transects });
  };
  const save = useMutation({
    mutationFn: (patch: HabitatGroupPatch) => api(`/api/network/habitats/${group.id}`, { method: "PATCH", body: patch }),
    onSuccess: async () => {
      setEditing(false);
      await refresh();
    },
    onError: (error) => showServerErrors(error, setError),
  });
  const remove = useMutation({ mutationFn: () => api(`/api/network/habitats/${group.id}`, { method: "DELETE" }), onSuccess: refresh });
  const prefix = `habitat-${group.id}`;

  if (!editing) {
    return (
      <li className="card flex flex-wrap items-center justify-between gap-3">
        <div>
          <p className="font-bold"><HabitatSwatch colour={group.colour} name={group.name} /> <span className="text-sm font-normal text-shingle-600">({group.code})</span></p>
          <p className="text-sm text-shingle-700">
            {group.transects === 0 ? "No transects" : `${group.activeTransects} transect${group.activeTransects === 1 ? "" : "s"} in use${group.transects > group.activeTransects ? `, ${group.transects - group.activeTransects} retired` : ""}`}
            {group.description ? ` · ${group.description}` : ""}
          </p>
          {remove.error && <p role="alert" className="field-error">{remove.error.message}</p>}
        </div>
        <div className="flex gap-2">
          <button type="button" className="btn-quiet" onClick={() => setEditing(true)}>Edit {group.name}</button>
          {group.transects === 0 && <button type="button" className="btn-quiet" disabled={remove.isPending} onClick={() => remove.mutate()}>Delete {group.name}</button>}
        </div>
      </li>
    );
  }
  const submit = handleSubmit((values) => save.mutate(Object.fromEntries(fields.filter((f) => dirtyFields[f]).map((f) => [f, values[f]])) as HabitatGroupPatch));
  return (
    <li className="card">
      <form noValidate onSubmit={submit} className="space-y-3">
        <div className="grid gap-3 sm:grid-cols-3">
          <div>
            <label htmlFor={`${prefix}-code`} className="field-label">Code</label>
            <input id={`${prefix}-code`} className="field-input uppercase" {...register("code")} />
            {errors.code && <p className="field-error">{errors.code.message}</p>}
          </div>
          <div className="sm:col-span-2">
            <label htmlFor={`${prefix}-name`} className="field-label">Name</label>
            <input id={`${prefix}-name`} className="field-input" {...register("name")} />
            {errors.name && <p className="field-error">{errors.name.message}</p>}
          </div>
        </div>
        <ColourPicker register={register("colour")} legend={`Colour of ${group.name}`} error={errors.colour?.message} />
        <div>
          <label htmlFor={`${prefix}-description`} className="field-label">Description</label>
          <textarea id={`${prefix}-description`} rows={2} className="field-input" {...register("description")} />
        </div>
        {(errors.root?.message || (save.error && !(save.error instanceof ApiError && Object.keys(save.error.fields).some((k) => (fields as readonly string[]).includes(k))))) && (
          <p role="alert" className="font-bold text-rust-700">{errors.root?.message ?? save.error?.message}</p>
        )}
        <div className="flex gap-2">
          <button type="submit" className="btn-primary" disabled={save.isPending}>Save</button>
          <button type="button" className="btn-quiet" onClick={() => setEditing(false)}>Cancel</button>
        </div>
      </form>
    </li>
  );
}

/** Habitat groups: every transect belongs to one, and maps colour routes by them. */
export function HabitatGroups() {
  const groups = useHabitatGroups();
  return (
    <div className="space-y-6">
      <div className="flex flex-wrap items-center justify-between gap-3">
        <h1 className="text-2xl font-bold text-tideline-800">Habitat groups</h1>
        <div className="flex gap-2">
          <Link href="/network/history?entity=habitat_group" className="btn-quiet">History</Link>
          <Link href="/network/transects" className="btn-quiet">Transects</Link>
        </div>
      </div>
      <p className="text-shingle-700">Every transect belongs to one habitat group. A group that still has transects, retired ones included, cannot be deleted.</p>
      {groups.error && <p role="alert" className="card font-bold text-rust-700">{groups.error.message}</p>}
      {groups.isPending ? <p className="card">Loading…</p> : (
        <ul className="space-y-3">{(groups.data ?? []).map((g) => <GroupRow key={`${g.id}-${g.name}-${g.colour}-${g.code}`} group={g} />)}</ul>
      )}
      <section aria-labelledby="new-habitat-heading" className="card space-y-3">
        <h2 id="new-habitat-heading" className="text-xl font-bold">New habitat group</h2>
        <NewGroupForm />
      </section>
    </div>
  );
}
