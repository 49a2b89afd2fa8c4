// The two files' columns: our own names, written on the import page and in DEVELOPERS.md.

export const WALK_COLUMNS = [
  "walk_ref",
  "transect_code",
  "date",
  "start_time",
  "end_time",
  "temperature_c",
  "wind_beaufort",
  "cloud_cover_percent",
  "sky",
  "complete_list",
  "recorder",
  "notes",
] as const;
export type WalkColumn = (typeof WALK_COLUMNS)[number];

export const REQUIRED_WALK_COLUMNS = ["walk_ref", "transect_code", "date", "start_time", "complete_list", "recorder"] as const satisfies readonly WalkColumn[];

export const SIGHTING_COLUMNS = ["walk_ref", "species", "count", "section", "latitude", "longitude"] as const;
export type SightingColumn = (typeof SIGHTING_COLUMNS)[number];

export const REQUIRED_SIGHTING_COLUMNS = ["walk_ref", "species", "count"] as const satisfies readonly SightingColumn[];

export type ImportFileKind = "walks" | "sightings";

export const fileLabel: Record<ImportFileKind, string> = { walks: "walks file", sightings: "sightings file" };

export const walkColumnHelp: Record<WalkColumn, string> = {
  walk_ref: "Your own label for the walk, unique in the file; the sightings file names walks by it.",
  transect_code: "The transect's code as on the Transects page (any letter case).",
  date: "The day of the walk as YYYY-MM-DD, inside the chosen season.",
  start_time: "When the walk began, HH:MM (24-hour clock).",
  end_time: "When it ended, HH:MM; optional, not before the start.",
  temperature_c: "Air temperature in °C; optional.",
  wind_beaufort: "Wind force on the Beaufort scale, 0 to 12; optional.",
  cloud_cover_percent: "Cloud cover in whole percent, 0 to 100; optional.",
  sky: "clear, mostly sunny, broken cloud, mostly cloudy or overcast; optional.",
  complete_list: "yes if every species seen was written down (a complete list), no otherwise.",
  recorder: "Who walked it: a person's name or e-mail as on the People page. A name Turnstone does not know becomes a recorder without an account.",
  notes: "Anything else about the walk; optional.",
};

export const sightingColumnHelp: Record<SightingColumn, string> = {
  walk_ref: "The walk's walk_ref in the walks file.",
  species: "Scientific name, or a synonym, as on the checklist (any letter case).",
  count: "How many were seen, a whole number (0 or more).",
  section: "The section of the transect, numbered from 1 on the route in force on the walk's date; optional.",
  latitude: "WGS84 latitude in decimal degrees, −90 to 90; optional, together with longitude.",
  longitude: "WGS84 longitude in decimal degrees, −180 to 180; optional, together with latitude.",
};

/** Example files for the import page's downloads: one walk with sightings, one empty walk. */
export const exampleWalksCsv = `walk_ref,transect_code,date,start_time,end_time,temperature_c,wind_beaufort,cloud_cover_percent,sky,complete_list,recorder,notes
W001,CHK-01,2024-05-14,10:30,11:45,17.5,2,30,mostly sunny,yes,Sam Okonjo,
W002,CHK-01,2024-06-11,11:00,12:05,19,3,80,mostly cloudy,yes,Sam Okonjo,Nothing on the wing
`;

export const exampleSightingsCsv = `walk_ref,species,count,section,latitude,longitude
W001,Lysandra bellargus,4,2,,
W001,Maniola jurtina,12,3,51.0842,-1.2581
`;

/** Header cells are matched without regard to case, and spaces or hyphens count as underscores. */
export function normaliseHeader(cell: string): string {
  return cell.trim().toLowerCase().replace(/[\s-]+/g, "_");
}
