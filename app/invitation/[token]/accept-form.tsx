"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import Link from "next/link";
import { useState, useTransition } from "react";
import { useForm } from "react-hook-form";
import { acceptInvitationAction } from "./actions";
import { acceptSchema, type AcceptInput } from "./schema";

export function AcceptForm({ token }: { token: string }) {
  const [done, setDone] = useState(false);
  const [message, setMessage] = useState<string | null>(null);
  const [pending, startTransition] = useTransition();
  const { register, handleSubmit, formState: { errors } } = useForm<AcceptInput>({
    resolver: zodResolver(acceptSchema),
    defaultValues: { token, password: "", confirm: "" },
  });
  if (done) {
    return (
      <p role="status">
        Your account is ready. <Link href="/sign-in" className="font-bold text-tideline-700">Sign in</Link>
      </p>
    );
  }
  return (
    <form
      noValidate
      className="space-y-4"
      onSubmit={handleSubmit((values) =>
        startTransition(async () => {
          const result = await acceptInvitationAction(values);
          if (result.ok) setDone(true);
          else setMessage(result.message);
        }),
      )}
    >
      {message && <p role="alert" className="font-bold text-rust-700">{message}</p>}
      <input type="hidden" {...register("token")} />
      <div>
        <label htmlFor="password" className="field-label">Choose a password</label>
        <input id="password" type="password" autoComplete="new-password" className="field-input" {...register("password")} />
        {errors.password && <p className="field-error">{errors.password.message}</p>}
      </div>
      <div>
        <label htmlFor="confirm" className="field-label">Type it again</label>
        <input id="confirm" type="password" autoComplete="new-password" className="field-input" {...register("confirm")} />
        {errors.confirm && <p className="field-error">{errors.confirm.message}</p>}
      </div>
      <button type="submit" className="btn-primary w-full" disabled={pending}>Create my account</button>
    </form>
  );
}
