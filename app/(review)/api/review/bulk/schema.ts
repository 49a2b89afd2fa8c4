import { z } from "zod";
import { BULK_LIMIT, queueFilterSchema } from "@/lib/review/queue-filter";
import { rejectReasonSchema, reviewMessageSchema } from "@/lib/review/reasons";

const selection = z.union([
  z.object({
    ids: z
      .array(z.object({ id: z.uuid(), revision: z.number().int().min(1) }))
      .min(1, { message: "Select at least one sighting." })
      .max(BULK_LIMIT, { message: `At most ${BULK_LIMIT.toLocaleString("en-GB")} sightings at once: narrow the selection.` }),
  }),
  z.object({ filter: queueFilterSchema, listedAt: z.iso.datetime({ offset: true, message: "Send the time the list was read." }) }),
]);

/** Confirm (those without warnings) or set aside many sightings (lib/review/contract.ts BulkInput). */
export const bulkSchema = z.discriminatedUnion("action", [
  z.object({ action: z.literal("accept"), selection, message: reviewMessageSchema.optional() }),
  z.object({ action: z.literal("reject"), selection, reason: rejectReasonSchema, message: reviewMessageSchema.optional() }),
]);
