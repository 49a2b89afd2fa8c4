// The parts of the sync protocol the phone needs at run time, free of the zod validator.

export const skyValues = ["clear", "mostly_sunny", "broken_cloud", "mostly_cloudy", "overcast"] as const;

/** Rain during a walk (the database's rain enum). */
export const rainValues = ["none", "light", "heavy"] as const;
export type Rain = (typeof rainValues)[number];

export const MAX_BATCH_ITEMS = 500;

/**
 * The protocol version the phone states in its envelope (`protocol`). Absent means an older phone
 * (version 1). From version 2 a submitted visit must say whether its list is complete.
 */
export const SYNC_PROTOCOL_VERSION = 2;
/**
 * The largest sync request body the server reads (it answers 413 above it); the outbox stays under
 * it. A full batch of 500 sightings with long notes stays well under this.
 */
export const MAX_SYNC_BODY_BYTES = 2_000_000;

/** What the phone sends for a visit (the server checks it with contract.ts's visitPayload). */
export type VisitPayload = {
  id: string;
  transectId: string;
  visitDate: string;
  startTime: string;
  endTime?: string | null;
  temperatureC?: number | null;
  windBeaufort?: number | null;
  cloudCoverPercent?: number | null;
  sky?: (typeof skyValues)[number] | null;
  /** Share of the walk in sunshine, whole percent. Optional in every protocol: older phones never send it. */
  sunshinePercent?: number | null;
  /** Optional in every protocol, like sunshinePercent. */
  rain?: Rain | null;
  coRecorders?: string | null;
  completeList: boolean;
  notes?: string | null;
  submittedAt?: string | null;
  clientUpdatedAt: string;
};

/**
 * "Not walked this week because of the weather", reported from the field home (checked with
 * contract.ts's weatherPayload). The server files it under the Monday of `reportedOn`'s week.
 */
export type WeatherPayload = {
  id: string;
  transectId: string;
  /** The phone's local date when the volunteer tapped, YYYY-MM-DD. */
  reportedOn: string;
  clientUpdatedAt: string;
};

/** What the phone sends for a sighting (checked with contract.ts's sightingPayload). */
export type SightingPayload = {
  id: string;
  visitId: string;
  speciesId: string;
  count: number;
  section?: number | null;
  latitude?: number | null;
  longitude?: number | null;
  accuracyMetres?: number | null;
  note?: string | null;
  deleted?: boolean;
  clientUpdatedAt: string;
};

export type ItemStatus =
  | "created" // new on the server
  | "updated" // the server copy was changed
  | "unchanged" // a resend of what the server already has
  | "deleted" // removed at the volunteer's request
  | "kept-server" // the server's copy wins (already reviewed, or newer)
  | "invalid" // failed validation: see errors
  | "forbidden"; // not the volunteer's transect or visit

export type ItemResult = {
  kind: "visit" | "sighting" | "weather";
  id: string | null;
  index: number;
  status: ItemStatus;
  reason?: string;
  errors?: Record<string, string[]>;
};

export type SyncResponse = { results: ItemResult[]; serverTime: string };

/** HTTP status of a batch answer: 403 if any item was forbidden, else 400 if any was invalid, else 200. */
export function batchStatus(results: ItemResult[]): 200 | 400 | 403 {
  if (results.some((r) => r.status === "forbidden")) return 403;
  if (results.some((r) => r.status === "invalid")) return 400;
  return 200;
}

/** Item statuses after which the phone may forget its copy. */
export const settledStatuses: ItemStatus[] = ["created", "updated", "unchanged", "deleted", "kept-server"];
