import { phoneStore } from "./phone-store";

// The phone's copy of "My records", so the volunteer can read it with no signal. Kept in the
// reference table (cached server data) under a key per volunteer, so a shared phone never shows
// one person's records to another.

export type RecordStatus = "pending" | "accepted" | "queried" | "rejected";
export type RecordMessage = { from: "checker" | "volunteer"; message: string | null; at: string };
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
};
export type RecordVisit = { id: string; visitDate: string; transectCode: string; transectName: string; sightings: RecordSighting[] };
/** What GET /api/field/records answers: the visits and when the server read them. */
export type RecordsCopy = { visits: RecordVisit[]; asOf: string };

const keyFor = (volunteerId: string) => `my-records:${volunteerId}`;

export async function keepRecordsCopy(volunteerId: string, copy: RecordsCopy): Promise<void> {
  await phoneStore().reference.put({ key: keyFor(volunteerId), value: copy, savedAt: copy.asOf });
}

export async function savedRecordsCopy(volunteerId: string): Promise<RecordsCopy | null> {
  return ((await phoneStore().reference.get(keyFor(volunteerId)))?.value as RecordsCopy | undefined) ?? null;
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
