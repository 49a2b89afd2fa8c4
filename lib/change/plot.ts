// Geometry of the loss-gain plot (Legendre 2019, Fig. 2) as data, so any renderer can draw
// it: sites at (losses, gains) on the unit square, marker area proportional to D, the
// no-change diagonal y = x and its parallel through the centroid,
// y = x + (mean gains - mean losses). Centroid line above the diagonal: gains dominate.
import { directionOf } from "./indices";
import type { Direction, SiteChange } from "./types";

export interface PlotPoint {
  readonly site: string;
  readonly x: number;
  readonly y: number;
  /** Marker area, proportional to D (draw the radius as sqrt(area) times a scale). */
  readonly area: number;
  readonly exceptional: boolean;
}

export interface Segment {
  readonly from: { readonly x: number; readonly y: number };
  readonly to: { readonly x: number; readonly y: number };
}

export interface LossGainPlot {
  /** Group name, or null for the plot of all sites. */
  readonly group: string | null;
  readonly points: PlotPoint[];
  readonly diagonal: Segment;
  /** Null when the plot has no sites. */
  readonly centroid: { readonly x: number; readonly y: number } | null;
  /** y = x + intercept, clipped to the unit square; null when there is no centroid. */
  readonly centroidLine: (Segment & { readonly intercept: number }) | null;
  readonly direction: Direction | null;
}

export interface LossGainPlots {
  readonly all: LossGainPlot;
  /** One plot per group, in order of first appearance. */
  readonly groups: LossGainPlot[];
  /** Sites that the group map did not cover. */
  readonly ungrouped: string[];
}

const DIAGONAL: Segment = { from: { x: 0, y: 0 }, to: { x: 1, y: 1 } };

export function lossGainPlot(sites: readonly SiteChange[], group: string | null = null): LossGainPlot {
  const points = sites.map((s) => ({ site: s.site, x: s.losses, y: s.gains, area: s.dissimilarity, exceptional: s.exceptional }));
  if (points.length === 0) return { group, points, diagonal: DIAGONAL, centroid: null, centroidLine: null, direction: null };
  const cx = points.reduce((a, p) => a + p.x, 0) / points.length;
  const cy = points.reduce((a, p) => a + p.y, 0) / points.length;
  const intercept = cy - cx;
  // Clip y = x + intercept to [0,1]^2: it enters on the left or bottom edge.
  const centroidLine =
    intercept >= 0
      ? { intercept, from: { x: 0, y: intercept }, to: { x: 1 - intercept, y: 1 } }
      : { intercept, from: { x: -intercept, y: 0 }, to: { x: 1, y: 1 + intercept } };
  return { group, points, diagonal: DIAGONAL, centroid: { x: cx, y: cy }, centroidLine, direction: directionOf(cx, cy) };
}

/**
 * The plot for all sites and one per site group (e.g. habitat). For a species subset, run
 * the comparison on tables passed through `restrictToSpecies` and plot that result.
 */
export function lossGainPlots(
  sites: readonly SiteChange[],
  groupOf?: ReadonlyMap<string, string> | Readonly<Record<string, string>>,
): LossGainPlots {
  const lookup = (site: string): string | undefined =>
    groupOf === undefined
      ? undefined
      : groupOf instanceof Map
        ? groupOf.get(site)
        : Object.hasOwn(groupOf, site)
          ? (groupOf as Record<string, string>)[site]
          : undefined;
  const byGroup = new Map<string, SiteChange[]>();
  const ungrouped: string[] = [];
  for (const s of sites) {
    const g = lookup(s.site);
    if (g === undefined) {
      if (groupOf !== undefined) ungrouped.push(s.site);
      continue;
    }
    const list = byGroup.get(g) ?? [];
    list.push(s);
    byGroup.set(g, list);
  }
  return {
    all: lossGainPlot(sites),
    groups: [...byGroup].map(([g, list]) => lossGainPlot(list, g)),
    ungrouped,
  };
}
