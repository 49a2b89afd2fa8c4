import { randomUUID } from "node:crypto";
import { asc, count, eq, inArray, ne } from "drizzle-orm";
import { beforeAll, beforeEach, describe, expect, it, vi } from "vitest";
import { db } from "@/db/client";
import { seasons, sightings, species, transectAssignments, users, visits } from "@/db/schema";
import { MAX_SYNC_BODY_BYTES } from "@/lib/sync/protocol";
import { TEXT_PROBLEMS } from "@/lib/validation/text";
import { resetToDemo } from "./support/db";

// The handler's own session check is exercised for real; only Auth.js's cookie decoding is
// replaced, so no running app is needed.
const session = vi.hoisted(() => ({ userId: null as string | null }));
vi.mock("@/lib/auth/session", () => ({ sessionUserId: async () => session.userId }));

const { POST } = await import("@/app/(field)/api/field/sync/route");

/** The route's answer: per-item results, or an error (one of the two). */
type SyncAnswer = {
  results: { kind: string; index: number; status: string; errors?: Record<string, string[]>; reason?: string }[];
  serverTime: string;
  error: { code: string; message: string; fields: Record<string, string[]> };
};

async function post(body: string) {
  const request = new Request("http://localhost/api/field/sync", { method: "POST", body, headers: { "content-type": "application/json" } });
  const response = await POST(request, { params: Promise.resolve({}) });
  return { status: response.status, json: (await response.json()) as SyncAnswer };
}

async function userId(email: string) {
  const [u] = await db().select({ id: users.id }).from(users).where(eq(users.email, email));
  return u!.id;
}

// Walks must be dated in an open season: the demo's contains the day it was seeded, so its first day is past.
let walkDay = "";

function batchFor(transectId: string, speciesId: string) {
  const visitId = randomUUID();
  const stamp = `${walkDay}T12:00:00.000Z`;
  return {
    visits: [{ id: visitId, transectId, visitDate: walkDay, startTime: "11:00", clientUpdatedAt: stamp }],
    sightings: [{ id: randomUUID(), visitId, speciesId, count: 2, section: 1, clientUpdatedAt: stamp }],
  };
}

describe("POST /api/field/sync", () => {
  let volunteer: string;
  let mine: string;
  let theirs: string;
  let speciesId: string;

  beforeAll(async () => {
    await resetToDemo();
    const [open] = await db().select({ startsOn: seasons.startsOn }).from(seasons).where(eq(seasons.status, "open"));
    walkDay = open!.startsOn;
    volunteer = await userId("volunteer01@harrowmere.example");
    const [a] = await db().select().from(transectAssignments).where(eq(transectAssignments.userId, volunteer)).limit(1);
    const [b] = await db().select().from(transectAssignments).where(ne(transectAssignments.userId, volunteer)).limit(1);
    mine = a!.transectId;
    theirs = b!.transectId;
    const [sp] = await db().select({ id: species.id }).from(species).orderBy(asc(species.sortOrder)).limit(1);
    speciesId = sp!.id;
  });

  beforeEach(() => {
    session.userId = volunteer;
  });

  it("answers 413 to a body over the limit the phone's outbox keeps its batches under, and stores nothing", async () => {
    const batch = batchFor(mine, speciesId);
    const padded = JSON.stringify({ ...batch, padding: "x".repeat(MAX_SYNC_BODY_BYTES) });
    const refused = await post(padded);
    expect(refused.status).toBe(413);
    expect(refused.json.error.code).toBe("too_large");
    expect(await db().select().from(visits).where(eq(visits.id, batch.visits[0]!.id))).toHaveLength(0);
  });

  it("counts bytes, not characters: a body under the limit in characters but over it in UTF-8 is refused", async () => {
    const batch = batchFor(mine, speciesId);
    // "é" is one UTF-16 unit but two UTF-8 bytes (RFC 3629 §3).
    const body = JSON.stringify({ ...batch, padding: "é".repeat(MAX_SYNC_BODY_BYTES / 2 + 1000) });
    expect(body.length).toBeLessThan(MAX_SYNC_BODY_BYTES);
    expect(new TextEncoder().encode(body).byteLength).toBeGreaterThan(MAX_SYNC_BODY_BYTES);
    const refused = await post(body);
    expect(refused.status).toBe(413);
    expect(refused.json.error.code).toBe("too_large");
    expect(await db().select().from(visits).where(eq(visits.id, batch.visits[0]!.id))).toHaveLength(0);
  });

  it("answers 401 without a session and 403 for a signed-in non-volunteer", async () => {
    session.userId = null;
    expect((await post(JSON.stringify(batchFor(mine, speciesId)))).status).toBe(401);
    session.userId = await userId("checker@harrowmere.example");
    const refused = await post(JSON.stringify(batchFor(mine, speciesId)));
    expect(refused.status).toBe(403);
    expect(refused.json.error.code).toBe("forbidden");
  });

  it("answers a body that is not JSON with 400 and a field message", async () => {
    const { status, json } = await post("{visits: [");
    expect(status).toBe(400);
    expect(json.error).toMatchObject({ code: "invalid", fields: { _: ["The request body is not valid JSON."] } });
  });

  it("answers a malformed envelope with 400 and per-field messages", async () => {
    const { status, json } = await post(JSON.stringify({ visits: 7 }));
    expect(status).toBe(400);
    expect(json.error.fields.visits).toHaveLength(1);
  });

  it("stores a good batch with 200 and per-item results", async () => {
    const batch = batchFor(mine, speciesId);
    const { status, json } = await post(JSON.stringify(batch));
    expect(status).toBe(200);
    expect(json.results.map((r: { status: string }) => r.status)).toEqual(["created", "created"]);
    expect(typeof json.serverTime).toBe("string");
    const [row] = await db().select().from(sightings).where(eq(sightings.id, batch.sightings[0]!.id));
    expect(row!.count).toBe(2);
  });

  it("answers 403 with the item results for another volunteer's transect, and stores nothing", async () => {
    const [before] = await db().select({ n: count() }).from(visits);
    const { status, json } = await post(JSON.stringify(batchFor(theirs, speciesId)));
    expect(status).toBe(403);
    expect(json.results.map((r: { status: string }) => r.status)).toEqual(["forbidden", "forbidden"]);
    const [after] = await db().select({ n: count() }).from(visits);
    expect(after!.n).toBe(before!.n);
  });

  it("answers 400 for items carrying NUL, an unpaired surrogate or year 0000, and still stores the good items beside them", async () => {
    const good = batchFor(mine, speciesId);
    const goodVisit = good.visits[0]!;
    const goodSighting = good.sightings[0]!;
    const sightingOn = (visitId: string, over: Record<string, unknown>) => ({ ...goodSighting, id: randomUUID(), visitId, ...over });
    const nulVisit = { ...goodVisit, id: randomUUID(), notes: "Gate was locked\u0000" };
    const brokenVisit = { ...goodVisit, id: randomUUID(), coRecorders: "A. Smith \uD83E" };
    const yearZeroVisit = { ...goodVisit, id: randomUUID(), visitDate: "0000-01-01", clientUpdatedAt: "0000-01-01T00:00:00Z" };
    const batch = {
      visits: [nulVisit, goodVisit, brokenVisit, yearZeroVisit],
      sightings: [
        sightingOn(goodVisit.id, { note: "\u0000" }),
        goodSighting,
        sightingOn(goodVisit.id, { note: "\uDD8B on thistle" }),
        sightingOn(goodVisit.id, { clientUpdatedAt: "0000-12-31T23:59:59Z" }),
        sightingOn(nulVisit.id, {}),
      ],
    };
    const body = JSON.stringify(batch);
    // The wire really carries them, as JSON escapes.
    expect(body).toContain("\\u0000");
    expect(body).toContain("\\ud83e");

    const { status, json } = await post(body);
    expect(status).toBe(400);
    const results = json.results as { kind: string; index: number; status: string; errors?: Record<string, string[]>; reason?: string }[];
    expect(results.map((r) => [r.kind, r.index, r.status])).toEqual([
      ["visit", 0, "invalid"],
      ["visit", 1, "created"],
      ["visit", 2, "invalid"],
      ["visit", 3, "invalid"],
      ["sighting", 0, "invalid"],
      ["sighting", 1, "created"],
      ["sighting", 2, "invalid"],
      ["sighting", 3, "invalid"],
      ["sighting", 4, "invalid"],
    ]);
    expect(results[0]!.errors).toEqual({ notes: [TEXT_PROBLEMS.control] });
    expect(results[2]!.errors).toEqual({ coRecorders: [TEXT_PROBLEMS.brokenCharacter] });
    expect(results[3]!.errors).toEqual({
      visitDate: [expect.stringMatching(/^Must be a date between 1900-01-01 and \d{4}-\d\d-\d\d\.$/)],
      clientUpdatedAt: ["Must be a time between 1900-01-01 and 2100-12-31."],
    });
    expect(results[4]!.errors).toEqual({ note: [TEXT_PROBLEMS.control] });
    expect(results[6]!.errors).toEqual({ note: [TEXT_PROBLEMS.brokenCharacter] });
    expect(results[7]!.errors).toEqual({ clientUpdatedAt: ["Must be a time between 1900-01-01 and 2100-12-31."] });
    expect(results[8]).toMatchObject({ reason: "Turnstone does not have this sighting's walk.", errors: { visitId: [expect.any(String)] } });

    const storedVisits = await db().select({ id: visits.id }).from(visits).where(inArray(visits.id, batch.visits.map((v) => v.id)));
    expect(storedVisits.map((v) => v.id)).toEqual([goodVisit.id]);
    const storedSightings = await db().select().from(sightings).where(inArray(sightings.id, batch.sightings.map((s) => s.id)));
    expect(storedSightings).toEqual([expect.objectContaining({ id: goodSighting.id, visitId: goodVisit.id, count: 2 })]);
  });
});
