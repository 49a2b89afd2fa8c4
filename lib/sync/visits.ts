import type { visits } from "@/db/schema";
import type { Actor } from "@/lib/auth/guard";
import type { ItemResult, VisitPayload } from "./contract";
import type { Indexed } from "./parse";
import { versionOn } from "@/lib/geo/versions";
import { REVIEWER } from "@/lib/review/words";
import { fieldDateVerdict, phaseOf } from "@/lib/seasons/rules";
import { clockWithSeconds, olderThanServer, sameFields } from "./same";
import { seasonFor, type ServerState, type ServerVisit } from "./server-state";

export type VisitRow = typeof visits.$inferInsert & { id: string; clientUpdatedAt: Date; transectId: string };

/** Where a visit stands after this batch: sightings are checked against it. */
export type VisitStanding =
  | { kind: "own"; sectionCount: number }
  | { kind: "frozen"; reason: string }
  | { kind: "forbidden"; reason: string }
  | { kind: "unknown" };

export type VisitPlan = { results: ItemResult[]; writes: VisitRow[]; standings: Map<string, VisitStanding> };

const compared = [
  "transectId", "seasonId", "visitDate", "startTime", "endTime", "temperatureC", "windBeaufort", "cloudCoverPercent",
  "sky", "sunshinePercent", "rain", "coRecorders", "completeList", "notes", "submittedAt", "clientUpdatedAt",
] as const;

export const VISIT_REASONS = {
  otherVolunteer: "This walk belongs to another volunteer.",
  notAssigned: "You are not assigned to that transect.",
  reviewed: `A ${REVIEWER} has reviewed sightings on this walk, so the walk stays as Turnstone has it.`,
  newer: "Turnstone already has a newer change to this walk.",
  frozen: "This walk's season is closed and its grace period is over, so the walk stays as Turnstone has it: only an organiser can change it now.",
} as const;

/** Whether the stored walk's season is past its grace period: the phone can no longer change it. */
function frozen(server: ServerVisit | undefined, state: ServerState): boolean {
  const season = server?.seasonId ? state.seasons.find((s) => s.id === server.seasonId) : undefined;
  return !!season && phaseOf(season, state.graceDays, state.now) === "frozen";
}

/** Sections of the transect's route version in force on the walk's date. */
export function sectionsOn(state: ServerState, transectId: string, visitDate: string): number | undefined {
  const assigned = state.assigned.get(transectId);
  if (assigned === undefined) return undefined;
  return versionOn(state.versions.get(transectId) ?? [], visitDate)?.sectionCount ?? assigned;
}

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
    sunshinePercent: v.sunshinePercent ?? null,
    rain: v.rain ?? null,
    coRecorders: v.coRecorders ?? null,
    completeList: v.completeList,
    notes: v.notes ?? null,
    submittedAt: v.submittedAt ? new Date(v.submittedAt) : null,
    clientUpdatedAt: new Date(v.clientUpdatedAt),
  };
}

function decide(row: VisitRow, server: ServerVisit | undefined, state: ServerState): [ItemResult["status"], string?] {
  if (!server) return ["created"];
  if (sameFields(compared, row, server)) return ["unchanged"];
  if (frozen(server, state)) return ["kept-server", VISIT_REASONS.frozen];
  if (server.hasReviewed) return ["kept-server", VISIT_REASONS.reviewed];
  if (olderThanServer(row.clientUpdatedAt, server.clientUpdatedAt)) return ["kept-server", VISIT_REASONS.newer];
  return ["updated"];
}

/**
 * Decides each valid visit: forbidden unless the volunteer owns it and is assigned to its
 * (active) transect; kept-server once its stored season is frozen; invalid when dated outside
 * any open or in-grace season; otherwise created, unchanged, kept-server (reviewed sightings, or
 * a newer server edit) or updated (last writer wins by clientUpdatedAt).
 */
export function planVisits(actor: Actor, items: Indexed<VisitPayload>[], state: ServerState): VisitPlan {
  const results: ItemResult[] = [];
  const writes: VisitRow[] = [];
  const standings = new Map<string, VisitStanding>();
  for (const { index, value } of items) {
    const server = state.visits.get(value.id);
    const answer = (status: ItemResult["status"], reason?: string, errors?: Record<string, string[]>) =>
      results.push({ kind: "visit", id: value.id, index, status, ...(reason ? { reason } : {}), ...(errors ? { errors } : {}) });

    if (server && server.volunteerId !== actor.id) {
      answer("forbidden", VISIT_REASONS.otherVolunteer);
      standings.set(value.id, { kind: "forbidden", reason: VISIT_REASONS.otherVolunteer });
      continue;
    }
    const sectionCount = sectionsOn(state, value.transectId, value.visitDate);
    if (sectionCount === undefined) {
      answer("forbidden", VISIT_REASONS.notAssigned);
      standings.set(value.id, { kind: "forbidden", reason: VISIT_REASONS.notAssigned });
      continue;
    }
    const row = toRow(actor, value, state);
    if (!frozen(server, state)) {
      const verdict = fieldDateVerdict(value.visitDate, state.seasons, state.graceDays, state.now);
      if (!verdict.ok && !(server && sameFields(compared, row, server))) {
        answer("invalid", verdict.reason, { visitDate: [verdict.reason] });
        continue;
      }
    }
    const [status, reason] = decide(row, server, state);
    answer(status, reason);
    const written = status === "created" || status === "updated";
    if (written) writes.push(row);
    if (frozen(server, state)) standings.set(value.id, { kind: "frozen", reason: VISIT_REASONS.frozen });
    else standings.set(value.id, { kind: "own", sectionCount: server && !written ? server.sectionCount : sectionCount });
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
  if (frozen(server, state)) return { kind: "frozen", reason: VISIT_REASONS.frozen };
  return { kind: "own", sectionCount: server.sectionCount };
}
