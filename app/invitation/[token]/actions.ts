"use server";

import { headers } from "next/headers";
import { isAppError, type FieldErrors } from "@/lib/errors";
import { clientAddress } from "@/lib/http/client-address";
import { acceptInvitation } from "@/lib/queries/people";
import { fieldErrorsOf } from "@/lib/validation";
import { acceptSchema } from "./schema";

export type AcceptResult = { ok: true } | { ok: false; message: string; fieldErrors?: FieldErrors };

export async function acceptInvitationAction(input: unknown): Promise<AcceptResult> {
  const parsed = acceptSchema.safeParse(input);
  if (!parsed.success) return { ok: false, message: "Some fields need attention.", fieldErrors: fieldErrorsOf(parsed.error) };
  try {
    await acceptInvitation(parsed.data.token, parsed.data.password, clientAddress(await headers()));
    return { ok: true };
  } catch (error) {
    if (isAppError(error)) return { ok: false, message: error.message };
    console.error("[turnstone] accepting invitation failed", error);
    return { ok: false, message: "Something went wrong on our side. Please try again." };
  }
}
