import { readFileSync } from "node:fs";
import { eq, sql } from "drizzle-orm";
import { beforeAll, beforeEach, describe, expect, it, vi } from "vitest";
import { db } from "@/db/client";
import { networkChanges, species, speciesAggregateMembers, speciesSynonyms, speciesTagLinks, speciesTags, users } from "@/db/schema";
import type { ImportPlan } from "@/lib/checklist/plan";
import { listChecklist } from "@/lib/queries/checklist";
import { resetToDemo } from "./support/db";

// The import through its two route handlers, against the demo checklist. Only Auth.js's cookie
// decoding is replaced; the person is read from the database.
const session = vi.hoisted(() => ({ userId: null as string | null }));
vi.mock("@/lib/auth/session", () => ({ sessionUserId: async () => session.userId }));

const { POST: previewRoute } = await import("@/app/(network)/api/network/checklist/import/preview/route");
const { POST: importRoute } = await import("@/app/(network)/api/network/checklist/import/route");

const noParams = { params: Promise.resolve({}) };
const fixture = (name: string) => readFileSync(`tests/fixtures/checklist/${name}`, "utf8");
const post = (path: string, body: unknown) => new Request(`http://localhost/api/network/checklist/${path}`, { method: "POST", headers: { "content-type": "application/json" }, body: JSON.stringify(body) });

type Refusal = { error: { code: string; message: string; fields?: Record<string, string[]>; problems?: { line: number | null; column: string | null; reason: string }[] } };

async function preview(text: string, fileName = "checklist.csv") {
  const res = await previewRoute(post("import/preview", { fileName, text }), noParams);
  return { status: res.status, json: (await res.json()) as { plan: ImportPlan; previewHash: string } & Refusal };
}
async function confirm(text: string, previewHash: string, fileName = "checklist.csv") {
  const res = await importRoute(post("import", { fileName, text, previewHash }), noParams);
  return { status: res.status, json: (await res.json()) as { imported: ImportPlan["counts"] & { newTags: number } } & Refusal };
}

/** Rows in every table an import writes. */
async function rowCounts() {
  const n = async (table: typeof species | typeof speciesSynonyms | typeof speciesTagLinks | typeof speciesTags | typeof speciesAggregateMembers | typeof networkChanges) =>
    (await db().select({ n: sql<number>`count(*)::int` }).from(table))[0]!.n;
  return {
    species: await n(species),
    synonyms: await n(speciesSynonyms),
    tagLinks: await n(speciesTagLinks),
    tags: await n(speciesTags),
    members: await n(speciesAggregateMembers),
    changes: await n(networkChanges),
  };
}

async function freshDemo() {
  await resetToDemo();
  const [u] = await db().select({ id: users.id }).from(users).where(eq(users.email, "organiser@harrowmere.example"));
  session.userId = u!.id;
}

describe("importing a checklist file", () => {
  beforeEach(freshDemo);

  it("previews without writing, then writes exactly what it previewed, logged per entry and for the file", async () => {
    const text = fixture("checklist-good.csv");
    // The fixture gives the demo's skipper aggregate its two species; start it with none.
    await db().delete(speciesAggregateMembers);
    const before = await rowCounts();
    const shown = await preview(text);
    expect(shown.status).toBe(200);
    expect(shown.json.plan.counts).toEqual({ added: 3, changed: 2, unchanged: 1 });
    expect(shown.json.plan.newTags).toEqual(["Non-native"]);
    expect(await rowCounts()).toEqual(before);

    const done = await confirm(text, shown.json.previewHash, "spring-checklist.csv");
    expect(done.status).toBe(200);
    expect(done.json.imported).toEqual({ added: 3, changed: 2, unchanged: 1, newTags: 1 });

    // Every previewed entry now reads back with the values the preview showed.
    const byName = new Map((await listChecklist()).map((e) => [e.scientificName, e]));
    for (const planned of shown.json.plan.entries) {
      const stored = byName.get(planned.values.scientificName)!;
      expect({
        scientificName: stored.scientificName,
        vernacularName: stored.vernacularName,
        taxonRank: stored.taxonRank,
        sensitive: stored.sensitive,
        activeMonths: [...stored.activeMonths].sort((a, b) => a - b),
        tags: stored.tags.map((t) => t.label),
        synonyms: stored.synonyms,
        covers: stored.covers.map((c) => c.scientificName),
      }).toEqual(planned.values);
    }
    const again = (await preview(text)).json.plan;
    expect(again.entries.filter((e) => e.status !== "unchanged")).toEqual([]);
    expect(again.counts).toEqual({ added: 0, changed: 0, unchanged: 6 });

    const after = await rowCounts();
    expect(after).toEqual({ ...before, species: before.species + 3, synonyms: before.synonyms + 1, tags: before.tags + 1, tagLinks: before.tagLinks + 2, members: before.members + 4, changes: before.changes + 7 });
    const log = await db().select().from(networkChanges);
    expect(log.filter((c) => c.entity === "import").map((c) => c.summary)).toEqual([
      "Imported the checklist file spring-checklist.csv: 3 added, 2 changed, 1 unchanged; new tags: Non-native",
    ]);
    const io = byName.get("Aglais io")!;
    expect(log.find((c) => c.entityId === io.id)).toMatchObject({ entity: "species", action: "update", before: { synonyms: [] }, after: { synonyms: ["Inachis io"] } });
    expect(log.filter((c) => c.entity === "species" && c.action === "create")).toHaveLength(3);
    expect(log.filter((c) => c.entity === "species_tag")).toHaveLength(1);
  });

  it("a file with one bad line writes nothing and names the line, column and reason", async () => {
    const text = fixture("checklist-one-bad-line.csv");
    const before = await rowCounts();
    const shown = await preview(text);
    expect(shown.status).toBe(400);
    expect(shown.json.error.code).toBe("invalid_file");
    expect(shown.json.error.message).toBe("The file was not imported: 1 problem to put right. Nothing was written.");
    expect(shown.json.error.problems).toEqual([{ line: 4, column: "active_months", reason: "13 is not a month: months are 1 (January) to 12 (December)." }]);
    expect(shown.json.error.fields).toEqual({ text: ["Line 4, column active_months: 13 is not a month: months are 1 (January) to 12 (December)."] });
    // Confirming regardless (a client that skips the preview) is refused the same way.
    const done = await confirm(text, "any-hash");
    expect(done.status).toBe(400);
    expect(done.json.error.problems).toHaveLength(1);
    expect(await rowCounts()).toEqual(before);
  });

  it("refuses to write when the checklist changed after the preview (409), and writes nothing", async () => {
    const text = fixture("checklist-good.csv");
    const shown = await preview(text);
    await db().update(species).set({ vernacularName: "Peacock butterfly" }).where(eq(species.scientificName, "Aglais io"));
    const before = await rowCounts();
    const done = await confirm(text, shown.json.previewHash);
    expect(done.status).toBe(409);
    expect(done.json.error.message).toBe("The checklist or the file has changed since the preview. Look at the new preview before importing.");
    expect(await rowCounts()).toEqual(before);
  });

});

// Refusals write nothing (each case checks), so they share one fresh demo.
describe("refusing each kind of bad checklist file with a clear message, writing nothing", () => {
  beforeAll(freshDemo);
  const header = "scientific_name,vernacular_name,taxon_rank,tags,sensitive,active_months,synonyms,covers";
  const cases: [string, { fileName?: string; text: string }, string][] = [
    ["a missing column", { text: "scientific_name,tags\nAglais io,\n" }, "Line 1: The column vernacular_name is missing."],
    ["an unknown column", { text: "scientific_name,vernacular_name,family\nAglais io,Peacock,Nymphalidae\n" }, 'Line 1: Unknown column "family".'],
    ["an unknown covered species", { text: `${header}\nPieris agg.,Whites,species_aggregate,,no,,,Pieris rapae;Pieris nonexistens\n` }, 'Line 2, column covers: "Pieris nonexistens" is not on the checklist or in this file.'],
    ["bad months", { text: `${header}\nAglais io,Peacock,species,,no,March-May,,\n` }, 'Line 2, column active_months: "March-May" is not a month or a run of months'],
    ["a duplicate name", { text: `${header}\nPieris rapae,Small White,species,,no,,,\npieris rapae,Small White,species,,no,,,\n` }, 'Line 3, column scientific_name: "pieris rapae" is already on line 2'],
    ["a synonym that is another entry's name", { text: `${header}\nPieris rapae,Small White,species,,no,,Pieris napi,\n` }, 'Line 2, column synonyms: "Pieris napi" is the scientific name of another entry (Pieris napi on the checklist)'],
    ["an empty file", { text: "" }, "The file is empty."],
    ["binary data", { text: "PK\u0003\u0004\u0014\u0000\u0008\u0000" }, "Line 1: The file is not CSV text: it holds binary data"],
    ["text that is not UTF-8", { text: `${header}\nAglais io,Paon du jour \uFFFD,species,,no,,,\n` }, 'Line 2: The file is not UTF-8 text. Save it from your spreadsheet as "CSV UTF-8"'],
  ];
  for (const [kind, body, message] of cases) {
    it(kind, async () => {
      const before = await rowCounts();
      const shown = await preview(body.text, body.fileName);
      expect(shown.status).toBe(400);
      expect(shown.json.error.fields!.text!.join("\n")).toContain(message);
      expect((await confirm(body.text, "any-hash", body.fileName)).status).toBe(400);
      expect(await rowCounts()).toEqual(before);
    });
  }

  it("a file whose name says it is not CSV", async () => {
    const shown = await preview(fixture("checklist-good.csv"), "checklist.xlsx");
    expect(shown.status).toBe(400);
    expect(shown.json.error.fields).toEqual({ fileName: ["Choose a CSV file (its name ends in .csv)."] });
  });

  it("a file over 10 MB", async () => {
    const before = await rowCounts();
    const row = "Aglais io,Peacock\n";
    const text = `scientific_name,vernacular_name\n${row.repeat(Math.ceil((10 * 1024 * 1024) / row.length))}`;
    const shown = await preview(text);
    expect(shown.status).toBe(400);
    expect(shown.json.error.fields).toEqual({ text: ["The file is larger than 10 MB."] });
    // Past the body cap (twice the file limit, for JSON escaping) the request is not even read: 413.
    expect((await previewRoute(post("import/preview", { fileName: "big.csv", text: text.repeat(3) }), noParams)).status).toBe(413);
    expect(await rowCounts()).toEqual(before);
  });
});
