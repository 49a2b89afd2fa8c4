"use client";

import { lazy, Suspense, useState } from "react";
import { beaufortScale } from "@/lib/field/beaufort";
import type { ConditionsRules } from "@/lib/field/conditions";
import type { FieldSeason } from "@/lib/field/season-dates";
import type { ChecklistEntry } from "@/lib/field/species-search";
import { timeNow } from "@/lib/field/clock";
import { rainLabel } from "@/lib/field/weather-words";
import { belongsTo, phoneStore, type LocalSighting } from "@/lib/offline/phone-store";
import { deleteDraftVisit, deleteSighting, returnToDraft, SOMEONE_ELSES_WALK, submitVisit } from "@/lib/offline/records";
import { syncNow } from "@/lib/offline/sync-controller";
import { REVIEWER } from "@/lib/review/words";
import { useFieldUserId } from "../field-providers";
import { useLive } from "../use-live";
import { ConfirmButton } from "./confirm-button";

// The details form carries the form and validation libraries: loaded only when a volunteer corrects a visit.
// Loaded on first use: the form is opened by a tap, and the service worker has every chunk
// precached, so it opens offline too, while the screen's first load stays within its budget.
const SightingForm = lazy(() => import("./sighting-form").then((m) => ({ default: m.SightingForm })));
const StartVisitForm = lazy(() => import("./start-visit-form").then((m) => ({ default: m.StartVisitForm })));

type Transect = { id: string; code: string; name: string; sectionCount: number; coastal: boolean };

const COMPLETE_LIST_QUESTION_UNANSWERED = "Answer whether you recorded every species you saw before submitting.";

export function RecordingScreen({
  visitId,
  transectHint,
  transects,
  checklist,
  seenByTransect,
  rules,
  seasons,
}: {
  visitId: string;
  /** From the address, so the heading renders on the server before the phone's store is read. */
  transectHint: string | null;
  transects: Transect[];
  checklist: ChecklistEntry[];
  seenByTransect: Record<string, string[]>;
  rules: ConditionsRules;
  /** The seasons taking walks now, from the reference data (the details form keeps its date inside them). */
  seasons?: readonly FieldSeason[];
}) {
  const userId = useFieldUserId();
  const data = useLive(async () => {
    const db = phoneStore();
    const visit = await db.visits.get(visitId);
    // Someone else's walk on a shared phone is not read any further, let alone offered for editing.
    if (!visit) return { visit: null, owner: "missing" as const };
    if (visit.ownerId == null) return { visit: null, owner: "unknown" as const };
    if (!belongsTo(visit, userId)) return { visit: null, owner: "someone-else" as const };
    const sightings = await db.sightings.where("visitId").equals(visitId).toArray();
    const photos = await db.photos.where("visitId").equals(visitId).toArray();
    return { visit, owner: "mine" as const, sightings: sightings.sort((a, b) => a.updatedAt.localeCompare(b.updatedAt)), photos };
  }, [visitId, userId]);
  const [adding, setAdding] = useState(false);
  const [editing, setEditing] = useState<LocalSighting | null>(null);
  const [editingDetails, setEditingDetails] = useState(false);
  const [finishing, setFinishing] = useState(false);
  const [endTime, setEndTime] = useState("");
  // Asked afresh at every finish, with no answer chosen in advance: comparisons use complete lists only.
  const [completeList, setCompleteList] = useState<boolean | null>(null);
  const [notes, setNotes] = useState("");
  const [error, setError] = useState<string | null>(null);

  if (data === undefined) {
    const hinted = transects.find((t) => t.id === transectHint);
    return (
      <div>
        <h1 className="text-2xl font-bold text-tideline-800">{hinted ? `${hinted.code} ${hinted.name}` : "Walk"}</h1>
        <p className="text-sm text-shingle-600">Opening the walk saved on this phone…</p>
      </div>
    );
  }
  if (!data.visit) {
    const why = {
      missing: "This walk is not on this phone.",
      "someone-else": SOMEONE_ELSES_WALK,
      unknown: "This walk was recorded on this phone before it knew who was signed in. If it is yours, say so on your home screen first.",
    }[data.owner];
    return (
      <div className="card space-y-3">
        <p>{why}</p>
        <a className="btn-quiet min-w-tap w-full" href="/field">Back to my transects</a>
      </div>
    );
  }
  const { visit, sightings, photos } = data;
  const transect = transects.find((t) => t.id === visit.transectId);
  const speciesName = (id: string) => checklist.find((s) => s.id === id)?.vernacularName ?? "Unknown species";
  const draft = visit.phase === "draft";
  const busy = adding || editing !== null || editingDetails || finishing;

  const reopen = async () => {
    setError(null);
    try {
      await returnToDraft(visitId);
      setEditingDetails(true);
    } catch (e) {
      setError(e instanceof Error ? e.message : "The walk could not be reopened.");
    }
  };

  const startFinishing = () => {
    // A visit sent back by the server keeps what the volunteer entered last time.
    setEndTime(visit.endTime ?? timeNow());
    setCompleteList(null);
    setNotes(visit.notes ?? "");
    setError(null);
    setFinishing(true);
  };

  const submit = async () => {
    setError(null);
    const beyond = transect ? sightings.filter((s) => s.section != null && s.section > transect.sectionCount) : [];
    if (beyond.length > 0) {
      return setError(`${transect!.code} has ${transect!.sectionCount} sections: change the section of ${beyond.map((s) => speciesName(s.speciesId)).join(", ")} first.`);
    }
    if (completeList === null) return setError(COMPLETE_LIST_QUESTION_UNANSWERED);
    try {
      await submitVisit(visitId, { endTime: endTime || timeNow(), completeList, notes: notes.trim() || null });
      setFinishing(false);
      void syncNow();
    } catch (e) {
      setError(e instanceof Error ? e.message : "Could not submit the walk.");
    }
  };

  return (
    <div className="space-y-4">
      <div>
        <h1 className="text-2xl font-bold text-tideline-800">{transect ? `${transect.code} ${transect.name}` : "Walk"}</h1>
        <p className="text-sm text-shingle-600">
          {visit.visitDate} from {visit.startTime}
          {visit.temperatureC != null && ` · ${visit.temperatureC} °C`}
          {visit.windBeaufort != null && ` · wind ${visit.windBeaufort} (${beaufortScale[visit.windBeaufort]?.name})`}
          {visit.sunshinePercent != null && ` · ${visit.sunshinePercent} % sun`}
          {visit.rain != null && ` · ${rainLabel[visit.rain].toLowerCase()}`}
          {visit.coRecorders && ` · with ${visit.coRecorders}`}
        </p>
        {draft && !busy && (
          <button type="button" className="btn-quiet mt-2 min-w-tap" onClick={() => setEditingDetails(true)}>
            Change walk details
          </button>
        )}
      </div>

      {error && !finishing && <p role="alert" className="font-bold text-rust-700">{error}</p>}

      {!draft && (
        <div className="card" role="status" data-testid="visit-submitted">
          {visit.outbox === "sent" ? (
            <p><strong>Sent.</strong> {`A ${REVIEWER} will look at its sightings.`}</p>
          ) : visit.outbox === "needs-attention" ? (
            <>
              <p className="font-bold text-rust-700">Needs attention: {visit.attention}</p>
              <button type="button" className="btn-quiet mt-2 min-w-tap" onClick={() => void reopen()}>Correct it</button>
            </>
          ) : (
            <p><strong>Waiting to send.</strong> It goes when there is signal.</p>
          )}
          <a href="/field" className="btn-primary mt-3 min-w-tap w-full">Back to my transects</a>
        </div>
      )}

      {draft && visit.attention && (
        <p className="rounded-lg border border-rust-700 bg-rust-100 p-3 text-rust-700" data-testid="visit-attention">
          <strong>This walk was sent back:</strong> {visit.attention} Correct it, then submit it again.
        </p>
      )}

      {draft && editingDetails && (
        <section className="card" aria-label="Walk details">
          <Suspense fallback={<p>Loading…</p>}>
            <StartVisitForm
              transects={transects}
              transectId={visit.transectId}
              rules={rules}
              seasons={seasons}
              visit={visit}
              onCancel={() => setEditingDetails(false)}
              onSaved={(id, transectId) => {
                // A reload must open the walk under its (possibly new) transect.
                window.history.replaceState(null, "", `/field/visit?id=${id}&transect=${transectId}`);
                setEditingDetails(false);
              }}
            />
          </Suspense>
        </section>
      )}

      <section aria-labelledby="sightings-heading">
        <h2 id="sightings-heading" className="text-lg font-bold">Sightings ({sightings.length})</h2>
        <ul className="mt-2 space-y-2" data-testid="sighting-list">
          {sightings.map((s) => {
            const n = photos.filter((p) => p.sightingId === s.id).length;
            const name = speciesName(s.speciesId);
            return (
              <li key={s.id} className="card flex flex-wrap items-center justify-between gap-2" data-testid="sighting-row">
                <div>
                  <p className="font-bold">{name} × {s.count}</p>
                  <p className="text-sm text-shingle-600">
                    {s.section ? `Section ${s.section}` : "No section"}
                    {n > 0 && ` · ${n} photo${n > 1 ? "s" : ""}`}
                    {s.latitude != null && ` · position ±${s.accuracyMetres ?? "?"} m`}
                    {s.attention && <span className="text-rust-700"> · {s.attention}</span>}
                  </p>
                </div>
                {draft && !editingDetails && (
                  <div className="flex flex-wrap gap-1">
                    <button type="button" className="btn-quiet min-w-tap" onClick={() => { setEditing(s); setAdding(false); }} aria-label={`Change ${name}`}>Change</button>
                    <ConfirmButton
                      label="Delete"
                      ariaLabel={`Delete ${name}`}
                      question={`Delete ${name} × ${s.count}${n > 0 ? ` and its ${n} photo${n > 1 ? "s" : ""}` : ""} from this walk?`}
                      confirmLabel="Yes, delete it"
                      onConfirm={async () => {
                        if (editing?.id === s.id) setEditing(null);
                        await deleteSighting(s.id);
                      }}
                    />
                  </div>
                )}
              </li>
            );
          })}
        </ul>
      </section>

      {draft && (adding || editing) && (
        <Suspense fallback={<p role="status">Opening the form…</p>}>
          <SightingForm
            key={editing?.id ?? "new"}
            visitId={visitId}
            checklist={checklist}
            seenHere={seenByTransect[visit.transectId] ?? []}
            sectionCount={transect?.sectionCount ?? 1}
            editing={editing ?? undefined}
            onDone={() => { setAdding(false); setEditing(null); }}
          />
        </Suspense>
      )}
      {draft && !busy && (
        <div className="grid gap-2">
          <button type="button" className="btn-primary h-16 min-w-tap text-lg" onClick={() => setAdding(true)}>+ Add a sighting</button>
          <button type="button" className="btn-quiet min-w-tap" onClick={startFinishing}>Finish the walk</button>
        </div>
      )}

      {draft && finishing && (
        <section aria-labelledby="finish-heading" className="card space-y-3">
          <h2 id="finish-heading" className="text-lg font-bold">Finish and submit</h2>
          {error && <p role="alert" className="font-bold text-rust-700">{error}</p>}
          <div>
            <label htmlFor="endTime" className="field-label">End time</label>
            <input id="endTime" type="time" className="field-input" value={endTime} onChange={(e) => setEndTime(e.target.value)} />
          </div>
          <fieldset>
            <legend className="font-bold">Did you record every species you saw?</legend>
            <p className="text-sm text-shingle-600">Only complete lists tell us what was absent, so comparisons use them alone.</p>
            {([[true, "Yes, every species I could identify"], [false, "No, only some of them"]] as const).map(([value, label]) => (
              <label key={String(value)} className="mt-2 flex min-h-tap items-center gap-3 rounded-lg border border-shingle-200 px-3 py-2">
                <input type="radio" name="completeList" className="h-6 w-6" checked={completeList === value} onChange={() => setCompleteList(value)} />
                {label}
              </label>
            ))}
          </fieldset>
          <div>
            <label htmlFor="visit-notes" className="field-label">Notes (optional)</label>
            <textarea id="visit-notes" rows={2} maxLength={2000} className="field-input" value={notes} onChange={(e) => setNotes(e.target.value)} />
          </div>
          <p className="rounded-lg bg-shingle-50 p-2">
            Review: {sightings.length} sighting{sightings.length === 1 ? "" : "s"}, {photos.length} photo{photos.length === 1 ? "" : "s"}, {completeList === null ? "complete list not answered yet" : completeList ? "complete list" : "not a complete list"}.
          </p>
          <div className="grid grid-cols-2 gap-2">
            <button type="button" className="btn-quiet min-w-tap" onClick={() => setFinishing(false)}>Back</button>
            <button type="button" className="btn-primary min-w-tap" onClick={() => void submit()}>Submit walk</button>
          </div>
        </section>
      )}

      {draft && !busy && (
        <ConfirmButton
          label="Delete this walk"
          question={`Delete this walk with its ${sightings.length} sighting${sightings.length === 1 ? "" : "s"} and ${photos.length} photo${photos.length === 1 ? "" : "s"}? It has not been sent, so it cannot be brought back.`}
          confirmLabel="Yes, delete the walk"
          className="btn min-w-tap px-3 text-rust-700 underline"
          onConfirm={async () => {
            await deleteDraftVisit(visitId);
            // eslint-disable-next-line @next/next/no-location-assign-relative-destination -- a document load on purpose, which the service worker answers offline (field links are plain <a> too)
            window.location.assign("/field");
          }}
        />
      )}
    </div>
  );
}
