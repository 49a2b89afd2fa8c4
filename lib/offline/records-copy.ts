import { phoneStore } from "./phone-store";

// The phone's copy of My walks, so the volunteer can read it with no signal. Kept in the
// reference table (cached server data) under a key per volunteer, so a shared phone never shows
// one person's walks to another.

export type RecordStatus = "pending" | "accepted" | "queried" | "rejected";
export type RecordMessage = { from: "reviewer" | "volunteer"; message: string | null; at: string };
/** The decision a confirmed or set-aside sighting stands on (reasonText: the reason in words). */
export type RecordDecision = { action: "accept" | "reject"; reason: string | null; reasonText: string | null; note: string | null; at: string };
/** A reviewer's change of species or count; null where that part did not change. */
export type RecordCorrection = { fromName: string | null; toName: string | null; fromCount: number | null; toCount: number | null; note: string | null; at: string };
export type RecordSighting = {
  id: string;
  vernacularName: string;
  scientificName: string;
  count: number;
  section: number | null;
  status: RecordStatus;
  question: string | null;
  awaitingReply: boolean;
  conversation: RecordMessage[];
  decision: RecordDecision | null;
  corrections: RecordCorrection[];
};
export type RecordVisit = { id: string; visitDate: string; transectCode: string; transectName: string; sightings: RecordSighting[] };
/** What GET /api/field/records answers: the walks and when the server read them. */
export type RecordsCopy = { visits: RecordVisit[]; asOf: string };

/**
 * The stored copy's shape. 1 (no version field): sightings without decision and corrections,
 * questions from "checker". 2: as RecordsCopy. An older copy is read up to this one.
 */
export const RECORDS_COPY_VERSION = 2;

const keyFor = (volunteerId: string) => `my-records:${volunteerId}`;

type OlderSighting = Omit<RecordSighting, "conversation" | "decision" | "corrections"> & {
  conversation?: { from: string; message: string | null; at: string }[];
  decision?: RecordDecision | null;
  corrections?: RecordCorrection[];
};

/** A copy (stored by an older version, or answered by the server) with every field this version reads. */
export function currentCopy(copy: { visits?: (Omit<RecordVisit, "sightings"> & { sightings: OlderSighting[] })[]; asOf?: string }): RecordsCopy {
  return {
    asOf: copy.asOf ?? new Date().toISOString(),
    visits: (copy.visits ?? []).map((v) => ({
      ...v,
      sightings: v.sightings.map((s) => ({
        ...s,
        conversation: (s.conversation ?? []).map((m) => ({ ...m, from: m.from === "volunteer" ? "volunteer" : "reviewer" })),
        decision: s.decision ?? null,
        corrections: s.corrections ?? [],
      })),
    })),
  };
}

export async function keepRecordsCopy(volunteerId: string, copy: RecordsCopy): Promise<void> {
  await phoneStore().reference.put({ key: keyFor(volunteerId), value: { ...copy, version: RECORDS_COPY_VERSION }, savedAt: copy.asOf });
}

export async function savedRecordsCopy(volunteerId: string): Promise<RecordsCopy | null> {
  const value = (await phoneStore().reference.get(keyFor(volunteerId)))?.value as (Parameters<typeof currentCopy>[0] & { version?: number }) | undefined;
  // A copy from a newer version than this code cannot be read safely; the next load replaces it.
  if (!value || (value.version ?? 1) > RECORDS_COPY_VERSION) return null;
  return currentCopy(value);
}

/** The copy with the volunteer's new answer in place, so the answered question shows at once. */
export function withReply(copy: RecordsCopy, sightingId: string, reply: { message: string; at: string }): RecordsCopy {
  return {
    ...copy,
    visits: copy.visits.map((v) => ({
      ...v,
      sightings: v.sightings.map((s) =>
        s.id === sightingId ? { ...s, awaitingReply: false, conversation: [...s.conversation, { from: "volunteer", message: reply.message, at: reply.at }] } : s,
      ),
    })),
  };
}
