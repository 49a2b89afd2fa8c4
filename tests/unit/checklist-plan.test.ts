import { readFileSync } from "node:fs";
import { describe, expect, it } from "vitest";
import { planChecklistImport, type ChecklistSnapshot, type PlanResult } from "@/lib/checklist/plan";
import { problemText } from "@/lib/checklist/problems";
import { readChecklistCsv } from "@/lib/checklist/read-csv";

// Synonyms and aggregates as checklists keep them (common practice): a name belongs to one entry,
// either as its accepted name or as a synonym; an aggregate stands for two or more species.
const tags = [
  { id: "t-wider", slug: "wider-countryside", label: "Wider countryside" },
  { id: "t-wood", slug: "woodland-specialist", label: "Woodland specialist" },
  { id: "t-grass", slug: "grassland-specialist", label: "Grassland specialist" },
];
const entry = (id: string, scientificName: string, vernacularName: string, more: Partial<ChecklistSnapshot["entries"][number]> = {}) => ({
  id,
  scientificName,
  vernacularName,
  taxonRank: "species" as const,
  sensitive: false,
  activeMonths: [] as number[],
  tagIds: [] as string[],
  synonyms: [] as string[],
  memberIds: [] as string[],
  ...more,
});
const range = (a: number, b: number) => Array.from({ length: b - a + 1 }, (_, i) => a + i);
// The part of the demo checklist (db/seed/species.ts) the good fixture touches.
const demo: ChecklistSnapshot = {
  tags,
  entries: [
    entry("s-io", "Aglais io", "Peacock", { activeMonths: range(3, 10), tagIds: ["t-wider"] }),
    entry("s-jurtina", "Maniola jurtina", "Meadow Brown", { activeMonths: range(6, 9), tagIds: ["t-wider"] }),
    entry("s-sinapis", "Leptidea sinapis", "Wood White", { activeMonths: range(5, 8), tagIds: ["t-wood"] }),
    entry("s-sylvestris", "Thymelicus sylvestris", "Small Skipper", { activeMonths: range(6, 8), tagIds: ["t-grass"] }),
    entry("s-lineola", "Thymelicus lineola", "Essex Skipper", { activeMonths: range(6, 8), tagIds: ["t-grass"] }),
    entry("s-skippers", "Thymelicus sylvestris/lineola", "Small/Essex Skipper", { taxonRank: "species_aggregate", activeMonths: range(6, 8) }),
    entry("s-urticae", "Aglais urticae", "Small Tortoiseshell", { synonyms: ["Nymphalis urticae"] }),
  ],
};

function plan(text: string, snapshot: ChecklistSnapshot = demo): PlanResult {
  const read = readChecklistCsv(text);
  if (!read.ok) throw new Error(`the reader refused the file: ${read.problems.map(problemText).join("; ")}`);
  return planChecklistImport(read, snapshot);
}
function problemsOf(result: PlanResult): string[] {
  expect(result.ok).toBe(false);
  return result.ok ? [] : result.problems.map(problemText);
}
const csv = (...lines: string[]) => `${lines.join("\n")}\n`;
const HEADER = "scientific_name,vernacular_name,taxon_rank,tags,sensitive,active_months,synonyms,covers";

describe("planning a checklist import", () => {
  it("the good fixture: new, changed with the changed fields, unchanged, and the tag it creates", () => {
    const result = plan(readFileSync("tests/fixtures/checklist/checklist-good.csv", "utf8"));
    if (!result.ok) throw new Error(result.problems.map(problemText).join("\n"));
    const { entries, counts, newTags } = result.plan;
    expect(counts).toEqual({ added: 3, changed: 2, unchanged: 1 });
    expect(newTags).toEqual(["Non-native"]);
    expect(entries.map((e) => [e.line, e.values.scientificName, e.status, e.changes.map((c) => c.field)])).toEqual([
      [2, "Aglais io", "changed", ["synonyms"]],
      [3, "Maniola jurtina", "unchanged", []],
      [4, "Leptidea juvernica", "new", []],
      [5, "Leptidea sinapis/juvernica", "new", []],
      [6, "Cacyreus marshalli", "new", []],
      [7, "Thymelicus sylvestris/lineola", "changed", ["covers"]],
    ]);
    expect(entries[0]!.changes).toEqual([{ field: "synonyms", before: [], after: ["Inachis io"] }]);
    expect(entries[5]!.changes).toEqual([{ field: "covers", before: [], after: ["Thymelicus lineola", "Thymelicus sylvestris"] }]);
    expect(entries[3]!.values).toEqual({
      scientificName: "Leptidea sinapis/juvernica",
      vernacularName: "Wood White, Cryptic Wood White",
      taxonRank: "species_aggregate",
      sensitive: false,
      activeMonths: [5, 6, 7, 8],
      tags: [],
      synonyms: [],
      covers: ["Leptidea juvernica", "Leptidea sinapis"],
    });
    expect(entries[4]!.values.tags).toEqual(["Non-native"]);
  });

  it("matches entries by scientific name in any letter case; a case fix is a change", () => {
    const result = plan(csv("scientific_name,vernacular_name", "aglais IO,Peacock"));
    expect(result.ok && result.plan.entries[0]).toMatchObject({ id: "s-io", status: "changed", changes: [{ field: "scientificName", before: "Aglais io", after: "aglais IO" }] });
  });

  it("a column left out leaves that field as it is", () => {
    const result = plan(csv("scientific_name,vernacular_name", "Aglais io,Peacock butterfly"));
    expect(result.ok && result.plan.entries[0]!.changes).toEqual([{ field: "vernacularName", before: "Peacock", after: "Peacock butterfly" }]);
    expect(result.ok && result.plan.entries[0]!.values.tags).toEqual(["Wider countryside"]);
  });

  it("every bad cell is reported with its line, column and reason, all at once", () => {
    expect(
      problemsOf(
        plan(
          csv(
            HEADER,
            "Aglais io,,species,,no,3-10,,",
            "Pieris napi,Green-veined White,speces,,maybe,4-13,,",
            ",Nameless,species,,no,,,",
          ),
        ),
      ),
    ).toEqual([
      "Line 2, column vernacular_name: Enter the vernacular name.",
      'Line 3, column taxon_rank: "speces" is not a taxon rank. Use one of: species, subspecies, species_aggregate, genus, family, other.',
      'Line 3, column sensitive: "maybe" is not yes or no (true or false).',
      "Line 3, column active_months: 13 is not a month: months are 1 (January) to 12 (December).",
      "Line 4, column scientific_name: Enter the scientific name.",
    ]);
  });

  it("refuses the same entry twice in a file, in any letter case", () => {
    expect(problemsOf(plan(csv("scientific_name,vernacular_name", "Pieris napi,Green-veined White", "PIERIS NAPI,Green-veined White")))).toEqual([
      'Line 3, column scientific_name: "PIERIS NAPI" is already on line 2; each entry can appear once.',
    ]);
  });

  it("refuses a name that would belong to two entries: synonym against a name or a synonym, on the checklist or in the file", () => {
    expect(
      problemsOf(
        plan(
          csv(
            "scientific_name,vernacular_name,synonyms",
            "Pieris napi,Green-veined White,Aglais io",
            "Pieris rapae,Small White,Nymphalis urticae",
            "Nymphalis urticae,Small Tortoiseshell (old name),",
            "Pieris brassicae,Large White,Pieris rapae",
            "Gonepteryx rhamni,Brimstone,Papilio rhamni",
            "Colias croceus,Clouded Yellow,papilio RHAMNI",
            "Vanessa atalanta,Red Admiral,Vanessa atalanta",
          ),
        ),
      ),
    ).toEqual([
      'Line 2, column synonyms: "Aglais io" is the scientific name of another entry (Aglais io on the checklist); a name belongs to one entry only.',
      'Line 3, column synonyms: "Nymphalis urticae" is already a synonym of Aglais urticae on the checklist; a name belongs to one entry only.',
      'Line 4, column scientific_name: "Nymphalis urticae" is a synonym of Aglais urticae on the checklist. Merge the two entries, or remove the synonym first.',
      'Line 5, column synonyms: "Pieris rapae" is the scientific name of another entry (Pieris rapae on line 3); a name belongs to one entry only.',
      'Line 7, column synonyms: "papilio RHAMNI" is already a synonym of Gonepteryx rhamni on line 6; a name belongs to one entry only.',
      "Line 8, column synonyms: A synonym cannot be the entry's own scientific name.",
    ]);
  });

  it("a synonym may move from one entry to another when the same file takes it away from the first", () => {
    const result = plan(csv("scientific_name,vernacular_name,synonyms", "Aglais urticae,Small Tortoiseshell,", "Aglais io,Peacock,Nymphalis urticae"));
    expect(result.ok && result.plan.counts).toEqual({ added: 0, changed: 2, unchanged: 0 });
  });

  it("an aggregate covers at least two species, on the checklist or in the file, never an aggregate, a synonym or itself", () => {
    expect(
      problemsOf(
        plan(
          csv(
            "scientific_name,vernacular_name,taxon_rank,covers",
            "Pieris agg.,Whites,species_aggregate,Pieris rapae;Pieris napi",
            "Pieris napi,Green-veined White,species,",
            "Aglais agg.,Aglais,species_aggregate,Aglais io;Nymphalis urticae",
            "Big agg.,Big,species_aggregate,Thymelicus sylvestris/lineola;Big agg.;Aglais io",
            "Lonely agg.,Lonely,species_aggregate,Aglais io",
            "Aglais io,Peacock,species,Aglais urticae",
          ),
        ),
      ),
    ).toEqual([
      'Line 2, column covers: "Pieris rapae" is not on the checklist or in this file.',
      'Line 4, column covers: "Nymphalis urticae" is a synonym of Aglais urticae on the checklist: name the species by its scientific name.',
      'Line 5, column covers: "Thymelicus sylvestris/lineola" is itself an aggregate; an aggregate covers species only.',
      "Line 5, column covers: An aggregate cannot cover itself.",
      "Line 6, column covers: An aggregate covers at least two species, separated by semicolons.",
      "Line 7, column covers: Only an aggregate (taxon_rank species_aggregate) covers other species.",
    ]);
  });

  it("refuses to make an entry an aggregate while an aggregate covers it", () => {
    const snapshot = { ...demo, entries: demo.entries.map((e) => (e.id === "s-skippers" ? { ...e, memberIds: ["s-sylvestris", "s-lineola"] } : e)) };
    expect(problemsOf(plan(csv("scientific_name,vernacular_name,taxon_rank", "Thymelicus lineola,Essex Skipper,species_aggregate"), snapshot))).toEqual([
      "Line 2, column taxon_rank: Thymelicus sylvestris/lineola covers this entry, so it cannot become an aggregate itself.",
    ]);
  });

  it("an aggregate made a species no longer covers anything, and the preview says so", () => {
    const snapshot = { ...demo, entries: demo.entries.map((e) => (e.id === "s-skippers" ? { ...e, memberIds: ["s-sylvestris", "s-lineola"] } : e)) };
    const result = plan(csv("scientific_name,vernacular_name,taxon_rank", "Thymelicus sylvestris/lineola,Small/Essex Skipper,species"), snapshot);
    expect(result.ok && result.plan.entries[0]!.changes).toEqual([
      { field: "taxonRank", before: "species_aggregate", after: "species" },
      { field: "covers", before: ["Thymelicus lineola", "Thymelicus sylvestris"], after: [] },
    ]);
  });

  it("tags: existing ones by label or slug; a new one is created once however it is spelt", () => {
    const result = plan(csv("scientific_name,vernacular_name,tags", "Aglais io,Peacock,wider-countryside;Garden visitor", "Pieris napi,Green-veined White,garden visitor;WIDER COUNTRYSIDE"));
    expect(result.ok && result.plan.newTags).toEqual(["Garden visitor"]);
    expect(result.ok && result.plan.entries.map((e) => e.values.tags)).toEqual([
      ["Garden visitor", "Wider countryside"],
      ["Garden visitor", "Wider countryside"],
    ]);
  });
});
