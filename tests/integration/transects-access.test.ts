import { eq } from "drizzle-orm";
import { beforeAll, describe, expect, it, vi } from "vitest";
import { db } from "@/db/client";
import { transectAssignments, transects } from "@/db/schema";
import type { Actor } from "@/lib/auth/guard";
import { visibleRoute } from "@/lib/queries/route-visibility";
import { resetToDemo } from "./support/db";
import { call, demo, tableCounts, userId } from "./transects-helpers";

const session = vi.hoisted(() => ({ userId: null as string | null }));
vi.mock("@/lib/auth/session", () => ({ sessionUserId: async () => session.userId }));

const list = await import("@/app/(network)/api/network/transects/route");
const one = await import("@/app/(network)/api/network/transects/[id]/route");
const versions = await import("@/app/(network)/api/network/transects/[id]/versions/route");
const retire = await import("@/app/(network)/api/network/transects/[id]/retire/route");
const preview = await import("@/app/(network)/api/network/transects/route-file/route");
const habitats = await import("@/app/(network)/api/network/habitats/route");
const habitat = await import("@/app/(network)/api/network/habitats/[id]/route");

type Handler = Parameters<typeof call>[0];

describe("who may use the transect and habitat routes", () => {
  let transectId: string;
  let habitatId: string;
  const line = { sections: [{ coordinates: [[-1.3, 51], [-1.3, 51.001]] }] };

  beforeAll(async () => {
    await resetToDemo();
    const [t] = await db().select().from(transects).limit(1);
    transectId = t!.id;
    habitatId = t!.habitatGroupId;
  });

  // Every route, with a body it would accept from an organiser.
  const writes = (): [string, Handler, Parameters<typeof call>[1]][] => [
    ["POST /transects", list.POST, { body: { code: "ACL-01", name: "Access", habitatGroupId: habitatId, sensitive: false, coastal: false, route: line } }],
    ["PATCH /transects/:id", one.PATCH, { method: "PATCH", params: { id: transectId }, body: { name: "Renamed" } }],
    ["POST /transects/:id/versions", versions.POST, { params: { id: transectId }, body: { validFrom: new Date().toISOString().slice(0, 10), route: line } }],
    ["POST /transects/:id/retire", retire.POST, { method: "POST", params: { id: transectId } }],
    ["DELETE /transects/:id/retire", retire.DELETE, { method: "DELETE", params: { id: transectId } }],
    ["POST /transects/route-file", preview.POST, { body: { fileName: "r.geojson", text: JSON.stringify({ type: "LineString", coordinates: line.sections[0]!.coordinates }) } }],
    ["POST /habitats", habitats.POST, { body: { code: "ACL", name: "Access habitat", colour: "heather" } }],
    ["PATCH /habitats/:id", habitat.PATCH, { method: "PATCH", params: { id: habitatId }, body: { colour: "brick" } }],
    ["DELETE /habitats/:id", habitat.DELETE, { method: "DELETE", params: { id: habitatId } }],
  ];
  const reads = (): [string, Handler, Parameters<typeof call>[1]][] => [
    ["GET /transects", list.GET, {}],
    ["GET /transects/:id", one.GET, { params: { id: transectId } }],
    ["GET /habitats", habitats.GET, {}],
  ];

  it.each(["volunteer", "partner"] as const)("refuses a %s every route, reading or writing, and writes nothing", async (role) => {
    session.userId = await userId(demo[role]);
    const before = await tableCounts();
    for (const [name, handler, options] of [...reads(), ...writes()]) {
      const { status, json } = await call(handler, options);
      expect([name, status, json.error?.code]).toEqual([name, 403, "forbidden"]);
    }
    expect(await tableCounts()).toEqual(before);
  });

  it("lets a reviewer (coordinator) read transects and habitat groups but change nothing", async () => {
    session.userId = await userId(demo.coordinator);
    for (const [name, handler, options] of reads()) expect([name, (await call(handler, options)).status]).toEqual([name, 200]);
    const before = await tableCounts();
    for (const [name, handler, options] of writes()) expect([name, (await call(handler, options)).status]).toEqual([name, 403]);
    expect(await tableCounts()).toEqual(before);
  });

  it("answers 401 to someone not signed in", async () => {
    session.userId = null;
    for (const [name, handler, options] of [...reads(), ...writes()]) expect([name, (await call(handler, options)).status]).toEqual([name, 401]);
  });

  it("lets an organiser do every one of them", async () => {
    session.userId = await userId(demo.organiser);
    for (const [name, handler, options] of reads()) expect([name, (await call(handler, options)).status]).toEqual([name, 200]);
    const expected: Record<string, number> = { "POST /transects": 201, "POST /habitats": 201, "POST /transects/:id/versions": 201, "DELETE /habitats/:id": 409 };
    for (const [name, handler, options] of writes()) expect([name, (await call(handler, options)).status]).toEqual([name, expected[name] ?? 200]);
  });
});

describe("a sensitive transect's exact route", () => {
  let sensitive: typeof transects.$inferSelect;
  const actor = async (email: string, role: Actor["roles"][number]): Promise<Actor> => ({ id: await userId(email), roles: [role], name: "", email });

  beforeAll(async () => {
    await resetToDemo();
    const volunteerId = await userId(demo.volunteer);
    const [assignment] = await db().select().from(transectAssignments).where(eq(transectAssignments.userId, volunteerId)).limit(1);
    [sensitive] = (await db().update(transects).set({ sensitive: true }).where(eq(transects.id, assignment!.transectId)).returning()) as [typeof transects.$inferSelect];
  });

  it("reaches organisers, reviewers and the volunteer assigned to it", async () => {
    for (const who of [await actor(demo.organiser, "organiser"), await actor(demo.coordinator, "coordinator"), await actor(demo.volunteer, "volunteer")]) {
      expect((await visibleRoute(who, sensitive)).route).toEqual(sensitive.route);
    }
  });

  it("reaches nobody else: a partner or another volunteer gets only where it is, to 0.1°", async () => {
    for (const who of [await actor(demo.partner, "partner"), await actor("volunteer12@harrowmere.example", "volunteer")]) {
      const { route } = await visibleRoute(who, sensitive);
      expect(route).toEqual({ type: "generalised", centre: expect.any(Array), precisionDegrees: 0.1 });
      expect(JSON.stringify(route)).not.toContain(String(sensitive.route.coordinates[1]![0]));
    }
  });

  it("is not hidden when the transect is not sensitive", async () => {
    const [open] = await db().select().from(transects).where(eq(transects.sensitive, false)).limit(1);
    expect((await visibleRoute(await actor(demo.partner, "partner"), open!)).route).toEqual(open!.route);
  });
});
