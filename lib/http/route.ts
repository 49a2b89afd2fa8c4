import "server-only";
import { NextResponse } from "next/server";
import type { z } from "zod";
import { requireActor, type Actor } from "@/lib/auth/guard";
import type { Role } from "@/lib/auth/roles";
import { invalid, isAppError } from "@/lib/errors";
import { fieldErrorsOf } from "@/lib/validation";

type Handler<B, Q, P> = (ctx: { actor: Actor; body: B; query: Q; params: P; request: Request }) => Promise<Response | unknown>;

type Options<B extends z.ZodType | undefined, Q extends z.ZodType | undefined> = {
  roles: readonly Role[];
  body?: B;
  query?: Q;
};

type Infer<S> = S extends z.ZodType ? z.infer<S> : undefined;

export function errorResponse(error: unknown): NextResponse {
  if (isAppError(error)) {
    return NextResponse.json(
      { error: { code: error.code, message: error.message, ...(error.fieldErrors ? { fields: error.fieldErrors } : {}) } },
      { status: error.status },
    );
  }
  console.error("[turnstone] unexpected error in route", error);
  return NextResponse.json({ error: { code: "internal", message: "Something went wrong on our side. Nothing was changed." } }, { status: 500 });
}

async function readJson(request: Request): Promise<unknown> {
  const text = await request.text();
  if (!text) return undefined;
  try {
    return JSON.parse(text);
  } catch {
    throw invalid({ _: ["The request body is not valid JSON."] }, "The request body is not valid JSON.");
  }
}

/**
 * Wraps a route handler: checks the session and role, validates query and body with zod,
 * and turns typed errors into JSON answers (400 with field messages, 401, 403, 404...).
 */
export function route<B extends z.ZodType | undefined = undefined, Q extends z.ZodType | undefined = undefined, P = Record<string, string>>(
  options: Options<B, Q>,
  handler: Handler<Infer<B>, Infer<Q>, P>,
) {
  return async (request: Request, context: { params: Promise<P> }): Promise<Response> => {
    try {
      const actor = await requireActor(options.roles, request.headers);
      let query = undefined as Infer<Q>;
      if (options.query) {
        const raw = Object.fromEntries(new URL(request.url).searchParams);
        const parsed = options.query.safeParse(raw);
        if (!parsed.success) throw invalid(fieldErrorsOf(parsed.error));
        query = parsed.data as Infer<Q>;
      }
      let body = undefined as Infer<B>;
      if (options.body) {
        const parsed = options.body.safeParse(await readJson(request));
        if (!parsed.success) throw invalid(fieldErrorsOf(parsed.error));
        body = parsed.data as Infer<B>;
      }
      const params = (await context?.params) ?? ({} as P);
      const result = await handler({ actor, body, query, params, request });
      return result instanceof Response ? result : NextResponse.json(result);
    } catch (error) {
      return errorResponse(error);
    }
  };
}
