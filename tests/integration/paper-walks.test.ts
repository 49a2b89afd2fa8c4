import { eq, sql } from "drizzle-orm";
import { beforeEach, describe, expect, it, vi } from "vitest";
import { db } from "@/db/client";
import { networkChanges, seasons, sightings, species, transectAssignments, transects, users, visits } from "@/db/schema";
import { resetToDemo } from "./support/db";

// Entering a paper walk through POST /api/review/paper-walks against the demo network (2025
// season closed on 2025-09-30, 2026 season open). Only Auth.js's cookie decoding is replaced.
const session = vi.hoisted(() => ({ userId: null as string | null }));
vi.mock("@/lib/auth/session", () => ({ sessionUserId: async () => session.userId }));

const { POST } = await import("@/app/(review)/api/review/paper-walks/route");
const noParams = { params: Promise.resolve({}) };

async function idOf(email: string) {
  const [u] = await db().select({ id: users.id }).from(users).where(eq(users.email, email));
  return u!.id;
}
async function send(body: unknown) {
  const res = await POST(new Request("http://localhost/api/review/paper-walks", { method: "POST", headers: { "content-type": "application/json" }, body: JSON.stringify(body) }), noParams);
  return { status: res.status, json: (await res.json()) as { created?: { visitId: string; sightings: number }; error?: { code: string; message: string; fields?: Record<string, string[]> } } };
}
const visitCount = async () => (await db().select({ n: sql<number>`count(*)::int` }).from(visits))[0]!.n;

let walk: Record<string, unknown>;

beforeEach(async () => {
  await resetToDemo();
  const volunteerId = await idOf("volunteer01@harrowmere.example");
  const [assignment] = await db().select({ transectId: transectAssignments.transectId }).from(transectAssignments).where(eq(transectAssignments.userId, volunteerId)).limit(1);
  const [peacock] = await db().select({ id: species.id }).from(species).where(eq(species.scientificName, "Aglais io"));
  const [meadowBrown] = await db().select({ id: species.id }).from(species).where(eq(species.scientificName, "Maniola jurtina"));
  walk = {
    volunteerId,
    transectId: assignment!.transectId,
    visitDate: "2026-06-20",
    startTime: "10:30",
    endTime: "11:40",
    temperatureC: "19.5",
    windBeaufort: "2",
    cloudCoverPercent: "",
    sky: "mostly_sunny",
    completeList: "yes",
    notes: "From the paper sheet",
    sightings: [{ speciesId: peacock!.id, count: "2", section: "1" }, { speciesId: meadowBrown!.id, count: 14, section: "" }],
  };
  session.userId = await idOf("checker@harrowmere.example");
});

describe("entering a paper walk", () => {
  it("stores the walk as the volunteer's, entered by the checker, its sightings waiting", async () => {
    const res = await send(walk);
    expect(res.status).toBe(200);
    const [stored] = await db().select().from(visits).where(eq(visits.id, res.json.created!.visitId));
    expect(stored).toMatchObject({ volunteerId: walk.volunteerId, enteredById: session.userId, importId: null, completeList: true, temperatureC: 19.5, cloudCoverPercent: null, notes: "From the paper sheet" });
    const rows = await db().select().from(sightings).where(eq(sightings.visitId, stored!.id));
    expect(rows.map((r) => [r.status, r.count, r.section]).sort()).toEqual([["pending", 14, null], ["pending", 2, 1]]);
  });

  it("needs the complete-list answer (no default) and refuses a section beyond the route", async () => {
    const before = await visitCount();
    const noAnswer = await send({ ...walk, completeList: undefined });
    expect(noAnswer.status).toBe(400);
    expect(noAnswer.json.error!.fields!.completeList).toEqual(["Say whether every species seen was written down."]);
    const [t] = await db().select({ sections: transects.sectionCount }).from(transects).where(eq(transects.id, walk.transectId as string));
    const beyond = await send({ ...walk, sightings: [{ ...(walk.sightings as object[])[0], section: String(t!.sections + 1) }] });
    expect(beyond.status).toBe(400);
    expect(Object.keys(beyond.json.error!.fields!)).toEqual(["sightings.0.section"]);
    expect(await visitCount()).toBe(before);
  });

  it("refuses volunteers and partners (403) and writes nothing", async () => {
    const before = await visitCount();
    for (const email of ["volunteer01@harrowmere.example", "partner@harrowmere.example"]) {
      session.userId = await idOf(email);
      expect((await send(walk)).status).toBe(403);
    }
    expect(await visitCount()).toBe(before);
  });

  it("refuses a date no season covers", async () => {
    const res = await send({ ...walk, visitDate: "2024-06-20" });
    expect(res.status).toBe(400);
    expect(res.json.error!.fields!.visitDate![0]).toContain("No season covers 2024-06-20");
  });

  it("takes a late walk in the grace period, refuses a frozen season to a checker and logs an organiser's", async () => {
    const late = { ...walk, visitDate: "2025-07-10" };
    // Closed yesterday: inside the 30-day grace period (the demo's default).
    await db().update(seasons).set({ closedAt: new Date(Date.now() - 24 * 3600 * 1000) }).where(eq(seasons.name, "2025 season"));
    expect((await send(late)).status).toBe(200);
    // Closed 60 days ago: frozen.
    await db().update(seasons).set({ closedAt: new Date(Date.now() - 60 * 24 * 3600 * 1000) }).where(eq(seasons.name, "2025 season"));
    const before = await visitCount();
    const refused = await send(late);
    expect(refused.status).toBe(403);
    expect(refused.json.error!.message).toContain("frozen");
    expect(await visitCount()).toBe(before);

    session.userId = await idOf("organiser@harrowmere.example");
    const byOrganiser = await send(late);
    expect(byOrganiser.status).toBe(200);
    const [log] = await db().select().from(networkChanges).where(eq(networkChanges.action, "late-entry"));
    expect(log).toMatchObject({ entity: "season", actorId: session.userId });
    expect(log!.summary).toContain("frozen 2025 season");
  });

  it("refuses someone who is not an active volunteer", async () => {
    const res = await send({ ...walk, volunteerId: await idOf("partner@harrowmere.example") });
    expect(res.status).toBe(400);
    expect(res.json.error!.fields!.volunteerId).toEqual(["Choose an active volunteer."]);
  });
});
