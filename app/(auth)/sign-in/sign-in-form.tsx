"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useState, useTransition } from "react";
import { useForm } from "react-hook-form";
import { signInAction } from "./actions";
import { signInSchema, type SignInInput } from "./schema";

export function SignInForm({ from }: { from?: string }) {
  const [message, setMessage] = useState<string | null>(null);
  const [pending, startTransition] = useTransition();
  const {
    register,
    handleSubmit,
    setError,
    formState: { errors },
  } = useForm<SignInInput>({ resolver: zodResolver(signInSchema), defaultValues: { email: "", password: "", from } });

  const onSubmit = handleSubmit((values) => {
    setMessage(null);
    startTransition(async () => {
      const result = await signInAction(values);
      if (result && !result.ok) {
        setMessage(result.message);
        for (const [field, msgs] of Object.entries(result.fieldErrors ?? {})) {
          if (field === "email" || field === "password") setError(field, { message: msgs[0] });
        }
      }
    });
  });

  return (
    <form onSubmit={onSubmit} noValidate className="space-y-4" aria-describedby={message ? "sign-in-message" : undefined}>
      {message && (
        <p id="sign-in-message" role="alert" className="rounded-lg border border-rust-700 bg-rust-100 p-3 font-bold text-rust-700">
          {message}
        </p>
      )}
      <div>
        <label htmlFor="email" className="field-label">E-mail</label>
        <input id="email" type="email" autoComplete="email" className="field-input" aria-invalid={Boolean(errors.email)} aria-describedby={errors.email ? "email-error" : undefined} {...register("email")} />
        {errors.email && <p id="email-error" className="field-error">{errors.email.message}</p>}
      </div>
      <div>
        <label htmlFor="password" className="field-label">Password</label>
        <input id="password" type="password" autoComplete="current-password" className="field-input" aria-invalid={Boolean(errors.password)} aria-describedby={errors.password ? "password-error" : undefined} {...register("password")} />
        {errors.password && <p id="password-error" className="field-error">{errors.password.message}</p>}
      </div>
      <input type="hidden" {...register("from")} />
      <button type="submit" className="btn-primary w-full" disabled={pending}>
        {pending ? "Signing in…" : "Sign in"}
      </button>
    </form>
  );
}
