import "server-only";
import { and, asc, desc, eq, inArray } from "drizzle-orm";
import { db } from "@/db/client";
import { sightings, species, transects, verificationEvents, visits } from "@/db/schema";
import type { Actor } from "@/lib/auth/guard";
import { conflict, forbidden, notFound } from "@/lib/errors";

export const RECORDS_VISIT_LIMIT = 100;

/** One message between a checker and the volunteer about a sighting, oldest first. */
export type RecordMessage = { from: "checker" | "volunteer"; message: string | null; at: Date };

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

/** Every question and answer on these visits' sightings, oldest first. */
function messagesOf(visitIds: string[]) {
  return db()
    .select({ sightingId: verificationEvents.sightingId, action: verificationEvents.action, message: verificationEvents.message, at: verificationEvents.createdAt })
    .from(verificationEvents)
    .innerJoin(sightings, eq(sightings.id, verificationEvents.sightingId))
    .where(and(inArray(sightings.visitId, visitIds), inArray(verificationEvents.action, ["query", "reply"])))
    .orderBy(asc(verificationEvents.createdAt), asc(verificationEvents.id));
}

/**
 * The volunteer's own visits, newest first, each with its sightings, their review status, the
 * coordinator's latest question and the whole exchange (so "My records" can show what needs an
 * answer and what the volunteer already said).
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

  const [sightingRows, messageRows] = await Promise.all([sightingsOf(visitIds), messagesOf(visitIds)]);

  const conversations = new Map<string, RecordMessage[]>();
  for (const m of messageRows) {
    const list = conversations.get(m.sightingId) ?? [];
    list.push({ from: m.action === "query" ? "checker" : "volunteer", message: m.message, at: m.at });
    conversations.set(m.sightingId, list);
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
      const conversation = conversations.get(s.id) ?? [];
      const lastQuestion = conversation.findLast((m) => m.from === "checker");
      const lastReply = conversation.findLast((m) => m.from === "volunteer");
      const question = lastQuestion?.message ?? null;
      return {
        ...s,
        question,
        questionAt: lastQuestion?.at ?? null,
        lastReplyAt: lastReply?.at ?? null,
        conversation,
        // Answered once the volunteer has replied after the latest question.
        awaitingReply: s.status === "queried" && question !== null && !(lastReply && lastQuestion && lastReply.at >= lastQuestion.at),
      };
    }),
  }));
}

/** Records the volunteer's answer to a coordinator's question; the sighting stays queried. */
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
    if (row.status !== "queried") throw conflict("Only a sighting a coordinator has queried can be answered.");
    const [event] = await tx
      .insert(verificationEvents)
      .values({ sightingId: input.sightingId, actorId: actor.id, action: "reply", fromStatus: "queried", toStatus: "queried", message: input.message })
      .returning({ id: verificationEvents.id, sightingId: verificationEvents.sightingId, message: verificationEvents.message, createdAt: verificationEvents.createdAt });
    return event!;
  });
}

export type MyRecords = Awaited<ReturnType<typeof myRecords>>;
