import { z } from "zod";
import { MAX_REVIEW_MESSAGE_LENGTH } from "@/lib/limits/text";
import { safeText } from "@/lib/validation/fields";

// Why a sighting is set aside (not used in counts): a short list a reviewer picks from, plus
// free text. Keys are stored in verification_events.reason; the labels are what people read.
export const rejectReasons = ["photo_not_conclusive", "likely_other_species", "unlikely_here_or_now", "entered_twice", "wrong_place", "other"] as const;
export type RejectReason = (typeof rejectReasons)[number];

export const rejectReasonLabel: Record<RejectReason, string> = {
  photo_not_conclusive: "The photo does not show what is needed to name it",
  likely_other_species: "Most likely another species",
  unlikely_here_or_now: "Very unlikely at this place or date, with nothing to confirm it",
  entered_twice: "Entered twice",
  wrong_place: "Belongs to another transect, section or walk",
  other: "Another reason (see the note)",
};

export const rejectReasonSchema = z.enum(rejectReasons, { error: "Choose a reason from the list" });
/** A reviewer's free text: a question, or the note with a set-aside or a correction. */
export const reviewMessageSchema = safeText(MAX_REVIEW_MESSAGE_LENGTH, z.string());
