// The demo scenario, invented for Turnstone: the Harrowmere Valley, a chalk valley running
// down to a small estuary, walked by twelve volunteers. In winter 2025/26 conservation grazing
// returned to the chalk downs; the same summer the valley-bottom wetlands dried and scrubbed over.
import { lengthMetres } from "../../lib/geo/length";
import type { HabitatColour } from "../../lib/geo/palette";
import type { LineString } from "../schema/sites";

export const demoNetwork = {
  name: "Harrowmere Valley Butterfly Transects",
  taxonGroup: "butterflies",
  // The walk rules and warning thresholds are the settings' defaults (lib/review/*-rules.ts).
  contactEmail: "organiser@harrowmere.example",
};

export const demoPassword = "harrowmere-demo";

export const demoPeople = {
  organiser: { name: "Morgan Ashdown", email: "organiser@harrowmere.example" },
  coordinator: { name: "Priya Coldharbour", email: "checker@harrowmere.example" },
  partner: { name: "Dr Elin Vasquez", email: "partner@harrowmere.example" },
  volunteers: [
    "Sam Okonjo", "Ruth Penhallow", "Dev Marlowe", "Iona MacRae", "Tomasz Wierzba", "Hattie Birchall",
    "Kwame Asante", "Lowri Pritchard", "Ben Foxley", "Mei Tanaka", "Carys Wendover", "Oliver Strand",
  ].map((name, i) => ({ name, email: `volunteer${String(i + 1).padStart(2, "0")}@harrowmere.example` })),
};

export const demoHabitats = [
  { code: "CHK", name: "Chalk downland", colour: "downland", description: "South-facing chalk grassland; conservation grazing returned in winter 2025/26." },
  { code: "WDR", name: "Woodland rides", colour: "oak", description: "Broad rides and glades in the valley's oak and hazel woods." },
  { code: "DUN", name: "Coastal dunes", colour: "gorse", description: "Fixed dunes and dune slacks at the river mouth." },
  { code: "WET", name: "Wetland margins", colour: "estuary", description: "Wet meadows and ditch margins on the valley floor; dried out and scrubbed over in 2026." },
] as const satisfies readonly { code: string; name: string; colour: HabitatColour; description: string }[];

export type HabitatCode = (typeof demoHabitats)[number]["code"];

const placeNames: Record<HabitatCode, string[]> = {
  CHK: ["Beacon Down", "Gallows Bank", "Sheepwash Combe", "Windover Hill", "Kestrel Scarp", "Long Barrow Slope"],
  WDR: ["Hazelhurst Ride", "Oakhanger Glade", "Pond Copse", "Coppice Lane", "Ashgrove Ride", "Bluebell Hanger"],
  DUN: ["Ternery Dunes", "Marram Walk", "Slack Pools", "Shell Ridge", "Lookout Dune", "Estuary Spit"],
  WET: ["Withy Bed", "Mill Leat", "Snipe Meadow", "Reedmace Ditch", "Otter Holt Marsh", "Kingcup Fen"],
};

const anchors: Record<HabitatCode, [number, number]> = {
  CHK: [-1.262, 51.081],
  WDR: [-1.301, 51.064],
  DUN: [-1.356, 51.012],
  WET: [-1.318, 51.041],
};

/** Route points walk roughly north-east from the habitat's anchor, one point per section boundary: section n runs from point n − 1 to point n. */
export function demoTransects(rand: () => number) {
  return demoHabitats.flatMap((h) =>
    placeNames[h.code].map((name, i) => {
      const sections = 4 + Math.floor(rand() * 7);
      const [lon0, lat0] = anchors[h.code];
      const start: [number, number] = [lon0 + (i % 3) * 0.011 + rand() * 0.003, lat0 + Math.floor(i / 3) * 0.008 + rand() * 0.003];
      const coordinates: [number, number][] = [start];
      for (let s = 0; s < sections; s++) {
        const prev = coordinates[coordinates.length - 1]!;
        const bearing = Math.PI / 4 + (rand() - 0.5) * 1.4;
        const step = 0.0015 + rand() * 0.001;
        coordinates.push([round6(prev[0] + Math.cos(bearing) * step * 1.6), round6(prev[1] + Math.sin(bearing) * step)]);
      }
      const route: LineString = { type: "LineString", coordinates };
      return {
        code: `${h.code}-${String(i + 1).padStart(2, "0")}`,
        name,
        habitat: h.code,
        sectionCount: sections,
        route,
        lengthMetres: Math.round(lengthMetres(coordinates)),
        sectionLengths: coordinates.slice(1).map((p, s) => Math.round(lengthMetres([coordinates[s]!, p]))),
        coastal: h.code === "DUN",
        accessNotes:
          h.code === "DUN"
            ? "Spring tides cover the spit path: walk within three hours either side of low water."
            : h.code === "CHK"
              ? "Cattle graze here from 2026: keep dogs on leads and give the herd room."
              : null,
      };
    }),
  );
}

function round6(x: number) {
  return Math.round(x * 1e6) / 1e6;
}
