import { z } from "zod";
import { MAX_BATCH_ITEMS } from "./protocol";

// The wire format between the phone's outbox and POST /api/field/sync: the server validates
// with these schemas; the phone builds batches from the same types. The parts without zod live
// in ./protocol so the phone's bundle does not carry the validator.
import { skyValues } from "./protocol";

export * from "./protocol";

const isoDate = z.iso.date({ message: "Use a date like 2026-05-14." });
const clockTime = z.string().regex(/^([01]\d|2[0-3]):[0-5]\d(:[0-5]\d)?$/, { message: "Use a time like 09:45." });
const isoInstant = z.iso.datetime({ offset: true, message: "Use an ISO 8601 timestamp." });
const optionalText = (max: number) => z.string().trim().max(max, { message: `At most ${max} characters.` }).nullable().optional();


export const visitPayload = z
  .object({
    id: z.uuid({ message: "The visit id must be a UUID." }),
    transectId: z.uuid({ message: "Choose a transect." }),
    visitDate: isoDate,
    startTime: clockTime,
    endTime: clockTime.nullable().optional(),
    temperatureC: z.number({ message: "Temperature must be a number." }).min(-40).max(60).nullable().optional(),
    windBeaufort: z.number().int({ message: "Wind is a whole Beaufort force." }).min(0, { message: "Beaufort force runs from 0 to 12." }).max(12, { message: "Beaufort force runs from 0 to 12." }).nullable().optional(),
    cloudCoverPercent: z.number().int().min(0, { message: "Cloud cover is 0-100%." }).max(100, { message: "Cloud cover is 0-100%." }).nullable().optional(),
    sky: z.enum(skyValues).nullable().optional(),
    coRecorders: optionalText(200),
    completeList: z.boolean().default(false),
    notes: optionalText(2000),
    submittedAt: isoInstant.nullable().optional(),
    clientUpdatedAt: isoInstant,
  })
  .refine((v) => !v.endTime || v.endTime >= v.startTime, { message: "The visit cannot end before it starts.", path: ["endTime"] });
export type VisitPayloadInput = z.infer<typeof visitPayload>;

export const sightingPayload = z
  .object({
    id: z.uuid({ message: "The sighting id must be a UUID." }),
    visitId: z.uuid({ message: "The sighting must belong to a visit." }),
    speciesId: z.uuid({ message: "Choose a species from the checklist." }),
    count: z.number().int({ message: "Count must be a whole number." }).min(0, { message: "Count cannot be negative." }).max(100_000),
    section: z.number().int().min(1, { message: "Sections are numbered from 1." }).max(50).nullable().optional(),
    latitude: z.number().min(-90).max(90).nullable().optional(),
    longitude: z.number().min(-180).max(180).nullable().optional(),
    accuracyMetres: z.number().min(0).max(100_000).nullable().optional(),
    note: optionalText(1000),
    deleted: z.boolean().optional(),
    clientUpdatedAt: isoInstant,
  })
  .refine((s) => (s.latitude == null) === (s.longitude == null), { message: "A position needs both latitude and longitude.", path: ["latitude"] });
export type SightingPayloadInput = z.infer<typeof sightingPayload>;


/** The envelope is checked first; items are then validated one by one so good ones still land. */
export const syncEnvelope = z.object({
  visits: z.array(z.unknown()).max(MAX_BATCH_ITEMS).default([]),
  sightings: z.array(z.unknown()).max(MAX_BATCH_ITEMS).default([]),
});


// Compile-time guard: the zod-free types in ./protocol describe exactly what these schemas accept.
type Same<A, B> = [A] extends [B] ? ([B] extends [A] ? true : false) : false;
export const protocolTypesMatchSchemas: [Same<VisitPayloadInput, import("./protocol").VisitPayload>, Same<SightingPayloadInput, import("./protocol").SightingPayload>] = [true, true];
