"use client";

import { useEffect, useId, useRef, useState, type ReactNode } from "react";
import type { QueueRow, ReviewActionInput, SpeciesChoice } from "@/lib/review/contract";
import { rejectReasonLabel, rejectReasons, type RejectReason } from "@/lib/review/reasons";
import { actionLabel } from "@/lib/review/words";
import { MAX_REVIEW_MESSAGE_LENGTH } from "@/lib/limits/text";
import { ChangedError, fieldMessages, otherMessages } from "./api";
import { isUndecided } from "./rows";
import { aggregateWords, SpeciesPicker } from "./species-picker";

export type Panel = "query" | "reject" | "edit" | "reopen";
type WithoutRevision<A> = A extends unknown ? Omit<A, "revision"> : never;
export type ActionBody = WithoutRevision<ReviewActionInput>;
/** Runs one action with the row's revision; resolves once the answer is shown, or rejects with the refusal. */
export type RunAction = (body: ActionBody) => Promise<void>;

function Errors({ id, messages }: { id: string; messages: string[] }) {
  if (messages.length === 0) return null;
  return (
    <div id={id}>
      {messages.map((m) => (
        <p key={m} className="field-error">{m}</p>
      ))}
    </div>
  );
}

function MessageField({ label, value, onChange, required, errors, autoFocus, hint }: { label: string; value: string; onChange: (v: string) => void; required?: boolean; errors: string[]; autoFocus?: boolean; hint?: string }) {
  const id = useId();
  const ref = useRef<HTMLTextAreaElement>(null);
  useEffect(() => {
    if (autoFocus) ref.current?.focus();
  }, [autoFocus]);
  return (
    <div>
      <label htmlFor={id} className="field-label">{label}</label>
      <textarea
        ref={ref}
        id={id}
        className="field-input min-h-24"
        value={value}
        onChange={(e) => onChange(e.target.value)}
        maxLength={MAX_REVIEW_MESSAGE_LENGTH}
        required={required}
        aria-invalid={errors.length > 0 || undefined}
        aria-describedby={[errors.length ? `${id}-error` : null, hint ? `${id}-hint` : null].filter(Boolean).join(" ") || undefined}
      />
      {hint && <p id={`${id}-hint`} className="mt-1 text-sm text-shingle-600">{hint}</p>}
      <Errors id={`${id}-error`} messages={errors} />
    </div>
  );
}

function ActionForm({ title, submit, onCancel, children, onSubmit, busy, error, shown }: { title: string; submit: string; onCancel: () => void; children: ReactNode; onSubmit: () => void; busy: boolean; error: unknown; shown: string[] }) {
  // Someone else's change is shown above the actions, with the sighting as it is now.
  const general = error && !(error instanceof ChangedError) ? [...otherMessages(error, shown), ...(Object.keys(fieldsOf(error)).length === 0 && error instanceof Error ? [error.message] : [])] : [];
  return (
    <form
      className="space-y-3 rounded-lg border border-shingle-200 bg-shingle-50 p-3"
      aria-label={title}
      onSubmit={(e) => {
        e.preventDefault();
        onSubmit();
      }}
      onKeyDown={(e) => {
        if (e.key === "Escape") {
          e.stopPropagation();
          onCancel();
        }
      }}
    >
      <h3 className="font-bold">{title}</h3>
      {children}
      {general.length > 0 && (
        <div role="alert">
          {general.map((m) => (
            <p key={m} className="field-error">{m}</p>
          ))}
        </div>
      )}
      <div className="flex flex-wrap gap-2">
        <button type="submit" className="btn-primary" disabled={busy}>{busy ? "Sending…" : submit}</button>
        <button type="button" className="btn-quiet" onClick={onCancel}>Cancel</button>
      </div>
    </form>
  );
}

const fieldsOf = (error: unknown): Record<string, string[]> => (error && typeof error === "object" && "fields" in error ? (error as { fields: Record<string, string[]> }).fields : {});

function QuestionForm({ run, onDone, busy }: { run: RunAction; onDone: () => void; busy: boolean }) {
  const [message, setMessage] = useState("");
  const [error, setError] = useState<unknown>(null);
  const send = () => run({ action: "query", message }).then(onDone, setError);
  return (
    <ActionForm title="Ask the volunteer a question" submit="Send the question" onCancel={onDone} onSubmit={send} busy={busy} error={error} shown={["message"]}>
      <MessageField label="Your question" value={message} onChange={setMessage} required errors={fieldMessages(error, "message")} autoFocus hint="The volunteer sees it on My walks and can answer there. The sighting waits, not counted, until you decide." />
    </ActionForm>
  );
}

function SetAsideForm({ run, onDone, busy }: { run: RunAction; onDone: () => void; busy: boolean }) {
  const id = useId();
  const [reason, setReason] = useState<RejectReason | "">("");
  const [message, setMessage] = useState("");
  const [error, setError] = useState<unknown>(null);
  const select = useRef<HTMLSelectElement>(null);
  useEffect(() => select.current?.focus(), []);
  const reasonErrors = [...fieldMessages(error, "reason"), ...(error === "no-reason" ? ["Choose a reason from the list"] : [])];
  const send = () => (reason === "" ? setError("no-reason") : run({ action: "reject", reason, ...(message.trim() ? { message } : {}) }).then(onDone, setError));
  return (
    <ActionForm title="Set it aside: not used in counts" submit={actionLabel.reject} onCancel={onDone} onSubmit={send} busy={busy} error={error === "no-reason" ? null : error} shown={["reason", "message"]}>
      <div>
        <label htmlFor={id} className="field-label">Reason</label>
        <select ref={select} id={id} className="field-input" value={reason} onChange={(e) => setReason(e.target.value as RejectReason | "")} aria-invalid={reasonErrors.length > 0 || undefined} aria-describedby={reasonErrors.length ? `${id}-error` : undefined}>
          <option value="">Choose a reason…</option>
          {rejectReasons.map((r) => (
            <option key={r} value={r}>{rejectReasonLabel[r]}</option>
          ))}
        </select>
        <Errors id={`${id}-error`} messages={reasonErrors} />
      </div>
      <MessageField label={reason === "other" ? "Note (say what the reason is)" : "Note for the volunteer (optional)"} value={message} onChange={setMessage} required={reason === "other"} errors={fieldMessages(error, "message")} />
    </ActionForm>
  );
}

function CorrectForm({ row, run, onDone, busy }: { row: QueueRow; run: RunAction; onDone: () => void; busy: boolean }) {
  const id = useId();
  const [species, setSpecies] = useState<SpeciesChoice | null>(null);
  const [count, setCount] = useState(String(row.count));
  const [message, setMessage] = useState("");
  const [error, setError] = useState<unknown>(null);
  const newCount = Number(count);
  const countChanged = count.trim() !== "" && newCount !== row.count;
  const localError = error === "nothing" ? "Choose another species or change the count." : error === "count" ? "Enter a whole number of at least 1." : null;
  const send = () => {
    if (countChanged && (!Number.isInteger(newCount) || newCount < 1)) return setError("count");
    const speciesChanged = species !== null && species.id !== row.species.id;
    if (!speciesChanged && !countChanged) return setError("nothing");
    return run({ action: "edit", ...(speciesChanged ? { speciesId: species.id } : {}), ...(countChanged ? { count: newCount } : {}), ...(message.trim() ? { message } : {}) }).then(onDone, setError);
  };
  const serverError = localError ? null : error;
  const aggregate = species ? aggregateWords(species) : null;
  return (
    <ActionForm title="Correct the species or the count" submit={actionLabel.edit} onCancel={onDone} onSubmit={send} busy={busy} error={serverError} shown={["speciesId", "count", "message"]}>
      <p className="text-sm">
        Now: <strong>{row.species.vernacularName}</strong> <i>{row.species.scientificName}</i>, count {row.count}. The old values stay in the history.
      </p>
      <SpeciesPicker label="Change the species to" chosen={species} onChoose={setSpecies} error={fieldMessages(serverError, "speciesId")} />
      {aggregate && <p className="text-sm text-sand-800">{aggregate}: use it when the photo cannot tell them apart.</p>}
      <div>
        <label htmlFor={id} className="field-label">Count</label>
        <input id={id} type="number" min={1} step={1} inputMode="numeric" className="field-input w-32" value={count} onChange={(e) => setCount(e.target.value)} aria-invalid={fieldMessages(serverError, "count").length > 0 || error === "count" || undefined} aria-describedby={`${id}-error`} />
        <Errors id={`${id}-error`} messages={[...fieldMessages(serverError, "count"), ...(error === "count" ? [localError!] : [])]} />
      </div>
      <MessageField label="Note (optional: why, for the history and the volunteer)" value={message} onChange={setMessage} errors={fieldMessages(serverError, "message")} />
      {error === "nothing" && <p className="field-error" role="alert">{localError}</p>}
    </ActionForm>
  );
}

function ReopenForm({ run, onDone, busy }: { run: RunAction; onDone: () => void; busy: boolean }) {
  const [message, setMessage] = useState("");
  const [error, setError] = useState<unknown>(null);
  return (
    <ActionForm title="Reopen: back to waiting for review" submit={actionLabel.reopen} onCancel={onDone} onSubmit={() => run({ action: "reopen", ...(message.trim() ? { message } : {}) }).then(onDone, setError)} busy={busy} error={error} shown={["message"]}>
      <MessageField label="Why (optional, kept in the history)" value={message} onChange={setMessage} errors={fieldMessages(error, "message")} autoFocus />
    </ActionForm>
  );
}

/** The decisions a reviewer can take on the open sighting, each with its own short form. */
export function ReviewActions({ row, canReopen, panel, onPanel, run, onConfirm, busy, confirmError }: { row: QueueRow; /** null while the sighting's detail is loading. */ canReopen: boolean | null; panel: Panel | null; onPanel: (p: Panel | null) => void; run: RunAction; onConfirm: () => void; busy: boolean; confirmError: unknown }) {
  const open = isUndecided(row);
  const close = () => onPanel(null);
  const toggle = (p: Panel) => onPanel(panel === p ? null : p);
  return (
    <section aria-label="Decide" className="space-y-3">
      <div className="flex flex-wrap gap-2">
        {open && (
          <>
            <button type="button" className="btn-primary" disabled={busy} onClick={onConfirm} aria-keyshortcuts="c">
              {actionLabel.accept}
            </button>
            <button type="button" className="btn-quiet" aria-expanded={panel === "query"} onClick={() => toggle("query")} aria-keyshortcuts="q">{actionLabel.query}</button>
            <button type="button" className="btn-quiet" aria-expanded={panel === "reject"} onClick={() => toggle("reject")} aria-keyshortcuts="s">{actionLabel.reject}</button>
            <button type="button" className="btn-quiet" aria-expanded={panel === "edit"} onClick={() => toggle("edit")}>{actionLabel.edit}</button>
          </>
        )}
        {!open && canReopen && (
          <button type="button" className="btn-quiet" aria-expanded={panel === "reopen"} onClick={() => toggle("reopen")}>{actionLabel.reopen}</button>
        )}
        {!open && canReopen === false && <p className="text-sm text-shingle-600">Decided. Its season is closed past its grace period, so it can no longer be reopened.</p>}
      </div>
      {confirmError instanceof Error && !(confirmError instanceof ChangedError) && (
        <p role="alert" className="field-error">
          {actionLabel.accept} did not go through: {confirmError.message}
        </p>
      )}
      {panel === "query" && open && <QuestionForm run={run} onDone={close} busy={busy} />}
      {panel === "reject" && open && <SetAsideForm run={run} onDone={close} busy={busy} />}
      {panel === "edit" && open && <CorrectForm key={row.id} row={row} run={run} onDone={close} busy={busy} />}
      {panel === "reopen" && !open && canReopen && <ReopenForm run={run} onDone={close} busy={busy} />}
    </section>
  );
}
