// The demo checklist: butterflies of southern Britain (real scientific names). Flight months
// are typical adult flight periods, from memory of common field guides; tags are our own grouping.
export type SeedSpecies = {
  scientific: string;
  vernacular: string;
  months: number[];
  tags: string[];
  sensitive?: boolean;
  rank?: "species" | "species_aggregate";
  /** For an aggregate: the scientific names of the species it stands for. */
  members?: string[];
};

const range = (a: number, b: number) => Array.from({ length: b - a + 1 }, (_, i) => a + i);

export const speciesTags = [
  { slug: "grassland-specialist", label: "Grassland specialist", description: "Needs flower-rich, short or grazed grassland." },
  { slug: "woodland-specialist", label: "Woodland specialist", description: "Depends on woodland rides, glades or canopy." },
  { slug: "wetland-associated", label: "Wetland associated", description: "Found mainly on damp meadows, fens and ditch margins." },
  { slug: "coastal-specialist", label: "Coastal specialist", description: "Mainly on dunes, undercliffs and coastal heath." },
  { slug: "wider-countryside", label: "Wider countryside", description: "Widespread generalist of many habitats." },
  { slug: "migrant", label: "Migrant", description: "Numbers depend on arrivals from further south." },
];

export const checklist: SeedSpecies[] = [
  { scientific: "Thymelicus sylvestris", vernacular: "Small Skipper", months: range(6, 8), tags: ["grassland-specialist"] },
  { scientific: "Thymelicus lineola", vernacular: "Essex Skipper", months: range(6, 8), tags: ["grassland-specialist"] },
  { scientific: "Thymelicus sylvestris/lineola", vernacular: "Small/Essex Skipper", months: range(6, 8), tags: [], rank: "species_aggregate", members: ["Thymelicus sylvestris", "Thymelicus lineola"] },
  { scientific: "Ochlodes sylvanus", vernacular: "Large Skipper", months: range(5, 8), tags: ["wider-countryside"] },
  { scientific: "Erynnis tages", vernacular: "Dingy Skipper", months: range(4, 6), tags: ["grassland-specialist"] },
  { scientific: "Pyrgus malvae", vernacular: "Grizzled Skipper", months: range(4, 6), tags: ["grassland-specialist"] },
  { scientific: "Hesperia comma", vernacular: "Silver-spotted Skipper", months: range(7, 9), tags: ["grassland-specialist"] },
  { scientific: "Leptidea sinapis", vernacular: "Wood White", months: range(5, 8), tags: ["woodland-specialist"] },
  { scientific: "Gonepteryx rhamni", vernacular: "Brimstone", months: range(3, 10), tags: ["wider-countryside"] },
  { scientific: "Pieris brassicae", vernacular: "Large White", months: range(4, 10), tags: ["wider-countryside"] },
  { scientific: "Pieris rapae", vernacular: "Small White", months: range(4, 10), tags: ["wider-countryside"] },
  { scientific: "Pieris napi", vernacular: "Green-veined White", months: range(4, 9), tags: ["wider-countryside", "wetland-associated"] },
  { scientific: "Anthocharis cardamines", vernacular: "Orange-tip", months: range(4, 6), tags: ["wider-countryside", "wetland-associated"] },
  { scientific: "Colias croceus", vernacular: "Clouded Yellow", months: range(5, 10), tags: ["migrant"] },
  { scientific: "Callophrys rubi", vernacular: "Green Hairstreak", months: range(4, 6), tags: ["grassland-specialist"] },
  { scientific: "Thecla betulae", vernacular: "Brown Hairstreak", months: range(7, 9), tags: ["woodland-specialist"] },
  { scientific: "Favonius quercus", vernacular: "Purple Hairstreak", months: range(6, 8), tags: ["woodland-specialist"] },
  { scientific: "Satyrium w-album", vernacular: "White-letter Hairstreak", months: range(6, 8), tags: ["woodland-specialist"] },
  { scientific: "Lycaena phlaeas", vernacular: "Small Copper", months: range(4, 10), tags: ["wider-countryside"] },
  { scientific: "Cupido minimus", vernacular: "Small Blue", months: range(5, 8), tags: ["grassland-specialist"] },
  { scientific: "Plebejus argus", vernacular: "Silver-studded Blue", months: range(6, 8), tags: ["coastal-specialist"] },
  { scientific: "Aricia agestis", vernacular: "Brown Argus", months: range(5, 9), tags: ["grassland-specialist"] },
  { scientific: "Polyommatus icarus", vernacular: "Common Blue", months: range(5, 9), tags: ["wider-countryside"] },
  { scientific: "Lysandra coridon", vernacular: "Chalkhill Blue", months: range(7, 9), tags: ["grassland-specialist"] },
  { scientific: "Lysandra bellargus", vernacular: "Adonis Blue", months: range(5, 9), tags: ["grassland-specialist"] },
  { scientific: "Celastrina argiolus", vernacular: "Holly Blue", months: range(4, 9), tags: ["wider-countryside"] },
  { scientific: "Phengaris arion", vernacular: "Large Blue", months: range(6, 7), tags: ["grassland-specialist"], sensitive: true },
  { scientific: "Hamearis lucina", vernacular: "Duke of Burgundy", months: range(4, 6), tags: ["grassland-specialist"], sensitive: true },
  { scientific: "Limenitis camilla", vernacular: "White Admiral", months: range(6, 8), tags: ["woodland-specialist"] },
  { scientific: "Apatura iris", vernacular: "Purple Emperor", months: range(6, 8), tags: ["woodland-specialist"] },
  { scientific: "Vanessa atalanta", vernacular: "Red Admiral", months: range(3, 11), tags: ["migrant"] },
  { scientific: "Vanessa cardui", vernacular: "Painted Lady", months: range(4, 10), tags: ["migrant"] },
  { scientific: "Aglais io", vernacular: "Peacock", months: range(3, 10), tags: ["wider-countryside"] },
  { scientific: "Aglais urticae", vernacular: "Small Tortoiseshell", months: range(3, 10), tags: ["wider-countryside"] },
  { scientific: "Polygonia c-album", vernacular: "Comma", months: range(3, 10), tags: ["wider-countryside"] },
  { scientific: "Boloria selene", vernacular: "Small Pearl-bordered Fritillary", months: range(5, 7), tags: ["wetland-associated", "woodland-specialist"] },
  { scientific: "Boloria euphrosyne", vernacular: "Pearl-bordered Fritillary", months: range(4, 6), tags: ["woodland-specialist"], sensitive: true },
  { scientific: "Speyeria aglaja", vernacular: "Dark Green Fritillary", months: range(6, 8), tags: ["grassland-specialist"] },
  { scientific: "Argynnis paphia", vernacular: "Silver-washed Fritillary", months: range(6, 8), tags: ["woodland-specialist"] },
  { scientific: "Euphydryas aurinia", vernacular: "Marsh Fritillary", months: range(5, 6), tags: ["wetland-associated", "grassland-specialist"], sensitive: true },
  { scientific: "Pararge aegeria", vernacular: "Speckled Wood", months: range(3, 10), tags: ["wider-countryside"] },
  { scientific: "Lasiommata megera", vernacular: "Wall", months: range(4, 10), tags: ["wider-countryside", "coastal-specialist"] },
  { scientific: "Melanargia galathea", vernacular: "Marbled White", months: range(6, 8), tags: ["grassland-specialist"] },
  { scientific: "Hipparchia semele", vernacular: "Grayling", months: range(7, 9), tags: ["coastal-specialist"] },
  { scientific: "Pyronia tithonus", vernacular: "Gatekeeper", months: range(7, 8), tags: ["wider-countryside"] },
  { scientific: "Maniola jurtina", vernacular: "Meadow Brown", months: range(6, 9), tags: ["wider-countryside"] },
  { scientific: "Aphantopus hyperantus", vernacular: "Ringlet", months: range(6, 8), tags: ["wider-countryside", "wetland-associated"] },
  { scientific: "Coenonympha pamphilus", vernacular: "Small Heath", months: range(5, 9), tags: ["grassland-specialist"] },
];
