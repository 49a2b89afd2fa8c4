// The limits a transect's route is held to. Pure constants: the organiser's pages, the route
// file parser and the server's checks all read them from here.
import { SECTIONS } from "../limits/counts";

/** A transect is walked in one go; longer than this is a mistake in the file (the figure). */
export const MAX_ROUTE_METRES = 50_000;

/** Route files (GeoJSON, GPX) are read whole on the server: 10 MB (10 × 1024 × 1024 bytes). */
export const MAX_ROUTE_FILE_BYTES = 10 * 1024 * 1024;

/**
 * Our choice: a phone's track logged every second for a five-hour walk has 18,000 points; more
 * than this is a file that should be simplified before it becomes a route phones download.
 */
export const MAX_ROUTE_POINTS = 20_000;

/** Sections per transect: the shared range the database's checks also read. */
export const MAX_SECTIONS = SECTIONS.max;

/**
 * Our choice: section ends this close together are one joint (GPS tracks split into segments
 * rarely end and start on exactly the same point); farther apart they leave a gap.
 */
export const JOIN_TOLERANCE_METRES = 5;

/** Characters in a section's habitat note ("chalk grassland, grazed"). */
export const MAX_SECTION_HABITAT = 80;
