import { eq } from "drizzle-orm";
import { beforeAll, beforeEach, describe, expect, it, vi } from "vitest";
import { db } from "@/db/client";
import { habitatGroups, networkChanges } from "@/db/schema";
import { resetToDemo } from "./support/db";
import { call, demo, details, tableCounts, userId } from "./transects-helpers";

const session = vi.hoisted(() => ({ userId: null as string | null }));
vi.mock("@/lib/auth/session", () => ({ sessionUserId: async () => session.userId }));

const habitats = await import("@/app/(network)/api/network/habitats/route");
const habitat = await import("@/app/(network)/api/network/habitats/[id]/route");
const transectsRoute = await import("@/app/(network)/api/network/transects/route");
const retire = await import("@/app/(network)/api/network/transects/[id]/retire/route");

describe("habitat groups", () => {
  let id: string;

  beforeAll(async () => {
    await resetToDemo();
  });

  beforeEach(async () => {
    session.userId = await userId(demo.organiser);
  });

  it("lists the demo's groups by name with their colours and transect counts", async () => {
    const { status, json } = await call(habitats.GET);
    expect(status).toBe(200);
    expect(json.habitatGroups.map((g: { code: string; colour: string; transects: number }) => [g.code, g.colour, g.transects])).toEqual([
      ["CHK", "downland", 6],
      ["DUN", "gorse", 6],
      ["WET", "estuary", 6],
      ["WDR", "oak", 6],
    ]);
  });

  it("creates a group with a palette colour, logged", async () => {
    const { status, json } = await call(habitats.POST, { body: { code: "hdg", name: "Hedgerows", colour: "foxglove", description: "Field margins and hedge bases." } });
    expect(status).toBe(201);
    expect(json.habitatGroup).toMatchObject({ code: "HDG", name: "Hedgerows", colour: "foxglove" });
    id = json.habitatGroup.id;
    const [log] = await db().select().from(networkChanges).where(eq(networkChanges.entityId, id));
    expect(log).toMatchObject({ entity: "habitat_group", action: "create", after: { code: "HDG", colour: "foxglove" } });
  });

  it("renames it and changes its colour, logging before and after", async () => {
    const { status, json } = await call(habitat.PATCH, { method: "PATCH", params: { id }, body: { name: "Hedgerows and margins", colour: "kingfisher" } });
    expect(status).toBe(200);
    expect(json.habitatGroup).toMatchObject({ name: "Hedgerows and margins", colour: "kingfisher", code: "HDG" });
    const logs = await db().select().from(networkChanges).where(eq(networkChanges.entityId, id));
    const rename = logs.find((l) => l.action === "update")!;
    expect(rename.summary).toBe("Renamed habitat group Hedgerows to Hedgerows and margins");
    expect(rename.before).toMatchObject({ name: "Hedgerows", colour: "foxglove" });
    expect(rename.after).toMatchObject({ name: "Hedgerows and margins", colour: "kingfisher" });
  });

  it("refuses a colour outside the palette, a name or code already used (any letter case), and an empty change, writing nothing", async () => {
    const before = await tableCounts();
    const colour = await call(habitats.POST, { body: { code: "XYZ", name: "Anything", colour: "#ff0000" } });
    expect(colour.json.error.fields.colour).toEqual(["Choose one of the palette's colours."]);
    const name = await call(habitats.POST, { body: { code: "XYZ", name: "chalk DOWNLAND", colour: "slate" } });
    expect(name.json.error.fields.name).toEqual(["Another habitat group has this name."]);
    const code = await call(habitat.PATCH, { method: "PATCH", params: { id }, body: { code: "chk" } });
    expect(code.json.error.fields.code).toEqual(["Another habitat group has this code."]);
    const empty = await call(habitat.PATCH, { method: "PATCH", params: { id }, body: {} });
    expect(empty.status).toBe(400);
    expect(await tableCounts()).toEqual(before);
  });

  it("refuses to delete a group that holds a transect, even a retired one; deletes an empty one", async () => {
    const made = await call(transectsRoute.POST, { body: { ...details(id, "HDG-01"), route: { sections: [{ coordinates: [[-1.3, 51], [-1.3, 51.001]] }] } } });
    expect(made.status).toBe(201);
    expect((await call(retire.POST, { method: "POST", params: { id: made.json.transect.id } })).json.transect.active).toBe(false);
    const before = await tableCounts();
    const refused = await call(habitat.DELETE, { method: "DELETE", params: { id } });
    expect(refused.status).toBe(409);
    expect(refused.json.error.message).toMatch(/has 1 transect .*move them to another group first/);
    expect(await tableCounts()).toEqual(before);

    const empty = await call(habitats.POST, { body: { code: "TMP", name: "Temporary", colour: "slate" } });
    const gone = await call(habitat.DELETE, { method: "DELETE", params: { id: empty.json.habitatGroup.id } });
    expect(gone.status).toBe(200);
    expect(await db().select().from(habitatGroups).where(eq(habitatGroups.id, empty.json.habitatGroup.id))).toHaveLength(0);
    const logs = await db().select().from(networkChanges).where(eq(networkChanges.entityId, empty.json.habitatGroup.id));
    expect(logs.map((l) => l.action).sort()).toEqual(["create", "delete"]);
  });
});
