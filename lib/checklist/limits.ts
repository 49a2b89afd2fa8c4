// The limits a checklist and its import are held to. Pure constants: the organiser's pages, the
// CSV reader and the server's checks all read them from here.

/** A checklist file is read whole on the server: 10 MB (10 × 1024 × 1024 bytes; the figure). */
export const MAX_CHECKLIST_FILE_BYTES = 10 * 1024 * 1024;

/** Our choice: longer than any scientific name with its authority written out. */
export const MAX_NAME_LENGTH = 200;

/** Our choice: vernacular names are short ("Small Pearl-bordered Fritillary" is 31). */
export const MAX_VERNACULAR_LENGTH = 120;

/** Our choice: a tag is a short label ("grassland specialist"). */
export const MAX_TAG_LENGTH = 60;

/** Our choice: a tag's optional description, shown beside it. */
export const MAX_TAG_DESCRIPTION_LENGTH = 300;

/** Our choice: more synonyms or covered species than this on one entry is a mistake in the file. */
export const MAX_LIST_ITEMS = 50;
