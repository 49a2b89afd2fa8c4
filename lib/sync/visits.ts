import type { visits } from "@/db/schema";
import type { Actor } from "@/lib/auth/guard";
import type { ItemResult, VisitPayload } from "./contract";
import type { Indexed } from "./parse";
import { clockWithSeconds, olderThanServer, sameFields } from "./same";
import { seasonFor, type ServerState, type ServerVisit } from "./server-state";

export type VisitRow = typeof visits.$inferInsert & { id: string; clientUpdatedAt: Date; transectId: string };

/** Where a visit stands after this batch: sightings are checked against it. */
export type VisitStanding = { kind: "own"; sectionCount: number } | { kind: "forbidden"; reason: string } | { kind: "unknown" };

export type VisitPlan = { results: ItemResult[]; writes: VisitRow[]; standings: Map<string, VisitStanding> };

const compared = [
  "transectId", "seasonId", "visitDate", "startTime", "endTime", "temperatureC", "windBeaufort", "cloudCoverPercent",
  "sky", "coRecorders", "completeList", "notes", "submittedAt", "clientUpdatedAt",
] as const;

export const VISIT_REASONS = {
  otherVolunteer: "This visit belongs to another volunteer.",
  notAssigned: "You are not assigned to that transect.",
  reviewed: "A coordinator has reviewed sightings on this visit, so the server's copy of the visit is kept.",
  newer: "The server holds a newer edit of this visit.",
} as const;

function toRow(actor: Actor, v: VisitPayload, state: ServerState): VisitRow {
  return {
    id: v.id,
    transectId: v.transectId,
    volunteerId: actor.id,
    seasonId: seasonFor(v.visitDate, state.seasons),
    visitDate: v.visitDate,
    startTime: clockWithSeconds(v.startTime),
    endTime: clockWithSeconds(v.endTime),
    temperatureC: v.temperatureC ?? null,
    windBeaufort: v.windBeaufort ?? null,
    cloudCoverPercent: v.cloudCoverPercent ?? null,
    sky: v.sky ?? null,
    coRecorders: v.coRecorders ?? null,
    completeList: v.completeList,
    notes: v.notes ?? null,
    submittedAt: v.submittedAt ? new Date(v.submittedAt) : null,
    clientUpdatedAt: new Date(v.clientUpdatedAt),
  };
}

function decide(row: VisitRow, server: ServerVisit | undefined): [ItemResult["status"], string?] {
  if (!server) return ["created"];
  if (sameFields(compared, row, server)) return ["unchanged"];
  if (server.hasReviewed) return ["kept-server", VISIT_REASONS.reviewed];
  if (olderThanServer(row.clientUpdatedAt, server.clientUpdatedAt)) return ["kept-server", VISIT_REASONS.newer];
  return ["updated"];
}

/**
 * Decides each valid visit: forbidden unless the volunteer owns it and is assigned to its
 * transect; otherwise created, unchanged, kept-server (reviewed sightings, or a newer server
 * edit) or updated (last writer wins by clientUpdatedAt).
 */
export function planVisits(actor: Actor, items: Indexed<VisitPayload>[], state: ServerState): VisitPlan {
  const results: ItemResult[] = [];
  const writes: VisitRow[] = [];
  const standings = new Map<string, VisitStanding>();
  for (const { index, value } of items) {
    const server = state.visits.get(value.id);
    const answer = (status: ItemResult["status"], reason?: string) =>
      results.push({ kind: "visit", id: value.id, index, status, ...(reason ? { reason } : {}) });

    if (server && server.volunteerId !== actor.id) {
      answer("forbidden", VISIT_REASONS.otherVolunteer);
      standings.set(value.id, { kind: "forbidden", reason: VISIT_REASONS.otherVolunteer });
      continue;
    }
    const sectionCount = state.assigned.get(value.transectId);
    if (sectionCount === undefined) {
      answer("forbidden", VISIT_REASONS.notAssigned);
      standings.set(value.id, { kind: "forbidden", reason: VISIT_REASONS.notAssigned });
      continue;
    }
    const row = toRow(actor, value, state);
    const [status, reason] = decide(row, server);
    answer(status, reason);
    const written = status === "created" || status === "updated";
    if (written) writes.push(row);
    standings.set(value.id, { kind: "own", sectionCount: server && !written ? server.sectionCount : sectionCount });
  }
  return { results, writes, standings };
}

/**
 * A sighting's visit as seen from the server, for visits this batch did not carry (or carried
 * invalid). Like a visit in the batch, it takes sightings only while the volunteer is still
 * assigned to its transect: once an assignment ends, the old visits take no more.
 */
export function serverStanding(actor: Actor, visitId: string, state: ServerState): VisitStanding {
  const server = state.visits.get(visitId);
  if (!server) return { kind: "unknown" };
  if (server.volunteerId !== actor.id) return { kind: "forbidden", reason: VISIT_REASONS.otherVolunteer };
  if (!state.assigned.has(server.transectId)) return { kind: "forbidden", reason: VISIT_REASONS.notAssigned };
  return { kind: "own", sectionCount: server.sectionCount };
}
