"use client";

import { useMutation } from "@tanstack/react-query";
import Link from "next/link";
import { useState } from "react";
import type { FirstPass, ImportCounts } from "@/lib/import/first-pass";
import { MAX_IMPORT_FILE_BYTES } from "@/lib/import/limits";
import { REVIEWER, statusForReviewer } from "@/lib/review/words";
import { ProblemList } from "./problem-list";
import { ImportApiError, sendForm } from "./send-form";

type SeasonChoice = { id: string; name: string; startsOn: string; endsOn: string; status: string };
type Preview = FirstPass & { previewHash: string | null; season: { name: string } };
type Choice = { seasonId: string; recordStatus: "accepted" | "pending"; walks: File | null; sightings: File | null };

function formOf(choice: Choice, previewHash?: string): FormData {
  const form = new FormData();
  form.set("seasonId", choice.seasonId);
  form.set("recordStatus", choice.recordStatus);
  if (choice.walks) form.set("walks", choice.walks);
  if (choice.sightings) form.set("sightings", choice.sightings);
  if (previewHash) form.set("previewHash", previewHash);
  return form;
}

const tooBig = (file: File | null) => (file && file.size > MAX_IMPORT_FILE_BYTES ? `${file.name} is larger than 10 MB. Split the season into smaller files.` : null);

/** Choose a season, what the sightings become and the two files; preview the counts and problems; then import. */
export function SeasonImport({ seasons }: { seasons: SeasonChoice[] }) {
  const [choice, setChoice] = useState<Choice>({ seasonId: seasons[0]?.id ?? "", recordStatus: "accepted", walks: null, sightings: null });
  const preview = useMutation({ mutationFn: (c: Choice) => sendForm<Preview>("/api/network/earlier-seasons/preview", formOf(c)) });
  const confirm = useMutation({ mutationFn: (hash: string) => sendForm<{ imported: { importId: string; counts: ImportCounts } }>("/api/network/earlier-seasons", formOf(choice, hash)) });

  const change = (next: Partial<Choice>) => {
    preview.reset();
    confirm.reset();
    setChoice((c) => ({ ...c, ...next }));
  };
  const localProblem = tooBig(choice.walks) ?? tooBig(choice.sightings);
  const error = (preview.error ?? confirm.error) as ImportApiError | null;
  const shown = preview.data;
  const c = shown?.counts;

  if (seasons.length === 0) return <p className="card">Add the season first on the <Link href="/network/seasons" className="underline">Seasons</Link> page, then import its walks here.</p>;

  return (
    <div className="space-y-4">
      <form className="card max-w-xl space-y-3" onSubmit={(e) => { e.preventDefault(); preview.mutate(choice); }}>
        <div>
          <label htmlFor="import-season" className="field-label">Season</label>
          <select id="import-season" className="field-input" value={choice.seasonId} onChange={(e) => change({ seasonId: e.target.value })}>
            {seasons.map((s) => <option key={s.id} value={s.id}>{s.name} ({s.startsOn} to {s.endsOn}, {s.status})</option>)}
          </select>
        </div>
        <fieldset>
          <legend className="field-label">The imported sightings are</legend>
          {([["accepted", `${statusForReviewer.accepted}: they were reviewed before`], ["pending", `${statusForReviewer.pending}: a ${REVIEWER} looks at each`]] as const).map(([value, label]) => (
            <label key={value} className="mt-1 flex min-h-tap items-center gap-2">
              <input type="radio" name="recordStatus" className="h-5 w-5" checked={choice.recordStatus === value} onChange={() => change({ recordStatus: value })} />
              {label}
            </label>
          ))}
        </fieldset>
        <div>
          <label htmlFor="walks-file" className="field-label">Walks file (CSV)</label>
          <input id="walks-file" type="file" accept=".csv,text/csv" className="field-input" onChange={(e) => change({ walks: e.target.files?.[0] ?? null })} />
        </div>
        <div>
          <label htmlFor="sightings-file" className="field-label">Sightings file (CSV)</label>
          <input id="sightings-file" type="file" accept=".csv,text/csv" className="field-input" onChange={(e) => change({ sightings: e.target.files?.[0] ?? null })} />
        </div>
        {localProblem && <p role="alert" className="field-error">{localProblem}</p>}
        <button type="submit" className="btn-primary" disabled={!choice.walks || !choice.sightings || Boolean(localProblem) || preview.isPending}>
          {preview.isPending ? "Checking the files…" : "Preview"}
        </button>
      </form>

      {error && (
        <section aria-labelledby="import-error-heading" className="card border-rust-700" role="alert">
          <h2 id="import-error-heading" className="text-xl font-bold text-rust-700">{error.message}</h2>
          {error.refusal ? <ProblemList problems={error.refusal.problems} more={error.refusal.moreProblems} /> : Object.values(error.fields).flat().map((m) => <p key={m} className="mt-2">{m}</p>)}
        </section>
      )}

      {shown && c && !confirm.isSuccess && (
        <section aria-labelledby="import-preview-heading" className="card space-y-2">
          <h2 id="import-preview-heading" className="text-xl font-bold">Preview for the {shown.season.name}</h2>
          <p role="status">
            <strong>{c.walks.toLocaleString("en-GB")}</strong> walks ({c.emptyWalks.toLocaleString("en-GB")} with no sightings), <strong>{c.sightings.toLocaleString("en-GB")}</strong> sightings
            of {c.species} species on {c.transects} transects.
          </p>
          {shown.newRecorders.length > 0 && (
            <div>
              <h3 className="font-bold">New recorders without an account ({shown.newRecorders.length})</h3>
              <p className="text-sm">These names match nobody on the People page. Check for spelling variants of someone already there before importing.</p>
              <ul className="list-disc pl-6">{shown.newRecorders.map((n) => <li key={n}>{n}</li>)}</ul>
            </div>
          )}
          {shown.problems.length > 0 ? (
            <>
              <h3 className="font-bold text-rust-700">Nothing can be imported until these are put right</h3>
              <ProblemList problems={shown.problems} more={shown.moreProblems} />
            </>
          ) : (
            <button type="button" className="btn-primary" disabled={confirm.isPending} onClick={() => confirm.mutate(shown.previewHash!)}>
              {confirm.isPending ? "Importing…" : `Import ${c.walks.toLocaleString("en-GB")} walks and ${c.sightings.toLocaleString("en-GB")} sightings`}
            </button>
          )}
        </section>
      )}

      {confirm.isSuccess && (
        <p role="status" className="card font-bold text-lichen-700">
          Imported {confirm.data.imported.counts.walks.toLocaleString("en-GB")} walks and {confirm.data.imported.counts.sightings.toLocaleString("en-GB")} sightings.{" "}
          <Link href="/network/history?entity=import" className="underline">See the import in the history</Link>.
        </p>
      )}
    </div>
  );
}
