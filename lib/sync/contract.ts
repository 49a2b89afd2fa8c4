import { z } from "zod";
import { ACCURACY_METRES, BEAUFORT_FORCE, CLOUD_COVER_PERCENT, SECTIONS, SIGHTING_COUNT, SUNSHINE_PERCENT, TEMPERATURE_C, type Range } from "@/lib/limits/counts";
import { MAX_CO_RECORDERS_LENGTH, MAX_SIGHTING_NOTE_LENGTH, MAX_VISIT_NOTES_LENGTH } from "@/lib/limits/text";
import { plausibleInstant, recordDate, safeText } from "@/lib/validation/fields";
import { MAX_BATCH_ITEMS, rainValues, skyValues, SYNC_PROTOCOL_VERSION } from "./protocol";

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
const between = ({ min, max }: Range, message: string) => z.number({ message }).min(min, { message }).max(max, { message });
const wholeBetween = (range: Range, notWhole: string, outside: { below: string; above: string }) =>
  z.number({ message: notWhole }).int({ message: notWhole }).min(range.min, { message: outside.below }).max(range.max, { message: outside.above });
const beaufort = `Beaufort force runs from ${BEAUFORT_FORCE.min} to ${BEAUFORT_FORCE.max}.`;
const cloud = `Cloud cover is ${CLOUD_COVER_PERCENT.min}-${CLOUD_COVER_PERCENT.max}%.`;
const sunshine = `Sunshine is ${SUNSHINE_PERCENT.min}-${SUNSHINE_PERCENT.max}% of the walk.`;

// The visit's fields; the two protocol versions differ only in the complete-list answer.
// Sunshine and rain came later and are optional in both, so phones still running an older
// version keep syncing (their walks are stored without them).
const visitFields = {
  id: z.uuid({ message: "The walk id must be a UUID." }),
  transectId: z.uuid({ message: "Choose a transect." }),
  visitDate,
  startTime: clockTime,
  endTime: clockTime.nullable().optional(),
  temperatureC: between(TEMPERATURE_C, `Temperature must be a number from ${TEMPERATURE_C.min} to ${TEMPERATURE_C.max} °C.`).nullable().optional(),
  windBeaufort: wholeBetween(BEAUFORT_FORCE, "Wind is a whole Beaufort force.", { below: beaufort, above: beaufort }).nullable().optional(),
  cloudCoverPercent: wholeBetween(CLOUD_COVER_PERCENT, cloud, { below: cloud, above: cloud }).nullable().optional(),
  sky: z.enum(skyValues).nullable().optional(),
  sunshinePercent: wholeBetween(SUNSHINE_PERCENT, sunshine, { below: sunshine, above: sunshine }).nullable().optional(),
  rain: z.enum(rainValues, { message: "Rain is none, light or heavy." }).nullable().optional(),
  coRecorders: optionalText(MAX_CO_RECORDERS_LENGTH),
  notes: optionalText(MAX_VISIT_NOTES_LENGTH),
  submittedAt: isoInstant.nullable().optional(),
  clientUpdatedAt: isoInstant,
};
const endsAfterStart = (v: { startTime: string; endTime?: string | null }) => !v.endTime || v.endTime >= v.startTime;
const endsBeforeStart = { message: "The walk cannot end before it starts.", path: ["endTime"] };

export const COMPLETE_LIST_REQUIRED = "Say whether you recorded every species you saw.";

/** Protocol 1 (older phones, no `protocol` in the envelope): an unanswered complete list counts as no. */
export const visitPayload = z
  .object({ ...visitFields, completeList: z.boolean().default(false) })
  .refine(endsAfterStart, endsBeforeStart);
export type VisitPayloadInput = z.infer<typeof visitPayload>;

/**
 * Protocol 2: a submitted walk must carry the volunteer's answer, because comparisons use complete
 * walks only and a default would count a forgotten answer as a real "no".
 */
export const visitPayloadV2 = z
  .object({ ...visitFields, completeList: z.boolean({ message: COMPLETE_LIST_REQUIRED }).optional() })
  .refine(endsAfterStart, endsBeforeStart)
  .refine((v) => !v.submittedAt || typeof v.completeList === "boolean", { message: COMPLETE_LIST_REQUIRED, path: ["completeList"] })
  .transform((v) => ({ ...v, completeList: v.completeList ?? false }));
export type VisitPayloadV2Input = z.infer<typeof visitPayloadV2>;

/** The visit schema for the envelope's protocol version. */
export const visitPayloadFor = (protocol: number) => (protocol >= 2 ? visitPayloadV2 : visitPayload);

export const sightingPayload = z
  .object({
    id: z.uuid({ message: "The sighting id must be a UUID." }),
    visitId: z.uuid({ message: "The sighting must belong to a walk." }),
    speciesId: z.uuid({ message: "Choose a species from the checklist." }),
    count: wholeBetween(SIGHTING_COUNT, "Count must be a whole number.", { below: "Count cannot be negative.", above: `Count is at most ${SIGHTING_COUNT.max}.` }),
    section: wholeBetween(SECTIONS, "Section must be a whole number.", {
      below: `Sections are numbered from ${SECTIONS.min}.`,
      above: `A transect has at most ${SECTIONS.max} sections.`,
    }).nullable().optional(),
    latitude: between({ min: -90, max: 90 }, "Latitude runs from -90 to 90.").nullable().optional(),
    longitude: between({ min: -180, max: 180 }, "Longitude runs from -180 to 180.").nullable().optional(),
    accuracyMetres: between(ACCURACY_METRES, `Accuracy is ${ACCURACY_METRES.min} to ${ACCURACY_METRES.max} metres.`).nullable().optional(),
    note: optionalText(MAX_SIGHTING_NOTE_LENGTH),
    deleted: z.boolean().optional(),
    clientUpdatedAt: isoInstant,
  })
  .refine((s) => (s.latitude == null) === (s.longitude == null), { message: "A position needs both latitude and longitude.", path: ["latitude"] });
export type SightingPayloadInput = z.infer<typeof sightingPayload>;

export const weatherPayload = z.object({
  id: z.uuid({ message: "The weather report id must be a UUID." }),
  transectId: z.uuid({ message: "Choose a transect." }),
  reportedOn: recordDate("Use a date like 2026-05-14."),
  clientUpdatedAt: isoInstant,
});
export type WeatherPayloadInput = z.infer<typeof weatherPayload>;

/** The envelope is checked first; items are then validated one by one so good ones still land. */
export const syncEnvelope = z.object({
  protocol: z.number({ message: `The protocol is a whole number up to ${SYNC_PROTOCOL_VERSION}.` }).int().min(1).max(SYNC_PROTOCOL_VERSION).default(1),
  visits: z.array(z.unknown()).max(MAX_BATCH_ITEMS).default([]),
  sightings: z.array(z.unknown()).max(MAX_BATCH_ITEMS).default([]),
  weatherMisses: z.array(z.unknown()).max(MAX_BATCH_ITEMS).default([]),
});


// Compile-time guard: the zod-free types in ./protocol describe exactly what these schemas accept.
type Same<A, B> = [A] extends [B] ? ([B] extends [A] ? true : false) : false;
export const protocolTypesMatchSchemas: [
  Same<VisitPayloadInput, import("./protocol").VisitPayload>,
  Same<VisitPayloadV2Input, import("./protocol").VisitPayload>,
  Same<SightingPayloadInput, import("./protocol").SightingPayload>,
  Same<WeatherPayloadInput, import("./protocol").WeatherPayload>,
] = [true, true, true, true];
