"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useMutation, useQueryClient } from "@tanstack/react-query";
import { useForm } from "react-hook-form";
import type { z } from "zod";
import { ApiError, api, peopleKeys, type PersonAnswer } from "../people-api";
import { RoleChoices } from "../role-choices";
import { personPatchSchema, type PersonPatch } from "../schema";

type Values = z.output<typeof personPatchSchema>;

/** Roles and whether the person may sign in (deactivate, reactivate). */
export function RolesForm({ person }: { person: PersonAnswer["person"] }) {
  const queryClient = useQueryClient();
  const { register, handleSubmit, reset, setError, formState: { errors, isDirty } } = useForm<PersonPatch, unknown, Values>({
    resolver: zodResolver(personPatchSchema),
    values: { roles: person.roles, active: person.active },
  });
  const save = useMutation({
    mutationFn: (values: Values) => api(`/api/network/people/${person.id}`, { method: "PATCH", body: values }),
    onSuccess: async () => {
      await queryClient.invalidateQueries({ queryKey: peopleKeys.all });
    },
    onError: (error) => {
      reset(undefined, { keepValues: true, keepDirty: true });
      if (error instanceof ApiError) for (const f of ["roles", "active"] as const) if (error.fields[f]) setError(f, { message: error.fields[f]![0]! });
    },
  });
  return (
    <form noValidate onSubmit={handleSubmit((v) => save.mutate(v))} className="card space-y-3" aria-labelledby="access-heading">
      <h2 id="access-heading" className="text-xl font-bold">Roles and access</h2>
      <RoleChoices idPrefix="person" register={register("roles")} error={errors.roles?.message ?? errors.roles?.root?.message} />
      <label className="flex min-h-tap items-center gap-2">
        <input type="checkbox" className="h-5 w-5" {...register("active")} />
        Active: may sign in
      </label>
      {errors.active && <p className="field-error">{errors.active.message}</p>}
      <button type="submit" className="btn-primary" disabled={!isDirty || save.isPending}>Save</button>
      <p role="status" className={`font-bold ${save.isError ? "text-rust-700" : "text-lichen-700"}`}>
        {save.isSuccess && !isDirty ? "Saved." : save.isError && !(save.error instanceof ApiError && Object.keys(save.error.fields).length) ? save.error.message : ""}
      </p>
    </form>
  );
}
