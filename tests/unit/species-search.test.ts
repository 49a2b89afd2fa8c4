import { describe, expect, it } from "vitest";
import { fold, searchSpecies, type ChecklistEntry } from "@/lib/field/species-search";

const entry = (id: string, vernacularName: string, scientificName: string): ChecklistEntry => ({ id, vernacularName, scientificName, taxonRank: "species", sensitive: false });

const checklist = [
  entry("a", "Small Skipper", "Thymelicus sylvestris"),
  entry("b", "Essex Skipper", "Thymelicus lineola"),
  entry("c", "Large Skipper", "Ochlodes sylvanus"),
  entry("d", "Meadow Brown", "Maniola jurtina"),
  entry("e", "Piéride du chou", "Pieris brassicae"),
  entry("f", "Sørensen's Blue", "Testus soerensenii"),
];

describe("species search", () => {
  it("ignores case and accents (Unicode NFD decomposition)", () => {
    expect(fold("Piéride")).toBe("pieride");
    expect(searchSpecies(checklist, "PIERIDE").map((s) => s.id)).toEqual(["e"]);
    expect(searchSpecies(checklist, "sorensen").map((s) => s.id)).toEqual(["f"]);
  });

  it("finds by scientific name as well as vernacular", () => {
    expect(searchSpecies(checklist, "maniola").map((s) => s.id)).toEqual(["d"]);
    expect(searchSpecies(checklist, "thymelicus").map((s) => s.id).sort()).toEqual(["a", "b"]);
  });

  it("puts species already seen on this transect first among equal matches", () => {
    const ids = searchSpecies(checklist, "skipper", ["c", "b"]).map((s) => s.id);
    expect(ids).toEqual(["c", "b", "a"]);
  });

  it("ranks a name that starts with the query above one that only contains it", () => {
    const ids = searchSpecies([entry("x", "Brown Argus", "Aricia agestis"), entry("y", "Meadow Brown", "Maniola jurtina")], "brown").map((s) => s.id);
    expect(ids).toEqual(["x", "y"]);
  });

  it("with an empty query, lists what was seen here first", () => {
    expect(searchSpecies(checklist, "", ["d"], 2).map((s) => s.id)[0]).toBe("d");
  });
});
