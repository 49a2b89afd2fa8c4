import type { SightingStatus } from "@/db/schema/field";

// The words every screen, e-mail and server message uses for review (one place, so they stay
// the same everywhere). The database keeps its own names (pending, accepted, queried, rejected);
// people read these. A walk is a "walk" and one species entry on it a "sighting", everywhere.

/** The person who checks sightings (the coordinator role; organisers can do it too). */
export const REVIEWER = "reviewer";
export const REVIEWER_TITLE = "Reviewer";

/** What a status means, as the volunteer who made the sighting reads it. */
export const statusForVolunteer: Record<SightingStatus, string> = {
  pending: "Waiting for review",
  accepted: "Confirmed",
  queried: "A question for you",
  rejected: "Not used in counts",
};

/** The same statuses as reviewers and organisers read them. */
export const statusForReviewer: Record<SightingStatus, string> = {
  pending: "Waiting for review",
  accepted: "Confirmed",
  queried: "Question asked",
  rejected: "Not used in counts",
};

/** The mark on a sighting whose question the volunteer has answered (from its history, not a status). */
export const ANSWERED = "Answered";
/** The mark on a sighting whose species or count a reviewer changed. */
export const CORRECTED = "Corrected";

/** What each status does to the season's counts, for a one-line explanation beside it. */
export const statusMeaning: Record<SightingStatus, string> = {
  pending: "Not counted until a reviewer confirms it.",
  accepted: "Counted in the season's results.",
  queried: "A reviewer asked about it; not counted until it is confirmed.",
  rejected: "Kept in the history, left out of every count.",
};

/** The review actions' names on buttons and in the history. */
export const actionLabel = {
  accept: "Confirm",
  query: "Ask a question",
  reject: "Set aside",
  edit: "Correct",
  reopen: "Reopen",
  reply: "Answer",
} as const;
