"use client";

import { useQuery, useQueryClient } from "@tanstack/react-query";
import { currentCopy, keepRecordsCopy, savedRecordsCopy, withReply, type RecordSighting, type RecordsCopy } from "@/lib/offline/records-copy";
import { CORRECTED, REVIEWER, statusForVolunteer } from "@/lib/review/words";
import { Conversation, ReplyForm } from "./records/record-conversation";
import { RecordOutcome } from "./records/record-outcome";
import { VisitsOnPhone } from "./records/visits-on-phone";
import { useLive } from "./use-live";

const statusStyle: Record<RecordSighting["status"], string> = {
  pending: "bg-shingle-100 text-shingle-800",
  accepted: "bg-lichen-100 text-lichen-700",
  queried: "bg-sand-100 text-sand-800",
  rejected: "bg-rust-100 text-rust-700",
};

async function fetchRecords(): Promise<RecordsCopy> {
  let res: Response;
  try {
    res = await fetch("/api/field/records", { credentials: "same-origin", cache: "no-store" });
  } catch {
    throw new Error("No signal.");
  }
  if (!res.ok) throw new Error(res.status === 401 ? "Sign in again to see your walks." : "Your walks could not be loaded.");
  return currentCopy((await res.json()) as Parameters<typeof currentCopy>[0]);
}

const asOfText = (iso: string) => new Date(iso).toLocaleString(undefined, { dateStyle: "medium", timeStyle: "short" });

/**
 * My walks: the volunteer's walks on this phone not yet sent, then their sent walks with what
 * review made of each sighting (its status, the reviewer's questions with the answer box, why it
 * is not used in counts, corrections with old and new names). The last copy loaded is kept on the
 * phone and shown, with its age, when there is no signal. `sources` says how walks not sent from
 * a phone came (visit id → "recorded by …, entered by …" or "imported from …").
 */
export function MyRecords({ volunteerId, sources = {} }: { volunteerId: string; sources?: Record<string, string> }) {
  const client = useQueryClient();
  const queryKey = ["my-records", volunteerId];
  const saved = useLive(() => savedRecordsCopy(volunteerId), [volunteerId]);
  const fresh = useQuery({
    queryKey,
    queryFn: async () => {
      const copy = await fetchRecords();
      // The screen still works if the phone cannot store the copy (private mode, full storage).
      await keepRecordsCopy(volunteerId, copy).catch(() => undefined);
      return copy;
    },
  });
  const shown = fresh.data ?? saved ?? null;
  const fromPhone = !fresh.data && Boolean(saved);

  const replied = (sightingId: string, reply: { message: string; at: string }) => {
    if (!shown) return;
    const updated = withReply(shown, sightingId, reply);
    client.setQueryData(queryKey, updated);
    void keepRecordsCopy(volunteerId, updated).catch(() => undefined);
    void client.invalidateQueries({ queryKey });
  };

  return (
    <div className="space-y-4">
      <h1 className="text-2xl font-bold text-tideline-800">My walks</h1>
      <VisitsOnPhone />
      {fromPhone && shown && (
        <p role="status" className="rounded-lg bg-sand-100 p-2 text-sm text-sand-800" data-testid="records-as-of">
          {fresh.isError ? `${(fresh.error as Error).message} ` : "Looking for anything newer… "}
          Showing your walks as of {asOfText(shown.asOf)}, saved on this phone.
        </p>
      )}
      {!shown && fresh.isPending && <p>Loading…</p>}
      {!shown && fresh.isError && saved !== undefined && (
        <p className="card">{(fresh.error as Error).message} Your sent walks show here once they have loaded with a signal.</p>
      )}
      {shown?.visits.length === 0 && <p className="card">No walks sent yet.</p>}
      <ul className="space-y-3">
        {shown?.visits.map((v) => (
          <li key={v.id} className="card">
            <h2 className="font-bold">{v.visitDate} · {v.transectCode} {v.transectName}</h2>
            {sources[v.id] && <p className="text-sm text-shingle-600" data-testid="walk-source">{sources[v.id]}</p>}
            <ul className="mt-2 divide-y divide-shingle-100">
              {v.sightings.map((s) => (
                <li key={s.id} className="py-2" data-testid="record-sighting">
                  <div className="flex flex-wrap items-center justify-between gap-2">
                    <span>{s.vernacularName} × {s.count}{s.section ? ` · section ${s.section}` : ""}</span>
                    <span className="flex flex-wrap gap-1">
                      {s.corrections.length > 0 && <span className="rounded-full bg-tideline-100 px-2 py-0.5 text-sm font-bold text-tideline-800">{CORRECTED}</span>}
                      <span className={`rounded-full px-2 py-0.5 text-sm font-bold ${statusStyle[s.status]}`} data-testid="sighting-status">{statusForVolunteer[s.status]}</span>
                    </span>
                  </div>
                  <RecordOutcome decision={s.decision} corrections={s.corrections} />
                  {s.conversation.length > 0 && (
                    <div className="mt-2 rounded-lg bg-sand-100 p-2">
                      <Conversation messages={s.conversation} />
                      {s.awaitingReply ? (
                        fromPhone && fresh.isError ? (
                          <p className="mt-2 text-sm font-bold">{`The ${REVIEWER} is waiting for your answer: you can send it when you have a signal.`}</p>
                        ) : (
                          <ReplyForm sightingId={s.id} onSent={(reply) => replied(s.id, reply)} />
                        )
                      ) : (
                        s.status === "queried" && <p className="mt-2 text-sm text-lichen-700">{`Your answer is with the ${REVIEWER}.`}</p>
                      )}
                    </div>
                  )}
                </li>
              ))}
            </ul>
          </li>
        ))}
      </ul>
    </div>
  );
}
