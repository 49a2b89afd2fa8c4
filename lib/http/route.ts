import "server-only";
import { NextResponse } from "next/server";
import type { z } from "zod";
import { requireActor, type Actor } from "@/lib/auth/guard";
import type { Role } from "@/lib/auth/roles";
import { invalid, isAppError } from "@/lib/errors";
import { requestBodyLimits, type RequestBodyLimit } from "@/lib/limits/request-bodies";
import { fieldErrorsOf } from "@/lib/validation";
import { isWrite, readBody, refuseByHeaders, type BodyKind } from "./read-body";

type Handler<B, Q, P> = (ctx: { actor: Actor; body: B; query: Q; params: P; request: Request }) => Promise<Response | unknown>;

type Options<B extends z.ZodType | undefined, Q extends z.ZodType | undefined> = {
  roles: readonly Role[];
  body?: B;
  query?: Q;
  /** The body's size cap, by its name in lib/limits/request-bodies.ts; "json" unless said. */
  bodyLimit?: RequestBodyLimit;
  /** What a write's body may be: JSON unless the route must take a form post (see read-body.ts). */
  accepts?: BodyKind;
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

/**
 * Wraps a route handler: refuses a write's body by its declared type (415) or size (413), checks
 * the session and role, reads the body with its byte cap (413), validates query and body with
 * zod, and turns typed errors into JSON answers (400 with field messages, 401, 403, 404...).
 */
export function route<B extends z.ZodType | undefined = undefined, Q extends z.ZodType | undefined = undefined, P = Record<string, string>>(
  options: Options<B, Q>,
  handler: Handler<Infer<B>, Infer<Q>, P>,
) {
  return async (request: Request, context: { params: Promise<P> }): Promise<Response> => {
    try {
      const kind = options.accepts ?? "json";
      const limit = requestBodyLimits[options.bodyLimit ?? "json"];
      const write = isWrite(request);
      // From the headers alone, before the session costs a database read.
      if (write) refuseByHeaders(request, kind, limit);
      const actor = await requireActor(options.roles, request.headers);
      let query = undefined as Infer<Q>;
      if (options.query) {
        const raw = Object.fromEntries(new URL(request.url).searchParams);
        const parsed = options.query.safeParse(raw);
        if (!parsed.success) throw invalid(fieldErrorsOf(parsed.error));
        query = parsed.data as Infer<Q>;
      }
      let body = undefined as Infer<B>;
      // Every write's body is read with its cap, even where the handler ignores it: a body that
      // is there must be of the declared kind.
      const received = write ? await readBody(request, kind, limit) : undefined;
      if (options.body) {
        const parsed = options.body.safeParse(received);
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
