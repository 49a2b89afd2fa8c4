import type { Role } from "@/db/schema/people";
import { REVIEWER_TITLE } from "@/lib/review/words";

/*
 * Roles and areas. A person may hold several roles (users.roles, never empty).
 *
 * The API (issue 9):
 * - `Actor` (lib/auth/guard.ts) is `{ id, roles: Role[], name, email }`, re-read from the database
 *   on every request; `roles` is never empty and in the order of `roles` below.
 * - `hasRole(actor, ...roles)`: whether the person holds ANY of those roles. Use it instead of
 *   comparing roles by hand (`actor.role` no longer exists).
 * - `requireActor(allowed)`, `requirePageActor(allowed)`, `route({ roles })` and
 *   `action({ roles })` admit a person holding ANY allowed role.
 * - `REVIEWERS` (coordinator and organiser): organisers have every reviewer power, so the review
 *   area and its API take `REVIEWERS`, not `["coordinator"]`.
 * - `areas`: each area's home, label and the roles it admits; `areasFor(roles)` lists the areas a
 *   person may enter (the shell's switcher) and `homeFor(roles)` is where sign-in lands (their
 *   first area in `areas` order). `rolesForPath(path)` is the roles a page path admits.
 * - `normaliseRoles(list)`: no repeats, in `roles` order; every write of a role list goes through it.
 */

export type { Role };
export const roles = ["volunteer", "coordinator", "organiser", "partner"] as const satisfies readonly Role[];

export const roleLabel: Record<Role, string> = {
  volunteer: "Volunteer recorder",
  coordinator: REVIEWER_TITLE,
  organiser: "Network organiser",
  partner: "Partner scientist",
};

/** "volunteer recorder and reviewer", for sentences. */
export function rolesInWords(list: readonly Role[]): string {
  const words = normaliseRoles(list).map((r) => roleLabel[r].toLowerCase());
  return words.length > 1 ? `${words.slice(0, -1).join(", ")} and ${words.at(-1)}` : (words[0] ?? "");
}

/** Who reviews sightings: organisers have every reviewer power. */
export const REVIEWERS = ["coordinator", "organiser"] as const satisfies readonly Role[];

export type Area = { home: string; label: string; roles: readonly Role[] };

/** Page areas and the roles each admits, in the order sign-in prefers (homeFor, rolesForPath and the area switcher read this; pages decide with requirePageActor(roles)). */
export const areas: readonly Area[] = [
  { home: "/network", label: "Network", roles: ["organiser"] },
  { home: "/review", label: "Reviewing", roles: REVIEWERS },
  { home: "/field", label: "Recording", roles: ["volunteer"] },
  { home: "/data", label: "Network data", roles: ["partner"] },
];

export function hasRole(who: { roles: readonly Role[] }, ...wanted: readonly Role[]): boolean {
  return who.roles.some((r) => wanted.includes(r));
}

/** The areas a person holding these roles may enter, in `areas` order. */
export function areasFor(held: readonly Role[]): Area[] {
  return areas.filter((a) => a.roles.some((r) => held.includes(r)));
}

/** Where a person lands after sign-in: their first area. */
export function homeFor(held: readonly Role[]): string {
  return areasFor(held)[0]?.home ?? "/account";
}

export function rolesForPath(pathname: string): readonly Role[] | null {
  const area = areas.find((a) => pathname === a.home || pathname.startsWith(`${a.home}/`));
  return area ? area.roles : null;
}

export function isRole(value: unknown): value is Role {
  return typeof value === "string" && (roles as readonly string[]).includes(value);
}

/** No repeats, in `roles` order. */
export function normaliseRoles(list: readonly Role[]): Role[] {
  return roles.filter((r) => list.includes(r));
}
