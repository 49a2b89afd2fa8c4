import { describe, expect, it } from "vitest";
import { readBoolean, readCovers, readRank, readScientificName, readSynonyms, readTags } from "@/lib/checklist/cells";
import { formatMonths, parseMonths } from "@/lib/checklist/months";
import { TAXON_RANKS } from "@/lib/checklist/ranks";
import { findTag, slugify } from "@/lib/checklist/tags";
import { taxonRankEnum } from "@/db/schema/taxa";

describe("checklist cells", () => {
  it("months: runs, lists, a run across the new year, and empty for none", () => {
    expect(parseMonths("4-9")).toEqual({ months: [4, 5, 6, 7, 8, 9] });
    expect(parseMonths("4;5;6")).toEqual({ months: [4, 5, 6] });
    expect(parseMonths(" 3 - 5 ; 9 ")).toEqual({ months: [3, 4, 5, 9] });
    expect(parseMonths("11-2")).toEqual({ months: [1, 2, 11, 12] });
    expect(parseMonths("6–8")).toEqual({ months: [6, 7, 8] });
    expect(parseMonths("")).toEqual({ months: [] });
    expect(parseMonths("1-12")).toEqual({ months: [1, 2, 3, 4, 5, 6, 7, 8, 9, 10, 11, 12] });
  });

  it("months: refuses what is not a month, saying why", () => {
    expect(parseMonths("5-13")).toEqual({ error: "13 is not a month: months are 1 (January) to 12 (December)." });
    expect(parseMonths("0")).toEqual({ error: "0 is not a month: months are 1 (January) to 12 (December)." });
    expect(parseMonths("April")).toEqual({ error: '"April" is not a month or a run of months: write months as numbers, e.g. 4-9 or 4;5;6.' });
    expect(parseMonths("4-")).toMatchObject({ error: expect.stringContaining('"4-" is not a month') });
    expect(parseMonths("4,5")).toMatchObject({ error: expect.stringContaining('"4,5"') });
  });

  it("months read back as runs, across the new year too", () => {
    expect(formatMonths([4, 5, 6, 7, 8, 9])).toBe("Apr–Sep");
    expect(formatMonths([1, 2, 11, 12])).toBe("Nov–Feb");
    expect(formatMonths([3, 4, 5, 9])).toBe("Mar–May, Sep");
    expect(formatMonths([])).toBe("");
    expect(formatMonths([1, 2, 3, 4, 5, 6, 7, 8, 9, 10, 11, 12])).toBe("all year");
  });

  it("yes/no and true/false in any letter case; empty is no", () => {
    expect(["yes", "YES", "true", "True"].map((c) => readBoolean(c))).toEqual(Array(4).fill({ value: true }));
    expect(["no", "No", "false", "", " "].map((c) => readBoolean(c))).toEqual(Array(5).fill({ value: false }));
    expect(readBoolean("maybe")).toEqual({ error: '"maybe" is not yes or no (true or false).' });
  });

  it("ranks are the database's, empty meaning species", () => {
    expect(TAXON_RANKS).toEqual(taxonRankEnum.enumValues);
    expect(readRank("")).toEqual({ value: "species" });
    expect(readRank("Species aggregate")).toEqual({ value: "species_aggregate" });
    expect(readRank("kingdom")).toEqual({ error: '"kingdom" is not a taxon rank. Use one of: species, subspecies, species_aggregate, genus, family, other.' });
  });

  it("names: spaces collapse, line breaks and overlong names are refused", () => {
    expect(readScientificName("  Aglais   io ")).toEqual({ value: "Aglais io" });
    expect(readScientificName("")).toEqual({ error: "Enter the scientific name." });
    expect(readScientificName("Aglais\nio")).toEqual({ error: "The scientific name must be on one line." });
    expect(readScientificName("A".repeat(201))).toEqual({ error: "The scientific name can be at most 200 characters." });
  });

  it("lists split on semicolons, drop blanks and repeats in any letter case", () => {
    expect(readSynonyms("Inachis io; ;inachis io;Nymphalis io")).toEqual({ value: ["Inachis io", "Nymphalis io"] });
    expect(readCovers("")).toEqual({ value: [] });
    expect(readSynonyms(Array.from({ length: 51 }, (_, i) => `Name ${i}`).join(";"))).toEqual({ error: "At most 50 names, separated by semicolons." });
    expect(readTags("!!!")).toEqual({ error: 'The tag "!!!" needs at least one letter or digit.' });
  });

  it("tags are found by label, slug, or the slug a label would get", () => {
    const tags = [{ id: "t1", slug: "grassland-specialist", label: "Grassland specialist" }];
    expect(slugify("Non-native (introduced)")).toBe("non-native-introduced");
    expect(slugify("Éarly flier")).toBe("early-flier");
    for (const name of ["Grassland specialist", "GRASSLAND SPECIALIST", "grassland-specialist", "Grassland  specialist!"]) expect(findTag(tags, name)?.id).toBe("t1");
    expect(findTag(tags, "grassland")).toBeUndefined();
  });
});
