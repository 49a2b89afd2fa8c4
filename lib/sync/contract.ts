import { z } from "zod";
import { plausibleInstant, recordDate, safeText } from "@/lib/validation/fields";
import { MAX_BATCH_ITEMS, skyValues } from "./protocol";

// The wire format between the phone's outbox and POST /api/field/sync: the server validates
// with these schemas; the phone builds batches from the same types. The parts without zod live
// in ./protocol so the phone's bundle does not carry the validator.
// Every field is bounded so that whatever passes here PostgreSQL accepts too (text without NUL
// or broken characters, years it can hold, numbers inside the columns' ranges): a value it
// refused would fail the batch's one write and with it every good item beside it.

export * from "./protocol";

const visitDate = recordDate("Use a date like 2026-05-14.");
// 00:00 to 23:59:59 only: PostgreSQL's time also takes 24:00:00, which no walk starts or ends at.
const clockTime = z.string().regex(/^([01]\d|2[0-3]):[0-5]\d(:[0-5]\d)?$/, { message: "Use a time like 09:45." });
const isoInstant = plausibleInstant("Use an ISO 8601 timestamp.");
const optionalText = (max: number) => safeText(max).nullable().optional();
const between = (min: number, max: number, message: string) => z.number({ message }).min(min, { message }).max(max, { message });

export const visitPayload = z
  .object({
    id: z.uuid({ message: "The visit id must be a UUID." }),
    transectId: z.uuid({ message: "Choose a transect." }),
    visitDate,
    startTime: clockTime,
    endTime: clockTime.nullable().optional(),
    temperatureC: between(-40, 60, "Temperature must be a number from -40 to 60 °C.").nullable().optional(),
    windBeaufort: z.number({ message: "Wind is a whole Beaufort force." }).int({ message: "Wind is a whole Beaufort force." }).min(0, { message: "Beaufort force runs from 0 to 12." }).max(12, { message: "Beaufort force runs from 0 to 12." }).nullable().optional(),
    cloudCoverPercent: z.number({ message: "Cloud cover is 0-100%." }).int({ message: "Cloud cover is 0-100%." }).min(0, { message: "Cloud cover is 0-100%." }).max(100, { message: "Cloud cover is 0-100%." }).nullable().optional(),
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
    count: z.number({ message: "Count must be a whole number." }).int({ message: "Count must be a whole number." }).min(0, { message: "Count cannot be negative." }).max(100_000, { message: "Count is at most 100000." }),
    section: z.number({ message: "Section must be a whole number." }).int({ message: "Section must be a whole number." }).min(1, { message: "Sections are numbered from 1." }).max(50, { message: "A transect has at most 50 sections." }).nullable().optional(),
    latitude: between(-90, 90, "Latitude runs from -90 to 90.").nullable().optional(),
    longitude: between(-180, 180, "Longitude runs from -180 to 180.").nullable().optional(),
    accuracyMetres: between(0, 100_000, "Accuracy is 0 to 100000 metres.").nullable().optional(),
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
