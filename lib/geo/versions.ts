// Route versions by date. A walk is measured against the version in force on its date: the
// latest version valid from that day or before. The first version also covers any earlier
// date (walks from before Turnstone, imported later, were walked on the first known route).

export type VersionSpan = { version: number; validFrom: string; sectionCount: number };

/** The version in force on `date` (YYYY-MM-DD); null only when there are no versions. */
export function versionOn<V extends VersionSpan>(versions: readonly V[], date: string): V | null {
  let first: V | null = null;
  let best: V | null = null;
  for (const v of versions) {
    if (!first || v.validFrom < first.validFrom) first = v;
    if (v.validFrom <= date && (!best || v.validFrom > best.validFrom)) best = v;
  }
  return best ?? first;
}

export type DateSpan = { startsOn: string; endsOn: string };

/**
 * Whether the route changed between two seasons (in either order): a version after the first
 * starts after the earlier season begins and no later than the later season ends. A change in
 * the middle of either season counts too: that season was not walked on one route throughout.
 */
export function changedBetween(versions: readonly VersionSpan[], a: DateSpan, b: DateSpan): boolean {
  const [earlier, later] = a.startsOn <= b.startsOn ? [a, b] : [b, a];
  const firstFrom = versions.reduce<string | null>((min, v) => (min === null || v.validFrom < min ? v.validFrom : min), null);
  return versions.some((v) => v.validFrom !== firstFrom && v.validFrom > earlier.startsOn && v.validFrom <= later.endsOn);
}
