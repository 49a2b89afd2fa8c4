import { randomUUID } from "node:crypto";
import { asc, count, eq, ne } from "drizzle-orm";
import { beforeAll, beforeEach, describe, expect, it, vi } from "vitest";
import { db } from "@/db/client";
import { sightings, species, transectAssignments, users, visits } from "@/db/schema";
import { resetToDemo } from "./support/db";

// The handler's own session check is exercised for real; only Auth.js's cookie decoding is
// replaced, so no running app is needed.
const session = vi.hoisted(() => ({ userId: null as string | null }));
vi.mock("@/auth", () => ({ auth: async () => (session.userId ? { user: { id: session.userId } } : null) }));

const { POST } = await import("@/app/(field)/api/field/sync/route");

async function post(body: string) {
  const request = new Request("http://localhost/api/field/sync", { method: "POST", body, headers: { "content-type": "application/json" } });
  const response = await POST(request, { params: Promise.resolve({}) });
  return { status: response.status, json: (await response.json()) as Record<string, any> };
}

async function userId(email: string) {
  const [u] = await db().select({ id: users.id }).from(users).where(eq(users.email, email));
  return u!.id;
}

function batchFor(transectId: string, speciesId: string) {
  const visitId = randomUUID();
  const stamp = "2026-06-02T12:00:00.000Z";
  return {
    visits: [{ id: visitId, transectId, visitDate: "2026-06-02", startTime: "11:00", clientUpdatedAt: stamp }],
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
});
