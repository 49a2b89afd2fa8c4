// How each habitat's species come and go between the two demo seasons. The chalk downs gain
// grassland specialists after grazing returns; the wetlands lose their wetland species.
import type { HabitatCode } from "./network";
import type { SeedSpecies } from "./species";

type TagRule = { initial: number; keep: number; colonise: number };

const rules: Record<HabitatCode, Record<string, TagRule>> = {
  CHK: {
    "grassland-specialist": { initial: 0.3, keep: 0.95, colonise: 0.7 },
    "wider-countryside": { initial: 0.6, keep: 0.9, colonise: 0.2 },
    migrant: { initial: 0.5, keep: 0.7, colonise: 0.4 },
  },
  WDR: {
    "woodland-specialist": { initial: 0.65, keep: 0.9, colonise: 0.1 },
    "wider-countryside": { initial: 0.6, keep: 0.9, colonise: 0.1 },
    migrant: { initial: 0.4, keep: 0.7, colonise: 0.3 },
  },
  DUN: {
    "coastal-specialist": { initial: 0.85, keep: 0.95, colonise: 0.2 },
    "grassland-specialist": { initial: 0.15, keep: 0.8, colonise: 0.05 },
    "wider-countryside": { initial: 0.4, keep: 0.85, colonise: 0.15 },
    migrant: { initial: 0.6, keep: 0.7, colonise: 0.4 },
  },
  WET: {
    "wetland-associated": { initial: 0.85, keep: 0.3, colonise: 0.02 },
    "wider-countryside": { initial: 0.55, keep: 0.75, colonise: 0.1 },
    migrant: { initial: 0.4, keep: 0.6, colonise: 0.3 },
  },
};

function ruleFor(habitat: HabitatCode, sp: SeedSpecies): TagRule | null {
  // A species takes the most favourable of its tags' rules in that habitat.
  const applicable = sp.tags.map((t) => rules[habitat][t]).filter((r): r is TagRule => Boolean(r));
  if (applicable.length === 0) return null;
  return applicable.reduce((best, r) => (r.initial > best.initial ? r : best));
}

/** Resident species of one transect in the baseline and comparison seasons. */
export function residents(habitat: HabitatCode, pool: SeedSpecies[], rand: () => number, wipeOut = false) {
  const before = new Set<string>();
  const after = new Set<string>();
  for (const sp of pool) {
    if (sp.rank === "species_aggregate") continue;
    const rule = ruleFor(habitat, sp);
    if (!rule) continue;
    const wasThere = rand() < rule.initial;
    if (wasThere) before.add(sp.scientific);
    const isThere = wasThere ? rand() < rule.keep : rand() < rule.colonise;
    if (isThere) after.add(sp.scientific);
  }
  if (wipeOut) {
    // A transect whose meadow was ploughed and reseeded over the winter: almost total turnover.
    const survivors = [...before].slice(0, 1);
    after.clear();
    for (const s of survivors) after.add(s);
    for (const sp of ["Pararge aegeria", "Pieris rapae", "Pieris brassicae", "Vanessa cardui"]) if (!before.has(sp)) after.add(sp);
  }
  return { before, after };
}
