import { describe, expect, it } from "vitest";
import { REASON_EMPTY, REASON_ONLY_AFTER, REASON_ONLY_BEFORE, TableError, preparePair, restrictToSpecies, tableFromRecords } from "../../../lib/change/tables";

// Rebuilds site i's two aligned vectors from the per-species cell lists.
function denseRows(prepared: ReturnType<typeof preparePair>) {
  const n = prepared.sites.length;
  const p = prepared.species.length;
  const y1 = Array.from({ length: n }, () => new Array<number>(p).fill(0));
  const y2 = Array.from({ length: n }, () => new Array<number>(p).fill(0));
  for (let j = 0; j < p; j++) {
    for (let c = prepared.colStart[j]!; c < prepared.colStart[j + 1]!; c++) {
      y1[prepared.cellSite[c]!]![j] = prepared.before[c]!;
      y2[prepared.cellSite[c]!]![j] = prepared.after[c]!;
    }
  }
  return { y1, y2 };
}

describe("preparePair", () => {
  const before = { sites: ["A", "B", "C", "D"], species: ["x", "y"], values: [[1, 0], [0, 0], [0, 0], [2, 3]] };
  const after = { sites: ["D", "A", "C", "E"], species: ["z", "x"], values: [[4, 0], [0, 5], [0, 0], [1, 1]] };

  it("matches species by name, counts missing species as 0 and keeps T1's site order", () => {
    const prepared = preparePair(before, after, "ruzicka");
    expect(prepared.species).toEqual(["x", "y", "z"]);
    expect(prepared.sites).toEqual(["A", "D"]);
    const { y1, y2 } = denseRows(prepared);
    expect(y1).toEqual([[1, 0, 0], [2, 3, 0]]);
    expect(y2).toEqual([[5, 0, 0], [0, 0, 4]]);
  });

  it("lists every left-out site with its reason", () => {
    const prepared = preparePair(before, after, "jaccard");
    expect(prepared.excluded).toEqual([
      { site: "B", reason: REASON_ONLY_BEFORE },
      { site: "C", reason: REASON_EMPTY },
      { site: "E", reason: REASON_ONLY_AFTER },
    ]);
  });

  it("turns counts into presence for presence-absence indices only", () => {
    expect(denseRows(preparePair(before, after, "sorensen")).y1).toEqual([[1, 0, 0], [1, 1, 0]]);
    expect(denseRows(preparePair(before, after, "percentage-difference")).y1).toEqual([[1, 0, 0], [2, 3, 0]]);
  });

  it("stores only cells non-zero in either season, sites ascending within a species", () => {
    const prepared = preparePair(before, after, "ruzicka");
    expect(Array.from(prepared.colStart)).toEqual([0, 2, 3, 4]);
    expect(Array.from(prepared.cellSite)).toEqual([0, 1, 1, 1]);
  });

  it("rejects duplicate names, ragged rows and negative or non-finite values", () => {
    expect(() => preparePair({ sites: ["A", "A"], species: ["x"], values: [[1], [1]] }, after, "jaccard")).toThrow(/duplicate site "A"/);
    expect(() => preparePair({ sites: ["A"], species: ["x", "x"], values: [[1, 1]] }, after, "jaccard")).toThrow(/duplicate species "x"/);
    expect(() => preparePair({ sites: ["A"], species: ["x", "y"], values: [[1]] }, after, "jaccard")).toThrow(TableError);
    expect(() => preparePair(before, { sites: ["A"], species: ["x"], values: [[-1]] }, "jaccard")).toThrow(/non-negative/);
    expect(() => preparePair(before, { sites: ["A"], species: ["x"], values: [[Number.NaN]] }, "jaccard")).toThrow(/non-negative/);
  });
});

describe("restrictToSpecies", () => {
  it("keeps only the listed species, ignoring names the table lacks", () => {
    const t = { sites: ["A", "B"], species: ["x", "y", "z"], values: [[1, 2, 3], [4, 5, 6]] };
    const r = restrictToSpecies(t, ["z", "x", "nope"]);
    expect(r.species).toEqual(["x", "z"]);
    expect(r.values.map((row) => Array.from(row))).toEqual([[1, 3], [4, 6]]);
    expect(r.sites).toEqual(["A", "B"]);
  });
});

describe("tableFromRecords", () => {
  it("builds a dense table and keeps surveyed sites without records", () => {
    const t = tableFromRecords([{ site: "A", species: "x", value: 2 }, { site: "B", species: "y", value: 1 }], { sites: ["C"] });
    expect(t.sites).toEqual(["C", "A", "B"]);
    expect(t.species).toEqual(["x", "y"]);
    expect(t.values.map((row) => Array.from(row))).toEqual([[0, 0], [2, 0], [0, 1]]);
  });

  it("rejects a repeated (site, species) record and negative values", () => {
    expect(() => tableFromRecords([{ site: "A", species: "x", value: 1 }, { site: "A", species: "x", value: 2 }])).toThrow(/duplicate record/);
    expect(() => tableFromRecords([{ site: "A", species: "x", value: -2 }])).toThrow(TableError);
  });
});
