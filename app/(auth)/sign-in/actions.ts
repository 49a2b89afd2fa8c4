"use server";

import { eq, sql } from "drizzle-orm";
import { AuthError } from "next-auth";
import { redirect } from "next/navigation";
import { TooManyAttempts, signIn } from "@/auth";
import { db } from "@/db/client";
import { users } from "@/db/schema";
import { waitInWords } from "@/lib/auth/rate-limit";
import { safeReturnPath } from "@/lib/auth/return-path";
import { homeFor } from "@/lib/auth/roles";
import { env } from "@/lib/env";
import { fieldErrorsOf } from "@/lib/validation";
import type { FieldErrors } from "@/lib/errors";
import { signInSchema } from "./schema";

export type SignInResult = { ok: false; message: string; fieldErrors?: FieldErrors };

export async function signInAction(input: unknown): Promise<SignInResult> {
  const parsed = signInSchema.safeParse(input);
  if (!parsed.success) return { ok: false, message: "Some fields need attention.", fieldErrors: fieldErrorsOf(parsed.error) };
  try {
    await signIn("credentials", { email: parsed.data.email, password: parsed.data.password, redirect: false });
  } catch (error) {
    if (error instanceof TooManyAttempts) {
      return { ok: false, message: `Too many sign-in attempts. Try again in ${waitInWords(error.retryAfterMs)}.` };
    }
    if (error instanceof AuthError) {
      // The same words whether the e-mail is unknown or the password is wrong.
      return { ok: false, message: "That e-mail and password do not match an active account." };
    }
    throw error;
  }
  // Signed in: go straight to the page asked for when it is on this site, or to the person's first area.
  const [user] = await db().select({ roles: users.roles }).from(users).where(eq(sql`lower(${users.email})`, parsed.data.email.toLowerCase())).limit(1);
  redirect(safeReturnPath(parsed.data.from, env().APP_URL) ?? (user ? homeFor(user.roles) : "/"));
}
