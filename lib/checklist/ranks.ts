import type { taxonRankEnum } from "@/db/schema/taxa";

type Rank = (typeof taxonRankEnum.enumValues)[number];

/** The database's taxon ranks (db/schema/taxa.ts), restated without drizzle for pages' bundles. */
export const TAXON_RANKS = ["species", "subspecies", "species_aggregate", "genus", "family", "other"] as const satisfies readonly Rank[];
export type TaxonRank = (typeof TAXON_RANKS)[number];

/** The rank of an entry that stands for several similar species (see speciesAggregateMembers). */
export const AGGREGATE_RANK = "species_aggregate" satisfies TaxonRank;

export const rankLabel: Record<TaxonRank, string> = {
  species: "Species",
  subspecies: "Subspecies",
  species_aggregate: "Aggregate of similar species",
  genus: "Genus",
  family: "Family",
  other: "Other",
};

export function isTaxonRank(value: string): value is TaxonRank {
  return (TAXON_RANKS as readonly string[]).includes(value);
}
