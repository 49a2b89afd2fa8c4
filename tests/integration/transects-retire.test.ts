import { and, count, eq } from "drizzle-orm";
import { beforeAll, beforeEach, describe, expect, it, vi } from "vitest";
import { db } from "@/db/client";
import { networkChanges, sightings, transectAssignments, transects, visits } from "@/db/schema";
import { assignedTransects } from "@/lib/queries/field";
import { resetToDemo } from "./support/db";
import { call, demo, userId } from "./transects-helpers";

const session = vi.hoisted(() => ({ userId: null as string | null }));
vi.mock("@/lib/auth/session", () => ({ sessionUserId: async () => session.userId }));

const retire = await import("@/app/(network)/api/network/transects/[id]/retire/route");
const list = await import("@/app/(network)/api/network/transects/route");
const history = await import("@/lib/queries/change-log");

describe("retiring a transect", () => {
  let id: string;
  let volunteerId: string;
  let walksBefore: number;
  let sightingsBefore: number;

  const countWalks = async () => (await db().select({ n: count() }).from(visits).where(eq(visits.transectId, id)))[0]!.n;
  const countSightings = async () => (await db().select({ n: count() }).from(sightings).innerJoin(visits, eq(visits.id, sightings.visitId)).where(eq(visits.transectId, id)))[0]!.n;

  beforeAll(async () => {
    await resetToDemo();
    volunteerId = await userId(demo.volunteer);
    const [assignment] = await db().select().from(transectAssignments).where(eq(transectAssignments.userId, volunteerId)).limit(1);
    id = assignment!.transectId;
    walksBefore = await countWalks();
    sightingsBefore = await countSightings();
    expect(walksBefore).toBeGreaterThan(0);
  });

  beforeEach(async () => {
    session.userId = await userId(demo.organiser);
  });

  it("stops it reaching the assigned volunteer's phone, keeps its walks, sightings and assignment, and logs it", async () => {
    const volunteer = { id: volunteerId, roles: ["volunteer" as const], name: "", email: demo.volunteer };
    expect((await assignedTransects(volunteer)).transects.map((t) => t.id)).toContain(id);
    const { status, json } = await call(retire.POST, { params: { id } });
    expect(status).toBe(200);
    expect(json.transect).toMatchObject({ id, active: false });
    expect(json.transect.retiredAt).toEqual(expect.any(String));
    expect((await assignedTransects(volunteer)).transects.map((t) => t.id)).not.toContain(id);
    expect(await countWalks()).toBe(walksBefore);
    expect(await countSightings()).toBe(sightingsBefore);
    expect(await db().select().from(transectAssignments).where(and(eq(transectAssignments.transectId, id), eq(transectAssignments.userId, volunteerId)))).toHaveLength(1);
    const page = await history.listChanges({ entity: "transect", entityId: id });
    expect(page.rows.map((r) => r.action)).toEqual(["retire"]);
    expect(page.rows[0]).toMatchObject({ before: { active: true }, after: { active: false } });
  });

  it("still lists it, marked retired, with its past walks", async () => {
    const { json } = await call(list.GET);
    const row = json.transects.find((t: { id: string }) => t.id === id);
    expect(row).toMatchObject({ active: false });
    expect(json.transects[json.transects.length - 1].active).toBe(false);
  });

  it("retiring twice writes no second log row; reinstating brings it back", async () => {
    await call(retire.POST, { params: { id } });
    expect((await db().select({ n: count() }).from(networkChanges).where(eq(networkChanges.entityId, id)))[0]!.n).toBe(1);
    const { json } = await call(retire.DELETE, { params: { id } });
    expect(json.transect).toMatchObject({ active: true, retiredAt: null });
    const [row] = await db().select().from(transects).where(eq(transects.id, id));
    expect(row!.active).toBe(true);
    expect((await history.listChanges({ entity: "transect", entityId: id })).rows.map((r) => r.action)).toEqual(["reinstate", "retire"]);
  });
});
