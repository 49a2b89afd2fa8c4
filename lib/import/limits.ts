// The limits an earlier season's import is held to. Pure constants: the import page, the CSV
// readers and the server's checks all read them from here.

/** Each file is read whole into memory on the server: 10 MB (10 × 1024 × 1024 bytes; the figure). */
export const MAX_IMPORT_FILE_BYTES = 10 * 1024 * 1024;

/** Our choice: a preview lists this many problems and says how many more there are. */
export const MAX_LISTED_PROBLEMS = 200;

/**
 * Rows per INSERT in the write pass. Our choice: 2,000 sightings × 9 columns stay well under
 * PostgreSQL's 65,535 parameters per statement (its wire protocol's limit) and keep each round trip large.
 */
export const WRITE_CHUNK_ROWS = 2_000;

/** Our choice: a walk reference is a short label from the spreadsheet ("W-2019-041"). */
export const MAX_WALK_REF_LENGTH = 60;
