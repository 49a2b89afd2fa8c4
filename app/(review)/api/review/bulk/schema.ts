import { z } from "zod";
import type { BulkSelection } from "@/lib/review/contract";
import { BULK_LIMIT, queueFilterSchema } from "@/lib/review/queue-filter";
import { rejectReasonSchema, reviewMessageSchema } from "@/lib/review/reasons";

// One object with either part, rather than a union: a bad part then gets its own field message
// (selection.ids, selection.filter.status...) instead of one "invalid input" for the whole.
const selection = z
  .object({
    ids: z
      .array(z.object({ id: z.uuid({ message: "That is not a sighting's id." }), revision: z.number().int().min(1) }))
      .min(1, { message: "Select at least one sighting." })
      .max(BULK_LIMIT, { message: `At most ${BULK_LIMIT.toLocaleString("en-GB")} sightings at once: narrow the selection.` })
      .optional(),
    filter: queueFilterSchema.optional(),
    listedAt: z.iso.datetime({ offset: true, message: "Send the time the list was read." }).optional(),
  })
  .refine((s) => (s.ids ? !s.filter : !!s.filter && !!s.listedAt), { message: "Send either the selected ids, or a filter with the time its list was read." })
  .transform((s): BulkSelection => (s.ids ? { ids: s.ids } : { filter: s.filter!, listedAt: s.listedAt! }));

/** Confirm (those without warnings) or set aside many sightings (lib/review/contract.ts BulkInput). */
export const bulkSchema = z.discriminatedUnion("action", [
  z.object({ action: z.literal("accept"), selection, message: reviewMessageSchema.optional() }),
  z.object({ action: z.literal("reject"), selection, reason: rejectReasonSchema, message: reviewMessageSchema.optional() }),
]);
