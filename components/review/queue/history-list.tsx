import type { HistoryEntry } from "@/lib/review/contract";
import { rejectReasonLabel } from "@/lib/review/reasons";
import { statusForReviewer } from "@/lib/review/words";
import { when } from "./format";

// What happened to a sighting, as the review history holds it: who, when, from, to, why.

const didWords: Record<HistoryEntry["action"], string> = {
  accept: "Confirmed",
  query: "Asked a question",
  reject: "Set aside",
  reopen: "Reopened",
  reply: "Answered",
  edit: "Corrected",
};

/** The questions to the volunteer and their answers, oldest first. */
export function QuestionThread({ history }: { history: HistoryEntry[] }) {
  const said = history.filter((h) => (h.action === "query" || h.action === "reply") && h.message);
  if (said.length === 0) return <p className="text-sm text-shingle-600">No questions yet.</p>;
  return (
    <ol className="space-y-2" aria-label="Questions and answers, oldest first">
      {said.map((h) => (
        <li key={h.id} className={`rounded-lg p-3 ${h.action === "reply" ? "ml-6 bg-lichen-100" : "mr-6 bg-tideline-50"}`}>
          <p className="text-sm text-shingle-700">
            <strong>{h.action === "reply" ? `Answer from ${h.actor.name}` : `Question from ${h.actor.name}`}</strong>, {when(h.at)}
          </p>
          <p className="whitespace-pre-wrap">{h.message}</p>
        </li>
      ))}
    </ol>
  );
}

/** Every entry of the history, oldest first. */
export function HistoryList({ history }: { history: HistoryEntry[] }) {
  if (history.length === 0) return <p className="text-sm text-shingle-600">Nothing has happened to this sighting since it was sent.</p>;
  return (
    <ol className="space-y-2 border-l-2 border-shingle-200 pl-4" aria-label="History, oldest first" data-testid="review-history">
      {history.map((h) => (
        <li key={h.id}>
          <p>
            <strong>{didWords[h.action]}</strong> by {h.actor.name}
            <span className="text-sm text-shingle-600">, {when(h.at)}</span>
          </p>
          <dl className="text-sm">
            {h.fromStatus !== h.toStatus && (h.fromStatus || h.toStatus) && (
              <div className="flex gap-1">
                <dt className="font-bold">Status:</dt>
                <dd>
                  {h.fromStatus ? statusForReviewer[h.fromStatus] : "—"} → {h.toStatus ? statusForReviewer[h.toStatus] : "—"}
                </dd>
              </div>
            )}
            {(h.fromSpecies || h.toSpecies) && (
              <div className="flex gap-1">
                <dt className="font-bold">Species:</dt>
                <dd>
                  {h.fromSpecies?.name ?? "—"} → {h.toSpecies?.name ?? "—"}
                </dd>
              </div>
            )}
            {(h.fromCount !== null || h.toCount !== null) && h.fromCount !== h.toCount && (
              <div className="flex gap-1">
                <dt className="font-bold">Count:</dt>
                <dd>
                  {h.fromCount ?? "—"} → {h.toCount ?? "—"}
                </dd>
              </div>
            )}
            {h.reason && (
              <div className="flex gap-1">
                <dt className="font-bold">Reason:</dt>
                <dd>{rejectReasonLabel[h.reason]}</dd>
              </div>
            )}
            {h.message && (
              <div className="flex gap-1">
                <dt className="font-bold">{h.action === "query" ? "Question:" : h.action === "reply" ? "Answer:" : "Note:"}</dt>
                <dd className="whitespace-pre-wrap">{h.message}</dd>
              </div>
            )}
          </dl>
        </li>
      ))}
    </ol>
  );
}
