"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useMutation, useQueryClient } from "@tanstack/react-query";
import { useForm } from "react-hook-form";
import { ApiError, api, seasonKeys } from "./api";
import { graceDaysSchema, type GraceDaysInput, type GraceDaysValues } from "./schema";

/** The days after closing during which late walks and checking are still taken, for every season. */
export function GraceForm({ graceDays }: { graceDays: number }) {
  const queryClient = useQueryClient();
  const { register, handleSubmit, setError, formState: { errors, isDirty } } = useForm<GraceDaysInput, unknown, GraceDaysValues>({
    resolver: zodResolver(graceDaysSchema),
    values: { graceDays },
  });
  const save = useMutation({
    mutationFn: (values: GraceDaysValues) => api("/api/network/settings/season-grace", { method: "PUT", body: values }),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: seasonKeys.overview }),
    onError: (error) => {
      if (error instanceof ApiError && error.fields.graceDays) setError("graceDays", { message: error.fields.graceDays[0]! });
    },
  });
  return (
    <form noValidate onSubmit={handleSubmit((v) => save.mutate(v))} className="space-y-3">
      <div className="max-w-xs">
        <label htmlFor="grace-days" className="field-label">Days after closing</label>
        <input id="grace-days" type="number" inputMode="numeric" className="field-input" {...register("graceDays", { valueAsNumber: true })} />
        {errors.graceDays && <p className="field-error">{errors.graceDays.message}</p>}
      </div>
      <p className="text-sm text-shingle-700">
        Changing this moves the end of every closed season&apos;s grace period; a longer one lets late walks into a season that was frozen, and the history records the change.
      </p>
      {save.error && !(save.error instanceof ApiError && save.error.fields.graceDays) && <p role="alert" className="font-bold text-rust-700">{save.error.message}</p>}
      {save.isSuccess && !isDirty && <p role="status" className="text-tideline-800">Saved.</p>}
      <button type="submit" className="btn-primary" disabled={save.isPending}>Save grace period</button>
    </form>
  );
}
