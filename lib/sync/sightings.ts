import type { sightings } from "@/db/schema";
import { REVIEWER } from "@/lib/review/words";
import type { ItemResult, SightingPayload } from "./contract";
import type { Indexed } from "./parse";
import { olderThanServer, sameFields } from "./same";
import type { ServerSighting, ServerState } from "./server-state";
import type { VisitStanding } from "./visits";

export type SightingRow = typeof sightings.$inferInsert & { id: string; visitId: string; clientUpdatedAt: Date };

export type SightingPlan = { results: ItemResult[]; writes: SightingRow[]; deletes: string[] };

const compared = ["visitId", "speciesId", "count", "section", "latitude", "longitude", "accuracyMetres", "note", "clientUpdatedAt"] as const;

export const SIGHTING_REASONS = {
  otherVolunteer: "This sighting belongs to another volunteer.",
  unknownVisit: "Turnstone does not have this sighting's walk.",
  reviewed: `A ${REVIEWER} has already reviewed this sighting, so it stays as Turnstone has it.`,
  newer: "Turnstone already has a newer change to this sighting.",
  alreadyAbsent: "Turnstone has no such sighting.",
} as const;

/** Reviewed sightings are the reviewers': resends never overwrite or delete them. */
export function isReviewed(s: Pick<ServerSighting, "status" | "reviewedAt">): boolean {
  return s.status !== "pending" || s.reviewedAt !== null;
}

/** A phone with an old checklist may name a species merged away since: it counts as the one kept. */
function toRow(s: SightingPayload, state: ServerState): SightingRow {
  return {
    id: s.id,
    visitId: s.visitId,
    speciesId: state.mergedInto.get(s.speciesId) ?? s.speciesId,
    count: s.count,
    section: s.section ?? null,
    latitude: s.latitude ?? null,
    longitude: s.longitude ?? null,
    accuracyMetres: s.accuracyMetres ?? null,
    note: s.note ?? null,
    clientUpdatedAt: new Date(s.clientUpdatedAt),
  };
}

type Decision = { status: ItemResult["status"]; reason?: string; errors?: Record<string, string[]> };

function decideDelete(s: SightingPayload, server: ServerSighting | undefined): Decision {
  if (!server) return { status: "unchanged", reason: SIGHTING_REASONS.alreadyAbsent };
  if (isReviewed(server)) return { status: "kept-server", reason: SIGHTING_REASONS.reviewed };
  if (olderThanServer(new Date(s.clientUpdatedAt), server.clientUpdatedAt)) return { status: "kept-server", reason: SIGHTING_REASONS.newer };
  return { status: "deleted" };
}

function decideWrite(row: SightingRow, server: ServerSighting | undefined, standing: VisitStanding, state: ServerState): Decision {
  if (standing.kind === "unknown") {
    return {
      status: "invalid",
      reason: SIGHTING_REASONS.unknownVisit,
      errors: { visitId: ["Send the walk first, or correct it if it was refused."] },
    };
  }
  const errors: Record<string, string[]> = {};
  if (!state.knownSpecies.has(row.speciesId)) errors.speciesId = ["That species is not on the checklist."];
  if (standing.kind === "own" && row.section != null && row.section > standing.sectionCount) {
    errors.section = [`This transect has ${standing.sectionCount} section${standing.sectionCount === 1 ? "" : "s"}.`];
  }
  if (Object.keys(errors).length) return { status: "invalid", errors };
  if (!server) return { status: "created" };
  if (sameFields(compared, row, server)) return { status: "unchanged" };
  if (isReviewed(server)) return { status: "kept-server", reason: SIGHTING_REASONS.reviewed };
  if (olderThanServer(row.clientUpdatedAt, server.clientUpdatedAt)) return { status: "kept-server", reason: SIGHTING_REASONS.newer };
  return { status: "updated" };
}

/**
 * Decides each valid sighting. `standingOf` says whether its visit is the volunteer's (in this
 * batch or already stored), someone else's, or unknown.
 */
export function planSightings(
  actorId: string,
  items: Indexed<SightingPayload>[],
  state: ServerState,
  standingOf: (visitId: string) => VisitStanding,
): SightingPlan {
  const results: ItemResult[] = [];
  const writes: SightingRow[] = [];
  const deletes: string[] = [];
  for (const { index, value } of items) {
    const server = state.sightings.get(value.id);
    const standing = standingOf(value.visitId);
    let decision: Decision;
    if (server && server.ownerId !== actorId) decision = { status: "forbidden", reason: SIGHTING_REASONS.otherVolunteer };
    else if (standing.kind === "forbidden") decision = { status: "forbidden", reason: standing.reason };
    else if (standing.kind === "frozen") decision = server || !value.deleted ? { status: "kept-server", reason: standing.reason } : decideDelete(value, server);
    else if (value.deleted) decision = decideDelete(value, server);
    else decision = decideWrite(toRow(value, state), server, standing, state);

    results.push({ kind: "sighting", id: value.id, index, ...decision });
    if (decision.status === "deleted") deletes.push(value.id);
    if (decision.status === "created" || decision.status === "updated") writes.push(toRow(value, state));
  }
  return { results, writes, deletes };
}
