import type { Role } from "@/db/schema/people";

export type { Role };
export const roles = ["volunteer", "coordinator", "organiser", "partner"] as const satisfies readonly Role[];

/** Where each role lands after sign-in. Each area belongs to one role. */
export const roleHome: Record<Role, string> = {
  volunteer: "/field",
  coordinator: "/review",
  organiser: "/network",
  partner: "/data",
};

export const roleLabel: Record<Role, string> = {
  volunteer: "Volunteer recorder",
  coordinator: "Record checker",
  organiser: "Network organiser",
  partner: "Partner scientist",
};

/** Page areas and the roles allowed in them; the proxy and the server guard both read this. */
export const areaRoles: { prefix: string; roles: readonly Role[] }[] = [
  { prefix: "/field", roles: ["volunteer"] },
  { prefix: "/review", roles: ["coordinator"] },
  { prefix: "/network", roles: ["organiser"] },
  { prefix: "/data", roles: ["partner"] },
];

export function rolesForPath(pathname: string): readonly Role[] | null {
  const area = areaRoles.find((a) => pathname === a.prefix || pathname.startsWith(`${a.prefix}/`));
  return area ? area.roles : null;
}

export function isRole(value: unknown): value is Role {
  return typeof value === "string" && (roles as readonly string[]).includes(value);
}
