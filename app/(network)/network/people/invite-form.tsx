"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useMutation, useQueryClient } from "@tanstack/react-query";
import { useForm } from "react-hook-form";
import type { z } from "zod";
import { ApiError, api, peopleKeys } from "./people-api";
import { RoleChoices } from "./role-choices";
import { inviteSchema, type InviteInput } from "./schema";

type InviteValues = z.output<typeof inviteSchema>;
const fields = ["name", "email", "roles"] as const;

export function InviteForm() {
  const queryClient = useQueryClient();
  const { register, handleSubmit, reset, setError, formState: { errors } } = useForm<InviteInput, unknown, InviteValues>({
    resolver: zodResolver(inviteSchema),
    defaultValues: { name: "", email: "", roles: ["volunteer"] },
  });
  const invite = useMutation({
    mutationFn: (values: InviteValues) => api<{ invitation: { email: string } }>("/api/network/people", { body: values }),
    onSuccess: async () => {
      reset();
      await queryClient.invalidateQueries({ queryKey: peopleKeys.all });
    },
    onError: (error) => {
      if (error instanceof ApiError) for (const f of fields) if (error.fields[f]) setError(f, { message: error.fields[f]![0]! });
    },
  });

  return (
    <form onSubmit={handleSubmit((v) => invite.mutate(v))} noValidate className="space-y-3">
      <div className="grid gap-3 sm:grid-cols-2">
        <div>
          <label htmlFor="invite-name" className="field-label">Name</label>
          <input id="invite-name" className="field-input" {...register("name")} />
          {errors.name && <p className="field-error">{errors.name.message}</p>}
        </div>
        <div>
          <label htmlFor="invite-email" className="field-label">E-mail</label>
          <input id="invite-email" type="email" className="field-input" {...register("email")} />
          {errors.email && <p className="field-error">{errors.email.message}</p>}
        </div>
      </div>
      <RoleChoices idPrefix="invite" register={register("roles")} error={errors.roles?.message ?? errors.roles?.root?.message} />
      <button type="submit" className="btn-primary" disabled={invite.isPending}>{invite.isPending ? "Sending…" : "Send invitation"}</button>
      <p role="status" className={`font-bold ${invite.isError ? "text-rust-700" : "text-lichen-700"}`}>
        {invite.isSuccess ? `Invitation sent to ${invite.data.invitation.email}.` : invite.isError ? invite.error.message : ""}
      </p>
    </form>
  );
}
