import { and, eq, not } from "drizzle-orm";
import { beforeEach, describe, expect, it, vi } from "vitest";
import { db } from "@/db/client";
import { sightings, species, users, verificationEvents, visits } from "@/db/schema";
import type { Actor } from "@/lib/auth/guard";
import { holdsRole } from "@/lib/queries/people";
import { myRecords, replyToQuestion } from "@/lib/queries/records";
import { TEXT_PROBLEMS } from "@/lib/validation/text";
import { resetToDemo } from "./support/db";

const session = vi.hoisted(() => ({ userId: null as string | null }));
vi.mock("@/lib/auth/session", () => ({ sessionUserId: async () => session.userId }));

const { GET } = await import("@/app/(field)/api/field/records/route");
const { POST: REPLY } = await import("@/app/(field)/api/field/records/reply/route");

async function actorFor(email: string): Promise<Actor> {
  const [u] = await db().select().from(users).where(eq(users.email, email));
  return { id: u!.id, roles: u!.roles, name: u!.name, email: u!.email };
}

async function reply(body: unknown) {
  const request = new Request("http://localhost/api/field/records/reply", { method: "POST", headers: { "content-type": "application/json" }, body: JSON.stringify(body) });
  const response = await REPLY(request, { params: Promise.resolve({}) });
  return { status: response.status, json: (await response.json()) as Record<string, any> }; // eslint-disable-line @typescript-eslint/no-explicit-any -- the tests read nested answer fields of several shapes
}

/** The volunteer's pending sightings (the first `n`), in a fixed order. */
async function pendingOf(actor: Actor, n: number) {
  const rows = await db()
    .select({ id: sightings.id, speciesId: sightings.speciesId, count: sightings.count })
    .from(sightings)
    .innerJoin(visits, eq(visits.id, sightings.visitId))
    .where(and(eq(visits.volunteerId, actor.id), eq(sightings.status, "pending")))
    .orderBy(sightings.id)
    .limit(n);
  expect(rows).toHaveLength(n);
  return rows;
}

/** Puts a reviewer's question on one of the volunteer's pending sightings. */
async function queryOneOf(actor: Actor, message: string) {
  const [coordinator] = await db().select().from(users).where(holdsRole("coordinator"));
  const [target] = await pendingOf(actor, 1);
  await db().update(sightings).set({ status: "queried", reviewedAt: new Date(), reviewedById: coordinator!.id }).where(eq(sightings.id, target!.id));
  await db().insert(verificationEvents).values([
    { sightingId: target!.id, actorId: coordinator!.id, action: "query", fromStatus: "pending", toStatus: "queried", message: "An older question", createdAt: new Date("2026-07-01T10:00:00Z") },
    { sightingId: target!.id, actorId: coordinator!.id, action: "query", fromStatus: "queried", toStatus: "queried", message, createdAt: new Date("2026-07-02T10:00:00Z") },
  ]);
  return target!.id;
}

/**
 * A reviewer's outcomes on three of the volunteer's pending sightings, written as the review
 * actions write them (status and history row together): one set aside with a reason and a note,
 * one corrected (species and count) then confirmed, one confirmed with a note. `tag` goes into
 * every note, so a test can look for it anywhere in an answer.
 */
async function outcomesOn(actor: Actor, tag: string) {
  const [coordinator] = await db().select().from(users).where(holdsRole("coordinator"));
  const [setAside, corrected, confirmed] = await pendingOf(actor, 3);
  const [other] = await db().select({ id: species.id, vernacularName: species.vernacularName }).from(species).where(not(eq(species.id, corrected!.speciesId))).limit(1);
  const [was] = await db().select({ vernacularName: species.vernacularName }).from(species).where(eq(species.id, corrected!.speciesId));
  const by = coordinator!.id;
  await db().transaction(async (tx) => {
    await tx.update(sightings).set({ status: "rejected", reviewedAt: new Date(), reviewedById: by }).where(eq(sightings.id, setAside!.id));
    await tx.update(sightings).set({ status: "accepted", speciesId: other!.id, count: corrected!.count + 5, reviewedAt: new Date(), reviewedById: by }).where(eq(sightings.id, corrected!.id));
    await tx.update(sightings).set({ status: "accepted", reviewedAt: new Date(), reviewedById: by }).where(eq(sightings.id, confirmed!.id));
    await tx.insert(verificationEvents).values([
      { sightingId: setAside!.id, actorId: by, action: "reject", fromStatus: "pending", toStatus: "rejected", reason: "likely_other_species", message: `${tag}: looks like a Small Skipper`, createdAt: new Date("2026-07-02T10:00:00Z") },
      {
        sightingId: corrected!.id, actorId: by, action: "edit", fromStatus: "pending", toStatus: "pending",
        fromSpeciesId: corrected!.speciesId, fromSpeciesName: was!.vernacularName, toSpeciesId: other!.id, toSpeciesName: other!.vernacularName,
        fromCount: corrected!.count, toCount: corrected!.count + 5, message: `${tag}: from the photo`, createdAt: new Date("2026-07-02T10:01:00Z"),
      },
      { sightingId: corrected!.id, actorId: by, action: "accept", fromStatus: "pending", toStatus: "accepted", createdAt: new Date("2026-07-02T10:02:00Z") },
      { sightingId: confirmed!.id, actorId: by, action: "accept", fromStatus: "pending", toStatus: "accepted", message: `${tag}: a fine record`, createdAt: new Date("2026-07-02T10:03:00Z") },
    ]);
  });
  return { setAside: setAside!, corrected: { ...corrected!, was: was!.vernacularName, now: other!.vernacularName }, confirmed: confirmed! };
}

describe("a volunteer's own walks, the outcome of each sighting, and answers to questions", () => {
  let actor: Actor;

  beforeEach(async () => {
    await resetToDemo();
    actor = await actorFor("volunteer01@harrowmere.example");
    session.userId = actor.id;
  });

  it("lists only the volunteer's visits, newest first, with transect, sightings and the latest question", async () => {
    const sightingId = await queryOneOf(actor, "Was the underside spotted?");
    const records = await myRecords(actor);
    const ownVisitIds = new Set((await db().select({ id: visits.id }).from(visits).where(eq(visits.volunteerId, actor.id))).map((v) => v.id));
    expect(ownVisitIds.size).toBeGreaterThan(0);
    expect(records).toHaveLength(Math.min(ownVisitIds.size, 100));
    for (const v of records) expect(ownVisitIds.has(v.id)).toBe(true);
    const dates = records.map((v) => v.visitDate);
    expect(dates).toEqual([...dates].sort().reverse());
    expect(records[0]!.transectCode).toMatch(/^[A-Z]{3}-\d{2}$/);

    const queried = records.flatMap((v) => v.sightings).find((s) => s.id === sightingId);
    expect(queried).toMatchObject({ status: "queried", question: "Was the underside spotted?", awaitingReply: true });
    expect(queried!.vernacularName.length).toBeGreaterThan(0);
    const pending = records.flatMap((v) => v.sightings).find((s) => s.status === "pending");
    expect(pending).toMatchObject({ question: null, awaitingReply: false });
  });

  it("gives each sighting its outcome: not used in counts with the reason's words and the note, corrected with old and new names and counts, confirmed with the note", async () => {
    const made = await outcomesOn(actor, "mine");
    const all = (await myRecords(actor)).flatMap((v) => v.sightings);
    const of = (id: string) => all.find((s) => s.id === id)!;

    expect(of(made.setAside.id)).toMatchObject({
      status: "rejected",
      decision: { action: "reject", reason: "likely_other_species", reasonText: "Most likely another species", note: "mine: looks like a Small Skipper" },
      corrections: [],
    });
    const corrected = of(made.corrected.id);
    expect(corrected).toMatchObject({ status: "accepted", vernacularName: made.corrected.now, count: made.corrected.count + 5, decision: { action: "accept", note: null } });
    expect(corrected.corrections).toEqual([
      { fromName: made.corrected.was, toName: made.corrected.now, fromCount: made.corrected.count, toCount: made.corrected.count + 5, note: "mine: from the photo", at: new Date("2026-07-02T10:01:00Z") },
    ]);
    expect(of(made.confirmed.id)).toMatchObject({ status: "accepted", decision: { action: "accept", reason: null, note: "mine: a fine record" }, corrections: [] });
    // Waiting sightings have no decision yet.
    expect(all.find((s) => s.status === "pending")).toMatchObject({ decision: null, corrections: [] });

    // Reopened, the sighting waits again: the old decision no longer stands, the correction stays in its story.
    const [coordinator] = await db().select().from(users).where(holdsRole("coordinator"));
    await db().update(sightings).set({ status: "pending" }).where(eq(sightings.id, made.corrected.id));
    await db().insert(verificationEvents).values({ sightingId: made.corrected.id, actorId: coordinator!.id, action: "reopen", fromStatus: "accepted", toStatus: "pending", createdAt: new Date("2026-07-02T11:00:00Z") });
    const reopened = (await myRecords(actor)).flatMap((v) => v.sightings).find((s) => s.id === made.corrected.id)!;
    expect(reopened).toMatchObject({ status: "pending", decision: null });
    expect(reopened.corrections).toHaveLength(1);
  });

  it("never shows a volunteer another volunteer's outcomes, questions or notes (query layer and GET)", async () => {
    const other = await actorFor("volunteer02@harrowmere.example");
    const theirs = await outcomesOn(other, "theirs");
    const theirQuestion = await queryOneOf(other, "theirs: which wing?");
    const theirIds = [theirs.setAside.id, theirs.corrected.id, theirs.confirmed.id, theirQuestion];

    const mine = await myRecords(actor);
    const mineText = JSON.stringify(mine);
    for (const id of theirIds) expect(mineText).not.toContain(id);
    expect(mineText).not.toContain("theirs");
    const response = await GET(new Request("http://localhost/api/field/records"), { params: Promise.resolve({}) });
    const body = await response.text();
    expect(response.status).toBe(200);
    for (const id of theirIds) expect(body).not.toContain(id);
    expect(body).not.toContain("theirs");

    // The other volunteer does see them (so the absence above is the access rule, not missing data).
    session.userId = other.id;
    const theirBody = await (await GET(new Request("http://localhost/api/field/records"), { params: Promise.resolve({}) })).text();
    for (const id of theirIds) expect(theirBody).toContain(id);
    expect(theirBody).toContain("theirs: looks like a Small Skipper");
    expect(theirBody).toContain("theirs: which wing?");
  });

  it("stores a reply on the volunteer's own queried sighting (201) and leaves its status alone", async () => {
    const sightingId = await queryOneOf(actor, "Photo?");
    const { status, json } = await reply({ sightingId, message: "  Yes: uploaded from the phone.  " });
    expect(status).toBe(201);
    expect(json).toMatchObject({ sightingId, message: "Yes: uploaded from the phone." });
    const events = await db().select().from(verificationEvents).where(and(eq(verificationEvents.sightingId, sightingId), eq(verificationEvents.action, "reply")));
    expect(events).toEqual([expect.objectContaining({ actorId: actor.id, fromStatus: "queried", toStatus: "queried" })]);
    const [row] = await db().select().from(sightings).where(eq(sightings.id, sightingId));
    expect(row!.status).toBe("queried");
    const answered = (await myRecords(actor)).flatMap((v) => v.sightings).find((s) => s.id === sightingId);
    expect(answered!.awaitingReply).toBe(false);
  });

  it("refuses a reply on someone else's sighting (403), on one not queried (409), and a bad body (400)", async () => {
    const other = await actorFor("volunteer02@harrowmere.example");
    const theirs = await queryOneOf(other, "Which wing?");
    expect((await reply({ sightingId: theirs, message: "Not mine" })).status).toBe(403);
    await expect(replyToQuestion(actor, { sightingId: theirs, message: "x" })).rejects.toMatchObject({ status: 403 });

    const [pending] = await db()
      .select({ id: sightings.id })
      .from(sightings)
      .innerJoin(visits, eq(visits.id, sightings.visitId))
      .where(and(eq(visits.volunteerId, actor.id), eq(sightings.status, "pending")))
      .limit(1);
    expect((await reply({ sightingId: pending!.id, message: "Unprompted" })).status).toBe(409);

    const bad = await reply({ sightingId: "nope", message: "x".repeat(1001) });
    expect(bad.status).toBe(400);
    expect(Object.keys(bad.json.error.fields).sort()).toEqual(["message", "sightingId"]);
    expect(await db().select().from(verificationEvents).where(eq(verificationEvents.action, "reply"))).toHaveLength(0);
  });

  it("answers 400 with a field message for a reply carrying NUL or an unpaired surrogate, and stores nothing", async () => {
    const sightingId = await queryOneOf(actor, "Which wing?");
    for (const [message, problem] of [
      ["Left wing\u0000", TEXT_PROBLEMS.control],
      ["Left \uD83E wing", TEXT_PROBLEMS.brokenCharacter],
      ["\uDD8B", TEXT_PROBLEMS.brokenCharacter],
    ] as const) {
      const refused = await reply({ sightingId, message });
      expect(refused.status, JSON.stringify(message)).toBe(400);
      expect(refused.json.error).toMatchObject({ code: "invalid", fields: { message: [problem] } });
    }
    expect(await db().select().from(verificationEvents).where(eq(verificationEvents.action, "reply"))).toHaveLength(0);
    // Line breaks and characters outside the BMP are ordinary text.
    const fine = await reply({ sightingId, message: "Left wing,\nphoto \u{1F98B} attached" });
    expect(fine.status).toBe(201);
  });

  it("serves GET /api/field/records to the volunteer and 401 to strangers", async () => {
    const ok = await GET(new Request("http://localhost/api/field/records"), { params: Promise.resolve({}) });
    expect(ok.status).toBe(200);
    const body = (await ok.json()) as { visits: { id: string }[] };
    expect(body.visits.length).toBe((await myRecords(actor)).length);
    session.userId = null;
    const stranger = await GET(new Request("http://localhost/api/field/records"), { params: Promise.resolve({}) });
    expect(stranger.status).toBe(401);
    const [someoneElse] = await db().select().from(users).where(not(holdsRole("volunteer"))).limit(1);
    session.userId = someoneElse!.id;
    expect((await GET(new Request("http://localhost/api/field/records"), { params: Promise.resolve({}) })).status).toBe(403);
  });
});
