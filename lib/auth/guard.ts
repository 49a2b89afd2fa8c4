import "server-only";
import { eq, sql } from "drizzle-orm";
import { forbidden as forbiddenPage, redirect, unauthorized as unauthorizedPage } from "next/navigation";
import { db } from "@/db/client";
import { users } from "@/db/schema";
import { forbidden, unauthorized } from "@/lib/errors";
import { hasRole, type Role } from "./roles";
import { sessionUserId } from "./session";

/** The signed-in person; `roles` is never empty (see the API note in lib/auth/roles.ts). */
export type Actor = { id: string; roles: Role[]; name: string; email: string };

// Prepared once: this runs on every request, and a prepared statement saves a round trip.
let prepared: ReturnType<typeof prepareActorQuery> | undefined;
function prepareActorQuery() {
  return db()
    .select({ id: users.id, roles: users.roles, name: users.name, email: users.email, active: users.active })
    .from(users)
    .where(eq(users.id, sql.placeholder("id")))
    .limit(1)
    .prepare("current_actor");
}
function actorQuery() {
  prepared ??= prepareActorQuery();
  return prepared;
}

/**
 * The signed-in person, re-read from the database on every request so a role change or a
 * deactivation takes effect at once rather than when the session cookie expires.
 */
export async function currentActor(requestHeaders?: Headers): Promise<Actor | null> {
  const id = await sessionUserId(requestHeaders);
  if (!id) return null;
  const [row] = await actorQuery().execute({ id });
  if (!row || !row.active) return null;
  return { id: row.id, roles: row.roles, name: row.name, email: row.email };
}

/** For route handlers (pass the request's headers) and server actions: throws 401 / 403 AppErrors. Any allowed role admits. */
export async function requireActor(allowed?: readonly Role[], requestHeaders?: Headers): Promise<Actor> {
  const actor = await currentActor(requestHeaders);
  if (!actor) throw unauthorized();
  if (allowed && !hasRole(actor, ...allowed)) throw forbidden();
  return actor;
}

/** For pages and layouts: sends strangers to sign-in and renders 403 unless the person holds an allowed role. */
export async function requirePageActor(allowed: readonly Role[], returnTo?: string): Promise<Actor> {
  const actor = await currentActor();
  if (!actor) {
    if (returnTo) redirect(`/sign-in?from=${encodeURIComponent(returnTo)}`);
    unauthorizedPage();
  }
  if (!hasRole(actor, ...allowed)) forbiddenPage();
  return actor;
}
