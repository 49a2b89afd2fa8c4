import "server-only";
import { desc, eq, inArray, sql } from "drizzle-orm";
import { db } from "@/db/client";
import { sightings, species, transects, verificationEvents, visits } from "@/db/schema";
import type { Actor } from "@/lib/auth/guard";
import { conflict, forbidden, notFound } from "@/lib/errors";

export const RECORDS_VISIT_LIMIT = 100;

const latestOf = (action: "query" | "reply") =>
  sql`from ${verificationEvents} e where e.sighting_id = ${sightings.id} and e.action = ${action} order by e.created_at desc limit 1`;
const latestMessage = (action: "query" | "reply") => sql<string | null>`(select e.message ${latestOf(action)})`;
const latestAt = (action: "query" | "reply") => sql<Date | null>`(select e.created_at ${latestOf(action)})`.mapWith(sightings.createdAt);

/**
 * The volunteer's own visits, newest first, each with its sightings, their review status and
 * the coordinator's latest question (so "My records" can show what needs an answer).
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

  const sightingRows = await db()
    .select({
      id: sightings.id,
      visitId: sightings.visitId,
      speciesId: species.id,
      vernacularName: species.vernacularName,
      scientificName: species.scientificName,
      count: sightings.count,
      section: sightings.section,
      status: sightings.status,
      question: latestMessage("query"),
      questionAt: latestAt("query"),
      lastReplyAt: latestAt("reply"),
    })
    .from(sightings)
    .innerJoin(species, eq(species.id, sightings.speciesId))
    .where(inArray(sightings.visitId, visitRows.map((v) => v.id)))
    .orderBy(sightings.section, species.sortOrder);

  const byVisit = new Map<string, typeof sightingRows>();
  for (const s of sightingRows) {
    const list = byVisit.get(s.visitId) ?? [];
    list.push(s);
    byVisit.set(s.visitId, list);
  }
  return visitRows.map((v) => ({
    ...v,
    sightings: (byVisit.get(v.id) ?? []).map(({ visitId: _visitId, ...s }) => ({
      ...s,
      // Answered once the volunteer has replied after the latest question.
      awaitingReply: s.status === "queried" && s.question !== null && !(s.lastReplyAt && s.questionAt && s.lastReplyAt >= s.questionAt),
    })),
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
