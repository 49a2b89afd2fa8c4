import { selfCrossings } from "./crossings";
import { lengthMetres } from "./length";
import { JOIN_TOLERANCE_METRES, MAX_ROUTE_METRES, MAX_ROUTE_POINTS, MAX_SECTIONS } from "./limits";
import { metresToSegment, readLine, sameSpot } from "./positions";
import { refused, type BuiltRoute, type Checked, type Position, type SectionDraft } from "./types";

const km = (metres: number) => `${(metres / 1000).toLocaleString("en-GB", { maximumFractionDigits: 1 })} km`;

const tooManyPoints = (n: number) =>
  refused(`The route has ${n.toLocaleString("en-GB")} points; at most ${MAX_ROUTE_POINTS.toLocaleString("en-GB")} are kept. Simplify the track and try again.`);

/** Metres from p to the nearest point of a line. */
function metresToLine(p: Position, line: Position[]): number {
  let best = Infinity;
  for (let i = 1; i < line.length; i++) best = Math.min(best, metresToSegment(p, line[i - 1]!, line[i]!));
  return best;
}

/**
 * Joins section i+1 onto the route so far. Sections must follow each other: each starts where
 * the one before ends (within JOIN_TOLERANCE_METRES, and then the joint is kept as the start of
 * the later section). One that starts back inside the section before overlaps it; one that
 * starts anywhere else leaves a gap.
 */
function joinProblem(previous: Position[], next: Position[], number: number): string | null {
  const end = previous[previous.length - 1]!;
  const start = next[0]!;
  const apart = metresToSegment(start, end, end);
  if (apart <= JOIN_TOLERANCE_METRES) return null;
  if (metresToLine(start, previous) <= JOIN_TOLERANCE_METRES) {
    return `Section ${number} starts inside section ${number - 1}: sections must not overlap.`;
  }
  return `Section ${number} starts ${Math.round(apart).toLocaleString("en-GB")} m from the end of section ${number - 1}: sections must cover the route without gaps.`;
}

/**
 * Checks sections (coordinates in range, at least two distinct points each, each starting where
 * the last ended), puts them together into one route and measures the route and each section
 * with @turf/length. Refuses a route of one point, longer than MAX_ROUTE_METRES, with more than
 * MAX_ROUTE_POINTS points or MAX_SECTIONS sections; warns when the route crosses itself.
 */
export function buildRoute(drafts: SectionDraft[]): Checked<BuiltRoute> {
  if (drafts.length === 0) return refused("The route has no line: draw it or import a file.");
  if (drafts.length > MAX_SECTIONS) return refused(`The route has ${drafts.length} sections; a transect can have at most ${MAX_SECTIONS}.`);
  // Before reading any point: joints are shared, so the route has at least this many.
  const least = drafts.reduce((n, d) => n + (Array.isArray(d.coordinates) ? d.coordinates.length : 0), 0) - (drafts.length - 1);
  if (least > MAX_ROUTE_POINTS * 2) return tooManyPoints(least);
  const lines: Position[][] = [];
  const errors: string[] = [];
  drafts.forEach((draft, i) => {
    const where = drafts.length === 1 ? "Route" : `Section ${i + 1}`;
    const { positions, errors: problems } = readLine(draft.coordinates, where);
    errors.push(...problems);
    if (problems.length === 0 && positions.length < 2) {
      errors.push(drafts.length === 1 ? "The route has only one point: a route needs at least two." : `${where} has only one point: a section needs at least two.`);
    }
    lines.push(positions);
  });
  if (errors.length) return refused(...errors.slice(0, 10));

  const coordinates: Position[] = [...lines[0]!];
  const sections: BuiltRoute["sections"] = [];
  let from = 0;
  for (let i = 0; i < lines.length; i++) {
    const line = lines[i]!;
    if (i > 0) {
      const problem = joinProblem(lines[i - 1]!, line, i + 1);
      if (problem) errors.push(problem);
      // The joint is the last point so far; the rest of this section follows it.
      coordinates.push(...line.slice(sameSpot(line[0], coordinates[coordinates.length - 1]) ? 1 : 0));
    }
    const to = coordinates.length - 1;
    sections.push({ number: i + 1, from, to, lengthMetres: Math.round(lengthMetres(coordinates.slice(from, to + 1))), habitat: drafts[i]!.habitat?.trim() || null });
    from = to;
  }
  if (errors.length) return refused(...errors.slice(0, 10));
  if (coordinates.length > MAX_ROUTE_POINTS) return tooManyPoints(coordinates.length);
  const total = lengthMetres(coordinates);
  if (total > MAX_ROUTE_METRES) return refused(`The route is ${km(total)} long; a transect route can be at most ${km(MAX_ROUTE_METRES)}.`);
  if (Math.round(total) < 1) return refused("The route is shorter than a metre: check its points.");

  const warnings: string[] = [];
  const crossings = selfCrossings(coordinates);
  if (crossings.length > 0) {
    const places = crossings.length >= 20 ? "20 or more places" : crossings.length === 1 ? "one place" : `${crossings.length} places`;
    warnings.push(`The route crosses or touches itself in ${places}. Loops are common: check that this is the way it is walked.`);
  }
  return { ok: true, value: { route: { type: "LineString", coordinates }, lengthMetres: Math.round(total), sections }, warnings };
}

/**
 * Cuts one line into sections at the given vertices (0-based indices of interior points), for
 * the organiser's editor: each boundary is the last point of one section and the first of the
 * next. Indices out of range or repeated are ignored.
 */
export function splitAt(coordinates: Position[], boundaries: number[], habitats: (string | null | undefined)[] = []): SectionDraft[] {
  const cuts = [...new Set(boundaries)].filter((i) => i > 0 && i < coordinates.length - 1).sort((a, b) => a - b);
  const ends = [...cuts, coordinates.length - 1];
  let start = 0;
  return ends.map((end, i) => {
    const section = { coordinates: coordinates.slice(start, end + 1), habitat: habitats[i] ?? null };
    start = end;
    return section;
  });
}

/** The stretches of a built route, one per section (the inverse of buildRoute's joining). */
export function sectionLines(route: { coordinates: Position[] }, sections: { from: number; to: number }[]): Position[][] {
  return sections.map((s) => route.coordinates.slice(s.from, s.to + 1));
}
