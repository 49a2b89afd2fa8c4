import "server-only";
import { and, asc, desc, eq, inArray } from "drizzle-orm";
import { db } from "@/db/client";
import { sightings, species, transects, verificationEvents, visits } from "@/db/schema";
import type { Actor } from "@/lib/auth/guard";
import { conflict, forbidden, notFound } from "@/lib/errors";
import { rejectReasonLabel, rejectReasons, type RejectReason } from "@/lib/review/reasons";

export const RECORDS_VISIT_LIMIT = 100;

/** One message between a reviewer and the volunteer about a sighting, oldest first. */
export type RecordMessage = { from: "reviewer" | "volunteer"; message: string | null; at: Date };

/** The review decision a confirmed or set-aside sighting stands on: the latest one, with its reason and note. */
export type RecordDecision = { action: "accept" | "reject"; reason: RejectReason | null; reasonText: string | null; note: string | null; at: Date };

/** A reviewer's change of a sighting's species or count, with the old and new values (null: that part unchanged). */
export type RecordCorrection = { fromName: string | null; toName: string | null; fromCount: number | null; toCount: number | null; note: string | null; at: Date };

/** The sightings of these visits with species names, in section and checklist order. */
function sightingsOf(visitIds: string[]) {
  return db()
    .select({
      id: sightings.id,
      visitId: sightings.visitId,
      speciesId: species.id,
      vernacularName: species.vernacularName,
      scientificName: species.scientificName,
      count: sightings.count,
      section: sightings.section,
      status: sightings.status,
    })
    .from(sightings)
    .innerJoin(species, eq(species.id, sightings.speciesId))
    .where(inArray(sightings.visitId, visitIds))
    .orderBy(sightings.section, species.sortOrder);
}

/** The history these visits' sightings need on My walks (questions, answers, decisions, corrections), oldest first. */
function eventsOf(visitIds: string[]) {
  return db()
    .select({
      sightingId: verificationEvents.sightingId,
      action: verificationEvents.action,
      message: verificationEvents.message,
      reason: verificationEvents.reason,
      fromSpeciesName: verificationEvents.fromSpeciesName,
      toSpeciesName: verificationEvents.toSpeciesName,
      fromCount: verificationEvents.fromCount,
      toCount: verificationEvents.toCount,
      at: verificationEvents.createdAt,
    })
    .from(verificationEvents)
    .innerJoin(sightings, eq(sightings.id, verificationEvents.sightingId))
    .where(and(inArray(sightings.visitId, visitIds), inArray(verificationEvents.action, ["query", "reply", "accept", "reject", "edit"])))
    .orderBy(asc(verificationEvents.createdAt), asc(verificationEvents.id));
}

type EventRow = Awaited<ReturnType<typeof eventsOf>>[number];
type Outcomes = { conversation: RecordMessage[]; decision: RecordDecision | null; corrections: RecordCorrection[] };

const knownReason = (key: string | null): RejectReason | null => (rejectReasons as readonly string[]).includes(key ?? "") ? (key as RejectReason) : null;

/** Gathers one sighting's events (oldest first) into what the volunteer reads. */
function addEvent(o: Outcomes, e: EventRow): void {
  if (e.action === "query" || e.action === "reply") {
    o.conversation.push({ from: e.action === "query" ? "reviewer" : "volunteer", message: e.message, at: e.at });
  } else if (e.action === "accept" || e.action === "reject") {
    const reason = e.action === "reject" ? knownReason(e.reason) : null;
    o.decision = { action: e.action, reason, reasonText: reason ? rejectReasonLabel[reason] : null, note: e.message, at: e.at };
  } else if (e.action === "edit") {
    const species = e.fromSpeciesName !== e.toSpeciesName;
    const count = e.fromCount !== e.toCount;
    o.corrections.push({
      fromName: species ? e.fromSpeciesName : null,
      toName: species ? e.toSpeciesName : null,
      fromCount: count ? e.fromCount : null,
      toCount: count ? e.toCount : null,
      note: e.message,
      at: e.at,
    });
  }
}

/**
 * The volunteer's own walks (only theirs: the filter on the actor is the whole access rule),
 * newest first, each with its sightings and what review made of each: the status, the reviewer's
 * latest question and the whole exchange (so My walks shows what needs an answer and what the
 * volunteer already said), the decision it stands on with its reason and note, and every
 * correction with the old and new values.
 */
export async function myRecords(actor: Actor, limit = RECORDS_VISIT_LIMIT) {
  const visitRows = await db()
    .select({
      id: visits.id,
      visitDate: visits.visitDate,
      startTime: visits.startTime,
      endTime: visits.endTime,
      submittedAt: visits.submittedAt,
      transectId: transects.id,
      transectCode: transects.code,
      transectName: transects.name,
    })
    .from(visits)
    .innerJoin(transects, eq(transects.id, visits.transectId))
    .where(eq(visits.volunteerId, actor.id))
    .orderBy(desc(visits.visitDate), desc(visits.startTime), desc(visits.createdAt))
    .limit(limit);
  if (!visitRows.length) return [];
  const visitIds = visitRows.map((v) => v.id);

  const [sightingRows, eventRows] = await Promise.all([sightingsOf(visitIds), eventsOf(visitIds)]);

  const outcomes = new Map<string, Outcomes>();
  for (const e of eventRows) {
    let o = outcomes.get(e.sightingId);
    if (!o) outcomes.set(e.sightingId, (o = { conversation: [], decision: null, corrections: [] }));
    addEvent(o, e);
  }
  const byVisit = new Map<string, typeof sightingRows>();
  for (const s of sightingRows) {
    const list = byVisit.get(s.visitId) ?? [];
    list.push(s);
    byVisit.set(s.visitId, list);
  }
  return visitRows.map((v) => ({
    ...v,
    sightings: (byVisit.get(v.id) ?? []).map(({ visitId: _visitId, ...s }) => {
      const { conversation, decision, corrections } = outcomes.get(s.id) ?? { conversation: [], decision: null, corrections: [] };
      const lastQuestion = conversation.findLast((m) => m.from === "reviewer");
      const lastReply = conversation.findLast((m) => m.from === "volunteer");
      const question = lastQuestion?.message ?? null;
      return {
        ...s,
        question,
        questionAt: lastQuestion?.at ?? null,
        lastReplyAt: lastReply?.at ?? null,
        conversation,
        // A reopened sighting is waiting again: the decision it had no longer stands.
        decision: decision && s.status === (decision.action === "accept" ? "accepted" : "rejected") ? decision : null,
        corrections,
        // Answered once the volunteer has replied after the latest question.
        awaitingReply: s.status === "queried" && question !== null && !(lastReply && lastQuestion && lastReply.at >= lastQuestion.at),
      };
    }),
  }));
}

/** Records the volunteer's answer to a reviewer's question; the sighting stays queried. */
export async function replyToQuestion(actor: Actor, input: { sightingId: string; message: string }) {
  return db().transaction(async (tx) => {
    const [row] = await tx
      .select({ status: sightings.status, ownerId: visits.volunteerId })
      .from(sightings)
      .innerJoin(visits, eq(visits.id, sightings.visitId))
      .where(eq(sightings.id, input.sightingId))
      .for("update", { of: sightings });
    if (!row) throw notFound("That sighting");
    if (row.ownerId !== actor.id) throw forbidden("That sighting belongs to another volunteer.");
    if (row.status !== "queried") throw conflict("Only a sighting a reviewer has asked you about can be answered.");
    const [event] = await tx
      .insert(verificationEvents)
      .values({ sightingId: input.sightingId, actorId: actor.id, action: "reply", fromStatus: "queried", toStatus: "queried", message: input.message })
      .returning({ id: verificationEvents.id, sightingId: verificationEvents.sightingId, message: verificationEvents.message, createdAt: verificationEvents.createdAt });
    return event!;
  });
}

export type MyRecords = Awaited<ReturnType<typeof myRecords>>;
