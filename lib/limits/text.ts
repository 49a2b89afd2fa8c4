// How long each kind of text people type may be, in characters as zod's `.max` and the
// browser's `maxLength` both count them (UTF-16 code units). The server's schemas and the
// forms' fields import these, so the two cannot drift apart. Zod-free and dependency-free: the
// phone's bundle imports it.

/** A person's name as an organiser types it in an invitation. Our choice. */
export const MIN_PERSON_NAME_LENGTH = 2;
export const MAX_PERSON_NAME_LENGTH = 120;

/**
 * An e-mail address: a 64-character local part, "@" and a 255-character domain (the largest
 * parts RFC 5321 §4.5.3.1 allows; common practice for an address field's cap).
 */
export const MAX_EMAIL_LENGTH = 320;

/** Passwords: at least 10 characters (our choice), and a cap that stops bcrypt being fed megabytes. */
export const MIN_PASSWORD_LENGTH = 10;
export const MAX_PASSWORD_LENGTH = 200;

/** An invitation link's token: anything outside this is not one of ours, and is refused unread. */
export const MIN_INVITATION_TOKEN_LENGTH = 20;
export const MAX_INVITATION_TOKEN_LENGTH = 200;

/** A visit's closing notes. */
export const MAX_VISIT_NOTES_LENGTH = 2_000;
/** The other people who walked the transect, as one line. */
export const MAX_CO_RECORDERS_LENGTH = 200;
/** A sighting's note. */
export const MAX_SIGHTING_NOTE_LENGTH = 1_000;
/** A volunteer's answer to a checker's question. */
export const MAX_REPLY_LENGTH = 1_000;
/** A reviewer's question to a volunteer, or the note with a set-aside or a correction. Our choice. */
export const MAX_REVIEW_MESSAGE_LENGTH = 1_000;
