import "server-only";
import { and, eq, inArray } from "drizzle-orm";
import { db } from "@/db/client";
import { transectAssignments } from "@/db/schema";
import type { Actor } from "@/lib/auth/guard";
import { hasRole, REVIEWERS } from "@/lib/auth/roles";
import { generalise, type GeneralisedRoute } from "@/lib/geo/generalise";
import type { LineString } from "@/lib/geo/types";

// A sensitive transect's exact route never leaves the server except for the network's reviewers
// and organisers and the volunteers assigned to it (who need it to walk). Everyone else gets
// where it is, to 0.1° (lib/geo/generalise.ts). Every answer that carries a route goes through here.

export type VisibleRoute = LineString | GeneralisedRoute;

/** Roles that see every exact route. */
const SEE_EVERY_ROUTE = REVIEWERS;

type WithRoute = { id: string; sensitive: boolean; route: LineString };

/** The same rows with each route as this actor may see it (one query for a volunteer's assignments). */
export async function withVisibleRoutes<T extends WithRoute>(actor: Actor, rows: T[]): Promise<(Omit<T, "route"> & { route: VisibleRoute })[]> {
  const sensitiveIds = rows.filter((r) => r.sensitive).map((r) => r.id);
  let assigned = new Set<string>();
  if (sensitiveIds.length > 0 && !hasRole(actor, ...SEE_EVERY_ROUTE)) {
    const mine = await db()
      .select({ transectId: transectAssignments.transectId })
      .from(transectAssignments)
      .where(and(eq(transectAssignments.userId, actor.id), inArray(transectAssignments.transectId, sensitiveIds)));
    assigned = hasRole(actor, "volunteer") ? new Set(mine.map((m) => m.transectId)) : new Set();
  }
  return rows.map((row) => {
    const exact = !row.sensitive || hasRole(actor, ...SEE_EVERY_ROUTE) || assigned.has(row.id);
    return { ...row, route: exact ? row.route : generalise(row.route) };
  });
}

export async function visibleRoute<T extends WithRoute>(actor: Actor, row: T) {
  const [one] = await withVisibleRoutes(actor, [row]);
  return one!;
}
