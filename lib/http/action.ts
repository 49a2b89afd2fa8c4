import "server-only";
import type { z } from "zod";
import { requireActor, type Actor } from "@/lib/auth/guard";
import type { Role } from "@/lib/auth/roles";
import { isAppError, type FieldErrors } from "@/lib/errors";
import { fieldErrorsOf } from "@/lib/validation";

export type ActionResult<T> = { ok: true; data: T } | { ok: false; message: string; fieldErrors?: FieldErrors };

/**
 * Wraps a server action: validates its input with zod and re-checks the session and role
 * inside the action itself (the proxy is only a first filter). Ownership checks belong in
 * the query layer the action calls, which receives the actor.
 */
export function action<S extends z.ZodType, T>(
  options: { roles: readonly Role[]; schema: S },
  run: (input: z.infer<S>, actor: Actor) => Promise<T>,
) {
  return async (input: unknown): Promise<ActionResult<T>> => {
    try {
      const actor = await requireActor(options.roles);
      const parsed = options.schema.safeParse(input);
      if (!parsed.success) return { ok: false, message: "Some fields need attention.", fieldErrors: fieldErrorsOf(parsed.error) };
      return { ok: true, data: await run(parsed.data, actor) };
    } catch (error) {
      if (isAppError(error)) return { ok: false, message: error.message, fieldErrors: error.fieldErrors };
      // Next's redirect() and notFound() work by throwing; let them through.
      if (error instanceof Error && "digest" in error) throw error;
      console.error("[turnstone] unexpected error in action", error);
      return { ok: false, message: "Something went wrong on our side. Nothing was changed." };
    }
  };
}
