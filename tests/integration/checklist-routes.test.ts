import { eq } from "drizzle-orm";
import { beforeAll, beforeEach, describe, expect, it, vi } from "vitest";
import { db } from "@/db/client";
import { networkChanges, species, speciesTags, users } from "@/db/schema";
import { demoPeople } from "@/db/seed/network";
import { resetToDemo } from "./support/db";

// Every checklist route through its handler: who may call it, and what bad input gets. Only
// Auth.js's cookie decoding is replaced; the person and their role are read from the database.
const session = vi.hoisted(() => ({ userId: null as string | null }));
vi.mock("@/lib/auth/session", () => ({ sessionUserId: async () => session.userId }));

const list = await import("@/app/(network)/api/network/checklist/route");
const one = await import("@/app/(network)/api/network/checklist/[id]/route");
const tags = await import("@/app/(network)/api/network/checklist/tags/route");
const tag = await import("@/app/(network)/api/network/checklist/tags/[id]/route");
const merge = await import("@/app/(network)/api/network/checklist/merge/route");
const preview = await import("@/app/(network)/api/network/checklist/import/preview/route");
const importRoute = await import("@/app/(network)/api/network/checklist/import/route");

type Answer = { status: number; json: Record<string, unknown> & { error?: { code: string; message: string; fields?: Record<string, string[]> } } };
type Handler = (request: Request, context: { params: Promise<Record<string, string>> }) => Promise<Response>;

async function call(handler: Handler, method: string, path: string, body?: unknown, params: Record<string, string> = {}): Promise<Answer> {
  const init: RequestInit = { method, headers: body === undefined ? {} : { "content-type": "application/json" }, body: body === undefined ? undefined : JSON.stringify(body) };
  const res = await handler(new Request(`http://localhost/api/network/checklist${path}`, init), { params: Promise.resolve(params) });
  return { status: res.status, json: (await res.json()) as Answer["json"] };
}

async function signInAs(email: string | null) {
  if (email === null) return void (session.userId = null);
  const [u] = await db().select({ id: users.id }).from(users).where(eq(users.email, email));
  session.userId = u!.id;
}
async function idOf(name: string) {
  const [row] = await db().select({ id: species.id }).from(species).where(eq(species.scientificName, name));
  return row!.id;
}
async function entryInput(id: string) {
  const res = await call(one.GET as Handler, "GET", `/${id}`, undefined, { id });
  const e = res.json.entry as { scientificName: string; vernacularName: string; taxonRank: string; sensitive: boolean; activeMonths: number[]; tags: { id: string }[]; synonyms: string[]; covers: { id: string }[] };
  return { scientificName: e.scientificName, vernacularName: e.vernacularName, taxonRank: e.taxonRank, sensitive: e.sensitive, activeMonths: e.activeMonths, tagIds: e.tags.map((t) => t.id), synonyms: e.synonyms, covers: e.covers.map((c) => c.id) };
}

describe("checklist routes: who may call them", () => {
  let ids: { entry: string; other: string; tag: string };
  // Every route and method, with a body good enough to pass validation.
  const routes = () => [
    { name: "GET /checklist", read: true, run: () => call(list.GET as Handler, "GET", "") },
    { name: "GET /checklist/[id]", read: true, run: () => call(one.GET as Handler, "GET", `/${ids.entry}`, undefined, { id: ids.entry }) },
    { name: "GET /checklist/tags", read: true, run: () => call(tags.GET as Handler, "GET", "/tags") },
    { name: "PATCH /checklist/[id]", read: false, run: () => call(one.PATCH as Handler, "PATCH", `/${ids.entry}`, { scientificName: "Aglais io", vernacularName: "Peacock", taxonRank: "species", sensitive: false, activeMonths: [], tagIds: [], synonyms: [], covers: [] }, { id: ids.entry }) },
    { name: "POST /checklist/tags", read: false, run: () => call(tags.POST as Handler, "POST", "/tags", { label: "Garden visitor", description: null }) },
    { name: "PATCH /checklist/tags/[id]", read: false, run: () => call(tag.PATCH as Handler, "PATCH", `/tags/${ids.tag}`, { label: "Migrant species", description: null }, { id: ids.tag }) },
    { name: "POST /checklist/merge", read: false, run: () => call(merge.POST as Handler, "POST", "/merge", { keepId: ids.entry, foldId: ids.other }) },
    { name: "POST /checklist/import/preview", read: false, run: () => call(preview.POST as Handler, "POST", "/import/preview", { fileName: "c.csv", text: "scientific_name,vernacular_name\nAglais io,Peacock\n" }) },
    { name: "POST /checklist/import", read: false, run: () => call(importRoute.POST as Handler, "POST", "/import", { fileName: "c.csv", text: "scientific_name,vernacular_name\nAglais io,Peacock\n", previewHash: "x" }) },
  ];

  beforeAll(async () => {
    await resetToDemo();
    const [t] = await db().select({ id: speciesTags.id }).from(speciesTags).where(eq(speciesTags.slug, "migrant"));
    ids = { entry: await idOf("Aglais io"), other: await idOf("Aglais urticae"), tag: t!.id };
  });

  it("answers 401 without a session, on every route", async () => {
    await signInAs(null);
    for (const r of routes()) expect([r.name, (await r.run()).status]).toEqual([r.name, 401]);
  });

  it("refuses volunteers and partners on every route (403), and writes nothing", async () => {
    const before = await db().select().from(networkChanges);
    for (const email of [demoPeople.volunteers[0]!.email, demoPeople.partner.email]) {
      await signInAs(email);
      for (const r of routes()) expect([email, r.name, (await r.run()).status]).toEqual([email, r.name, 403]);
    }
    expect(await db().select().from(networkChanges)).toEqual(before);
  });

  it("lets reviewers read the checklist and its tags but change nothing", async () => {
    await signInAs(demoPeople.coordinator.email);
    for (const r of routes()) expect([r.name, (await r.run()).status]).toEqual([r.name, r.read ? 200 : 403]);
  });

  it("lets organisers read and write", async () => {
    await signInAs(demoPeople.organiser.email);
    const answers = [];
    for (const r of routes()) answers.push([r.name, (await r.run()).status]);
    expect(answers).toEqual([
      ["GET /checklist", 200],
      ["GET /checklist/[id]", 200],
      ["GET /checklist/tags", 200],
      ["PATCH /checklist/[id]", 200],
      ["POST /checklist/tags", 201],
      ["PATCH /checklist/tags/[id]", 200],
      ["POST /checklist/merge", 200],
      ["POST /checklist/import/preview", 200],
      // The hash is not the preview's: the import refuses to write what the organiser did not see.
      ["POST /checklist/import", 409],
    ]);
  });
});

describe("checklist routes: reading, editing one entry and tags", () => {
  beforeEach(async () => {
    await resetToDemo();
    await signInAs(demoPeople.organiser.email);
  });

  it("lists every entry with its tags, synonyms, aggregates and sighting counts", async () => {
    const res = await call(list.GET as Handler, "GET", "");
    const entries = res.json.entries as { scientificName: string; tags: { label: string }[]; sightings: number; taxonRank: string }[];
    expect(entries).toHaveLength(48);
    const peacock = entries.find((e) => e.scientificName === "Aglais io")!;
    expect(peacock.tags.map((t) => t.label)).toEqual(["Wider countryside"]);
    expect(peacock.sightings).toBeGreaterThan(0);
    expect(entries.reduce((n, e) => n + e.sightings, 0)).toBeGreaterThan(0);
  });

  it("edits an entry, logging only the fields it changed, before and after", async () => {
    const id = await idOf("Aglais io");
    const input = await entryInput(id);
    const res = await call(one.PATCH as Handler, "PATCH", `/${id}`, { ...input, vernacularName: "Peacock butterfly", synonyms: ["Inachis io"], activeMonths: [3, 4, 5] }, { id });
    expect(res.status).toBe(200);
    expect(res.json.changed).toBe(true);
    expect(res.json.entry).toMatchObject({ vernacularName: "Peacock butterfly", synonyms: ["Inachis io"], activeMonths: [3, 4, 5] });
    const [log] = await db().select().from(networkChanges).where(eq(networkChanges.entityId, id));
    expect(log).toMatchObject({
      entity: "species",
      action: "update",
      summary: "Changed Aglais io: vernacular name, months, synonyms",
      before: { vernacularName: "Peacock", activeMonths: [3, 4, 5, 6, 7, 8, 9, 10], synonyms: [] },
      after: { vernacularName: "Peacock butterfly", activeMonths: [3, 4, 5], synonyms: ["Inachis io"] },
    });
    // Sending the same again changes nothing and logs nothing.
    const again = await call(one.PATCH as Handler, "PATCH", `/${id}`, { ...input, vernacularName: "Peacock butterfly", synonyms: ["Inachis io"], activeMonths: [3, 4, 5] }, { id });
    expect(again.json.changed).toBe(false);
    expect(await db().select().from(networkChanges).where(eq(networkChanges.entityId, id))).toHaveLength(1);
  });

  it("renames an entry and makes an aggregate of two species", async () => {
    const aggregate = await idOf("Thymelicus sylvestris/lineola");
    const input = await entryInput(aggregate);
    const covers = [await idOf("Thymelicus sylvestris"), await idOf("Thymelicus lineola")];
    const res = await call(one.PATCH as Handler, "PATCH", `/${aggregate}`, { ...input, scientificName: "Thymelicus sylvestris agg.", covers }, { id: aggregate });
    expect(res.status).toBe(200);
    expect(res.json.entry).toMatchObject({ scientificName: "Thymelicus sylvestris agg.", covers: [{ scientificName: "Thymelicus lineola" }, { scientificName: "Thymelicus sylvestris" }] });
    const member = await call(one.GET as Handler, "GET", `/${covers[0]}`, undefined, { id: covers[0]! });
    expect(member.json.entry).toMatchObject({ coveredBy: [{ id: aggregate, scientificName: "Thymelicus sylvestris agg." }] });
  });

  it("answers bad input with 400 and field messages, never a 500, and writes nothing", async () => {
    const id = await idOf("Aglais io");
    const input = await entryInput(id);
    const before = await db().select().from(networkChanges);
    const bad = async (body: unknown, params = { id }) => call(one.PATCH as Handler, "PATCH", `/${params.id}`, body, params);

    expect((await bad({ ...input, scientificName: "", activeMonths: [0, 13], taxonRank: "kingdom", tagIds: ["x"] })).json.error!.fields).toEqual({
      scientificName: ["Enter the scientific name."],
      taxonRank: ["Choose a rank."],
      "activeMonths.0": ["Months are 1 (January) to 12 (December)."],
      "activeMonths.1": ["Months are 1 (January) to 12 (December)."],
      "tagIds.0": ["Choose tags from the list."],
    });
    expect((await bad({ ...input, scientificName: "Aglais\u0000io" })).json.error!.fields).toEqual({ scientificName: ["Must not contain control characters."] });
    expect((await bad({ ...input, synonyms: ["Aglais urticae"] })).json.error!.fields).toEqual({
      synonyms: ['"Aglais urticae" is the scientific name of another entry (Aglais urticae on the checklist); a name belongs to one entry only.'],
    });
    expect((await bad({ ...input, scientificName: "Aglais urticae" })).json.error!.fields).toEqual({
      scientificName: ['"Aglais urticae" is already on the checklist as another entry (Aglais urticae).'],
    });
    expect((await bad({ ...input, covers: [await idOf("Aglais urticae")] })).json.error!.fields).toEqual({ covers: ["Only an aggregate covers other species."] });
    expect((await bad({ ...input, taxonRank: "species_aggregate", covers: [await idOf("Aglais urticae"), await idOf("Thymelicus sylvestris/lineola")] })).json.error!.fields).toEqual({
      covers: ['"Thymelicus sylvestris/lineola" is itself an aggregate; an aggregate covers species only.'],
    });
    expect((await bad({ ...input, tagIds: ["00000000-0000-4000-8000-000000000000"] })).json.error!.fields).toEqual({ tagIds: ["A chosen tag is no longer on the checklist."] });
    expect((await bad(input, { id: "not-a-uuid" })).json.error!.fields).toEqual({ id: ["That is not a checklist id."] });
    expect((await bad(input, { id: "00000000-0000-4000-8000-000000000000" })).status).toBe(404);
    const notJson = await one.PATCH(new Request(`http://localhost/api/network/checklist/${id}`, { method: "PATCH", headers: { "content-type": "application/json" }, body: "{" }), { params: Promise.resolve({ id }) });
    expect(notJson.status).toBe(400);
    expect(await db().select().from(networkChanges)).toEqual(before);
  });

  it("creates and renames tags, logging both; a name that is taken is refused", async () => {
    const created = await call(tags.POST as Handler, "POST", "/tags", { label: "Non-native", description: "Introduced by people." });
    expect(created.status).toBe(201);
    const newTag = created.json.tag as { id: string; slug: string };
    expect(newTag.slug).toBe("non-native");
    const renamed = await call(tag.PATCH as Handler, "PATCH", `/tags/${newTag.id}`, { label: "Introduced", description: "Introduced by people." }, { id: newTag.id });
    expect(renamed.json).toEqual({ changed: true });
    const listed = (await call(tags.GET as Handler, "GET", "/tags")).json.tags as { id: string; label: string; slug: string }[];
    expect(listed.find((t) => t.id === newTag.id)).toMatchObject({ label: "Introduced", slug: "non-native" });
    const log = await db().select().from(networkChanges).where(eq(networkChanges.entityId, newTag.id));
    expect(log.map((l) => l.summary).sort()).toEqual(["Created the species tag Non-native", "Renamed the species tag Non-native to Introduced"]);

    expect((await call(tags.POST as Handler, "POST", "/tags", { label: "grassland SPECIALIST", description: null })).json.error!.fields).toEqual({
      label: ['That name is taken by the tag "Grassland specialist" (grassland-specialist).'],
    });
    expect((await call(tags.POST as Handler, "POST", "/tags", { label: "a;b" })).json.error!.fields).toEqual({ label: ["The tag's name cannot contain a semicolon."] });
    expect((await call(tags.POST as Handler, "POST", "/tags", { label: "" })).json.error!.fields).toEqual({ label: ["Enter the tag's name."] });
  });
});
