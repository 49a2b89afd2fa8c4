"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useState, useTransition } from "react";
import { useForm } from "react-hook-form";
import { roleLabel, roles } from "@/lib/auth/roles";
import { inviteAction } from "./actions";
import { inviteSchema, type InviteInput } from "./schema";

export function InviteForm() {
  const [notice, setNotice] = useState<{ ok: boolean; text: string } | null>(null);
  const [pending, startTransition] = useTransition();
  const { register, handleSubmit, reset, setError, formState: { errors } } = useForm<InviteInput>({
    resolver: zodResolver(inviteSchema),
    defaultValues: { name: "", email: "", role: "volunteer" },
  });

  const onSubmit = handleSubmit((values) =>
    startTransition(async () => {
      const result = await inviteAction(values);
      if (result.ok) {
        setNotice({ ok: true, text: `Invitation sent to ${result.data.email}.` });
        reset();
      } else {
        setNotice({ ok: false, text: result.message });
        for (const [field, msgs] of Object.entries(result.fieldErrors ?? {})) {
          if (field === "name" || field === "email" || field === "role") setError(field, { message: msgs[0] });
        }
      }
    }),
  );

  return (
    <form onSubmit={onSubmit} noValidate className="grid gap-3 sm:grid-cols-4 sm:items-end">
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
      <div>
        <label htmlFor="invite-role" className="field-label">Role</label>
        <select id="invite-role" className="field-input" {...register("role")}>
          {roles.map((r) => (
            <option key={r} value={r}>{roleLabel[r]}</option>
          ))}
        </select>
      </div>
      <button type="submit" className="btn-primary" disabled={pending}>{pending ? "Sending…" : "Send invitation"}</button>
      {notice && (
        <p role="status" className={`sm:col-span-4 font-bold ${notice.ok ? "text-lichen-700" : "text-rust-700"}`}>{notice.text}</p>
      )}
    </form>
  );
}
