"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useMutation, useQueryClient } from "@tanstack/react-query";
import { useForm } from "react-hook-form";
import type { HabitatGroupRow } from "@/lib/queries/habitat-groups";
import type { TransectDetail } from "@/lib/queries/transects";
import { ApiError, api, queryKeys } from "../api";
import { DetailsFields, type DetailName } from "../details-fields";
import { transectPatchSchema, type TransectPatch } from "../schema";
import { useHabitatGroups } from "../use-habitats";
import type { z } from "zod";

const names: DetailName[] = ["code", "name", "habitatGroupId", "sensitive", "coastal", "accessNotes"];

/** The transect's details, once the habitat groups are known (a select takes its value from its options). */
export function DetailsForm({ transect }: { transect: TransectDetail }) {
  const habitats = useHabitatGroups();
  if (habitats.isPending) return <p>Loading habitat groups…</p>;
  if (habitats.error) return <p role="alert" className="font-bold text-rust-700">{habitats.error.message}</p>;
  return <DetailsFormFields transect={transect} habitats={habitats.data} />;
}

/** Only the fields changed are sent. */
function DetailsFormFields({ transect, habitats }: { transect: TransectDetail; habitats: HabitatGroupRow[] }) {
  const queryClient = useQueryClient();
  const defaults = { code: transect.code, name: transect.name, habitatGroupId: transect.habitatGroupId, sensitive: transect.sensitive, coastal: transect.coastal, accessNotes: transect.accessNotes ?? "" };
  const { register, handleSubmit, setError, reset, formState: { errors, dirtyFields, isDirty } } = useForm<z.input<typeof transectPatchSchema>, unknown, TransectPatch>({
    resolver: zodResolver(transectPatchSchema),
    defaultValues: defaults,
  });
  const save = useMutation({
    mutationFn: (patch: TransectPatch) => api<{ transect: TransectDetail }>(`/api/network/transects/${transect.id}`, { method: "PATCH", body: patch }),
    onSuccess: async ({ transect: saved }) => {
      queryClient.setQueryData(queryKeys.transect(transect.id), saved);
      await queryClient.invalidateQueries({ queryKey: queryKeys.transects });
      reset({ code: saved.code, name: saved.name, habitatGroupId: saved.habitatGroupId, sensitive: saved.sensitive, coastal: saved.coastal, accessNotes: saved.accessNotes ?? "" });
    },
    onError: (error) => {
      if (error instanceof ApiError) for (const n of names) if (error.fields[n]) setError(n, { message: error.fields[n]![0] });
    },
  });
  const submit = handleSubmit((values) => {
    const patch = Object.fromEntries(names.filter((n) => dirtyFields[n]).map((n) => [n, values[n]])) as TransectPatch;
    save.mutate(patch);
  });
  return (
    <form noValidate onSubmit={submit} className="space-y-3">
      <DetailsFields register={register} errors={errors} habitats={habitats} idPrefix="edit" />
      {save.isSuccess && !isDirty && <p role="status" className="font-bold text-lichen-700">Saved.</p>}
      {save.error && <p role="alert" className="font-bold text-rust-700">{save.error.message}</p>}
      <button type="submit" className="btn-primary" disabled={!isDirty || save.isPending}>{save.isPending ? "Saving…" : "Save details"}</button>
    </form>
  );
}
