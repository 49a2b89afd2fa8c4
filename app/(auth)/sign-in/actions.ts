"use server";

import { AuthError } from "next-auth";
import { signIn } from "@/auth";
import { fieldErrorsOf } from "@/lib/validation";
import type { FieldErrors } from "@/lib/errors";
import { signInSchema } from "./schema";

export type SignInResult = { ok: false; message: string; fieldErrors?: FieldErrors };

// Only same-site paths are followed after sign-in, so a crafted link cannot bounce people elsewhere.
function safeReturnPath(from: string | undefined): string {
  return from && from.startsWith("/") && !from.startsWith("//") ? from : "/";
}

export async function signInAction(input: unknown): Promise<SignInResult> {
  const parsed = signInSchema.safeParse(input);
  if (!parsed.success) return { ok: false, message: "Some fields need attention.", fieldErrors: fieldErrorsOf(parsed.error) };
  try {
    await signIn("credentials", {
      email: parsed.data.email,
      password: parsed.data.password,
      redirectTo: safeReturnPath(parsed.data.from),
    });
  } catch (error) {
    if (error instanceof AuthError) {
      const code = "code" in error ? String((error as { code?: unknown }).code) : "";
      if (code === "too_many_attempts") {
        return { ok: false, message: "Too many sign-in attempts. Please wait 15 minutes and try again." };
      }
      // The same words whether the e-mail is unknown or the password is wrong.
      return { ok: false, message: "That e-mail and password do not match an active account." };
    }
    throw error; // a successful sign-in redirects by throwing
  }
  return { ok: false, message: "Sign-in did not complete. Please try again." };
}
