import { describe, expect, it } from "vitest";
import { compareSeasonsSync } from "../../../lib/change/compare";
import { lossGainPlot, lossGainPlots } from "../../../lib/change/plot";
import { restrictToSpecies } from "../../../lib/change/tables";
import { table } from "./support";

// Three hand-made sites, two gaining and one losing species.
const before = table([[1, 1, 1, 0, 0, 0, 0, 0, 0, 0], [1, 1, 1, 1, 0, 0, 0, 0, 0, 0], [1, 1, 1, 1, 1, 1, 1, 1, 1, 0]]);
const after = table([[0, 1, 1, 1, 1, 1, 0, 0, 0, 0], [0, 0, 0, 1, 1, 1, 1, 1, 0, 0], [1, 1, 1, 1, 1, 1, 1, 0, 0, 1]]);
const result = compareSeasonsSync(before, after, { index: "jaccard", permutations: 0 });

describe("loss-gain plot", () => {
  it("places sites at (losses, gains) with area D and the centroid line y = x + (mean gains - mean losses)", () => {
    const plot = lossGainPlot(result.sites);
    const s = result.sites;
    expect(plot.points.map((p) => [p.x, p.y, p.area])).toEqual(s.map((x) => [x.losses, x.gains, x.dissimilarity]));
    expect(plot.diagonal).toEqual({ from: { x: 0, y: 0 }, to: { x: 1, y: 1 } });
    const mx = s.reduce((a, x) => a + x.losses, 0) / 3;
    const my = s.reduce((a, x) => a + x.gains, 0) / 3;
    expect(plot.centroid!.x).toBeCloseTo(mx, 12);
    expect(plot.centroid!.y).toBeCloseTo(my, 12);
    expect(plot.centroidLine!.intercept).toBeCloseTo(my - mx, 12);
    // Endpoints lie on the line and on the border of the unit square.
    for (const pt of [plot.centroidLine!.from, plot.centroidLine!.to]) {
      expect(pt.y - pt.x).toBeCloseTo(my - mx, 12);
      expect([pt.x, pt.y].some((v) => Math.abs(v) < 1e-12 || Math.abs(v - 1) < 1e-12)).toBe(true);
    }
    expect(plot.direction).toBe(my > mx ? "gain" : "loss");
  });

  it("clips a loss-dominated centroid line to enter at the bottom edge", () => {
    const loss = compareSeasonsSync(table([[1, 1, 1, 1]]), table([[1, 0, 0, 0]]), { index: "jaccard", permutations: 0 });
    const plot = lossGainPlot(loss.sites);
    expect(plot.centroidLine!.from).toEqual({ x: 0.75, y: 0 });
    expect(plot.centroidLine!.to).toEqual({ x: 1, y: 0.25 });
    expect(plot.direction).toBe("loss");
  });

  it("draws one plot per site group and lists sites without a group", () => {
    const plots = lossGainPlots(result.sites, new Map([["S1", "meadow"], ["S3", "meadow"]]));
    expect(plots.all.points).toHaveLength(3);
    expect(plots.groups.map((g) => [g.group, g.points.map((p) => p.site)])).toEqual([["meadow", ["S1", "S3"]]]);
    expect(plots.ungrouped).toEqual(["S2"]);
    const viaRecord = lossGainPlots(result.sites, { S1: "meadow", S2: "wood", S3: "meadow" });
    expect(viaRecord.groups.map((g) => g.group)).toEqual(["meadow", "wood"]);
    expect(viaRecord.groups[0]!.centroid).toEqual(lossGainPlot(result.sites.filter((s) => s.site !== "S2")).centroid);
  });

  it("has no centroid for an empty group", () => {
    expect(lossGainPlot([])).toMatchObject({ points: [], centroid: null, centroidLine: null, direction: null });
  });

  it("plots a species subset from restricted tables", () => {
    const keep = ["sp1", "sp2", "sp3"];
    const subset = compareSeasonsSync(restrictToSpecies(before, keep), restrictToSpecies(after, keep), { index: "jaccard", permutations: 0 });
    // S2 keeps only sp1-3 at T1 and none at T2: every one lost.
    const s2 = subset.sites.find((s) => s.site === "S2")!;
    expect([s2.losses, s2.gains]).toEqual([1, 0]);
    expect(lossGainPlot(subset.sites).points).toHaveLength(3);
  });
});
