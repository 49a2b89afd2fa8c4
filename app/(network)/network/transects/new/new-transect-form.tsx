"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useMutation, useQueryClient } from "@tanstack/react-query";
import Link from "next/link";
import { useRouter } from "next/navigation";
import { useEffect, useState } from "react";
import { useForm, useWatch } from "react-hook-form";
import { ApiError, api, messagesUnder, queryKeys } from "../api";
import { DetailsFields } from "../details-fields";
import { RouteBuilder, draftSections, emptyDraft, type RouteDraft } from "../route-builder";
import { createTransectSchema, type CreateTransectInput, type CreateTransectValues } from "../schema";
import { useHabitatGroups } from "../use-habitats";

const detailFields = ["code", "name", "habitatGroupId", "sensitive", "coastal", "accessNotes"] as const;

export function NewTransectForm({ tileUrl }: { tileUrl: string | null }) {
  const router = useRouter();
  const queryClient = useQueryClient();
  const habitats = useHabitatGroups();
  const [draft, setDraft] = useState<RouteDraft>(emptyDraft);
  const { register, handleSubmit, setValue, setError, control, formState: { errors } } = useForm<CreateTransectInput, unknown, CreateTransectValues>({
    resolver: zodResolver(createTransectSchema),
    defaultValues: { code: "", name: "", habitatGroupId: "", sensitive: false, coastal: false, accessNotes: "", route: { sections: [] } },
  });
  // The route is not a plain input: the builder's sections are the form's "route" value.
  useEffect(() => setValue("route", { sections: draftSections(draft) }), [draft, setValue]);
  const habitatGroupId = useWatch({ control, name: "habitatGroupId" });
  const colour = habitats.data?.find((h) => h.id === habitatGroupId)?.colour ?? "slate";

  const create = useMutation({
    mutationFn: (values: CreateTransectValues) => api<{ transect: { id: string } }>("/api/network/transects", { body: values }),
    onSuccess: async ({ transect }) => {
      await queryClient.invalidateQueries({ queryKey: queryKeys.transects });
      router.push(`/network/transects/${transect.id}`);
    },
    onError: (error) => {
      if (!(error instanceof ApiError)) return;
      for (const field of detailFields) if (error.fields[field]) setError(field, { message: error.fields[field]![0] });
    },
  });

  const routeErrors = [...messagesUnder(create.error, "route"), ...(errors.route ? [errors.route.message ?? "Draw the route or import a file."].filter(Boolean) : [])];

  return (
    <form noValidate onSubmit={handleSubmit((values) => create.mutate(values))} className="space-y-6">
      <div className="flex flex-wrap items-center justify-between gap-3">
        <h1 className="text-2xl font-bold text-tideline-800">New transect</h1>
        <Link href="/network/transects" className="btn-quiet">Back to transects</Link>
      </div>
      <section aria-labelledby="details-heading" className="card space-y-3">
        <h2 id="details-heading" className="text-xl font-bold">Details</h2>
        {habitats.isPending ? <p>Loading habitat groups…</p> : <DetailsFields register={register} errors={errors} habitats={habitats.data ?? []} idPrefix="new" />}
      </section>
      <section aria-labelledby="route-heading" className="card space-y-3">
        <h2 id="route-heading" className="text-xl font-bold">Route and sections</h2>
        <RouteBuilder draft={draft} onChange={setDraft} colour={colour} tileUrl={tileUrl} serverErrors={routeErrors} />
      </section>
      {create.error && !(create.error instanceof ApiError && Object.keys(create.error.fields).length) && (
        <p role="alert" className="font-bold text-rust-700">{create.error.message}</p>
      )}
      <button type="submit" className="btn-primary" disabled={create.isPending}>{create.isPending ? "Saving…" : "Create transect"}</button>
    </form>
  );
}
