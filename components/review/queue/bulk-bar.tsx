"use client";

import { useMutation } from "@tanstack/react-query";
import { useId, useState } from "react";
import type { BulkInput, BulkResult } from "@/lib/review/contract";
import { BULK_LIMIT, type QueueFilter } from "@/lib/review/queue-filter";
import { rejectReasonLabel, rejectReasons, type RejectReason } from "@/lib/review/reasons";
import { actionLabel } from "@/lib/review/words";
import { fieldMessages, otherMessages, postBulk } from "./api";
import type { Selection } from "./queue-table";

const whyWords: Record<BulkResult["skipped"][number]["why"], string> = {
  changed: "someone changed it after the list was shown",
  has_warnings: "it has warnings: look at it on its own",
  not_waiting: "it was already decided",
};

const n = (x: number) => x.toLocaleString("en-GB");
const sightings = (x: number) => `${n(x)} ${x === 1 ? "sighting" : "sightings"}`;

export type BulkScope = { kind: "ids"; selection: Selection } | { kind: "filter"; filter: QueueFilter; listedAt: string; total: number };

/**
 * Many sightings at once: the ones ticked, or all that match the filter (at most BULK_LIMIT).
 * Confirm takes only those without warnings; set aside takes one reason for all.
 */
export function BulkBar({ scope, pageCount, allPageSelected, total, onSelectAllMatching, onClear, onDone, describe }: {
  scope: BulkScope;
  pageCount: number;
  allPageSelected: boolean;
  total: number;
  onSelectAllMatching: () => void;
  onClear: () => void;
  onDone: () => void;
  describe: (id: string) => string | null;
}) {
  const id = useId();
  const [step, setStep] = useState<"accept" | "reject" | null>(null);
  const [reason, setReason] = useState<RejectReason | "">("");
  const [message, setMessage] = useState("");
  const [result, setResult] = useState<BulkResult | null>(null);
  const bulk = useMutation({
    mutationFn: postBulk,
    onSuccess: (r) => {
      setResult(r);
      setStep(null);
      setReason("");
      setMessage("");
      onDone();
    },
  });
  const count = scope.kind === "ids" ? Object.keys(scope.selection).length : scope.total;
  const chosen = scope.kind === "filter" ? `All ${sightings(count)} that match the filter are selected.` : `${sightings(count)} selected.`;
  const send = (action: "accept" | "reject") => {
    const selection: BulkInput["selection"] = scope.kind === "ids" ? { ids: Object.entries(scope.selection).map(([sid, revision]) => ({ id: sid, revision })) } : { filter: scope.filter, listedAt: scope.listedAt };
    const extra = action === "reject" ? { reason: reason as RejectReason, ...(message.trim() ? { message } : {}) } : {};
    bulk.mutate({ action, selection, ...extra } as BulkInput);
  };
  const reasonErrors = fieldMessages(bulk.error, "reason");
  const general = bulk.error ? [...otherMessages(bulk.error, ["reason", "message"]), ...(Object.keys((bulk.error as { fields?: object }).fields ?? {}).length === 0 ? [bulk.error.message] : [])] : [];

  return (
    <section aria-label="Many sightings at once" className="space-y-2">
      {count > 0 && (
        <div className="card space-y-3 border-tideline-600" data-testid="bulk-bar">
          <div className="flex flex-wrap items-center gap-2">
            <p className="font-bold" role="status">{chosen}</p>
            <button type="button" className="btn-quiet" onClick={() => { onClear(); setStep(null); bulk.reset(); }}>Clear the selection</button>
          </div>
          {scope.kind === "ids" && allPageSelected && total > pageCount &&
            (total <= BULK_LIMIT ? (
              <button type="button" className="btn-quiet" onClick={onSelectAllMatching}>Select all {sightings(total)} that match the filter</button>
            ) : (
              <p className="rounded-lg bg-sand-100 p-2 text-sand-800">
                The filter matches {sightings(total)}; one action takes at most {n(BULK_LIMIT)}. Narrow the filter (a season, a transect, a volunteer or dates) to select them all at once.
              </p>
            ))}
          <div className="flex flex-wrap gap-2">
            <button type="button" className="btn-primary" aria-expanded={step === "accept"} onClick={() => setStep(step === "accept" ? null : "accept")}>{actionLabel.accept} those without warnings…</button>
            <button type="button" className="btn-quiet" aria-expanded={step === "reject"} onClick={() => setStep(step === "reject" ? null : "reject")}>{actionLabel.reject} with one reason…</button>
          </div>
          {step === "accept" && (
            <div className="rounded-lg bg-shingle-50 p-3" role="group" aria-label="Confirm those without warnings">
              <p>Confirm the {sightings(count)} selected that have no warnings? Any with a warning, or on a walk outside the walk rules, stays waiting for you to look at it on its own.</p>
              <div className="mt-2 flex gap-2">
                <button type="button" className="btn-primary" disabled={bulk.isPending} onClick={() => send("accept")}>{bulk.isPending ? "Working…" : "Yes, confirm them"}</button>
                <button type="button" className="btn-quiet" onClick={() => setStep(null)}>Cancel</button>
              </div>
            </div>
          )}
          {step === "reject" && (
            <form
              className="space-y-2 rounded-lg bg-shingle-50 p-3"
              aria-label="Set aside with one reason"
              onSubmit={(e) => {
                e.preventDefault();
                if (reason) send("reject");
              }}
            >
              <div>
                <label htmlFor={`${id}-reason`} className="field-label">Reason for all {sightings(count)}</label>
                <select id={`${id}-reason`} className="field-input" value={reason} onChange={(e) => setReason(e.target.value as RejectReason | "")} required aria-describedby={reasonErrors.length ? `${id}-reason-error` : undefined}>
                  <option value="">Choose a reason…</option>
                  {rejectReasons.map((r) => (
                    <option key={r} value={r}>{rejectReasonLabel[r]}</option>
                  ))}
                </select>
                {reasonErrors.map((m) => (
                  <p key={m} id={`${id}-reason-error`} className="field-error">{m}</p>
                ))}
              </div>
              <div>
                <label htmlFor={`${id}-note`} className="field-label">Note (optional)</label>
                <textarea id={`${id}-note`} className="field-input" value={message} onChange={(e) => setMessage(e.target.value)} />
                {fieldMessages(bulk.error, "message").map((m) => (
                  <p key={m} className="field-error">{m}</p>
                ))}
              </div>
              <div className="flex gap-2">
                <button type="submit" className="btn-primary" disabled={bulk.isPending || !reason}>{bulk.isPending ? "Working…" : `Set aside ${sightings(count)}`}</button>
                <button type="button" className="btn-quiet" onClick={() => setStep(null)}>Cancel</button>
              </div>
            </form>
          )}
          {general.length > 0 && (
            <div role="alert">
              {general.map((m) => (
                <p key={m} className="field-error">{m}</p>
              ))}
            </div>
          )}
        </div>
      )}
      {result && (
        <div className="card" role="status" data-testid="bulk-result">
          <div className="flex items-start gap-2">
            <p className="font-bold">Done: {sightings(result.done)}.{result.skipped.length > 0 ? ` ${sightings(result.skipped.length)} left as they were:` : ""}</p>
            <button type="button" className="btn-quiet ml-auto min-h-0 py-1 text-sm" onClick={() => setResult(null)}>Dismiss</button>
          </div>
          {result.skipped.length > 0 && (
            <ul className="mt-1 list-disc pl-5 text-sm" aria-label="Left as they were">
              {result.skipped.map((s) => (
                <li key={s.id}>
                  {describe(s.id) ?? "A sighting not on this page"}: {whyWords[s.why]}
                </li>
              ))}
            </ul>
          )}
        </div>
      )}
    </section>
  );
}
