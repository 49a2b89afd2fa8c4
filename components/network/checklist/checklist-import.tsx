"use client";

import { useMutation, useQueryClient } from "@tanstack/react-query";
import Link from "next/link";
import { useState } from "react";
import { MAX_CHECKLIST_FILE_BYTES } from "@/lib/checklist/limits";
import type { ImportPlan } from "@/lib/checklist/plan";
import { problemText } from "@/lib/checklist/problems";
import { api, ApiError, checklistKeys } from "./api";
import { ImportPreview } from "./import-preview";

type ChosenFile = { fileName: string; text: string };
type Preview = { plan: ImportPlan; previewHash: string };

/** Choose a CSV file, see what it would add and change (or every problem in it), then import it. */
export function ChecklistImport() {
  const queryClient = useQueryClient();
  const [file, setFile] = useState<ChosenFile | null>(null);
  const [showUnchanged, setShowUnchanged] = useState(false);
  const [localProblem, setLocalProblem] = useState<string | null>(null);
  const preview = useMutation({ mutationFn: (f: ChosenFile) => api<Preview>("/import/preview", { method: "POST", body: f }) });
  const confirm = useMutation({
    mutationFn: (body: ChosenFile & { previewHash: string }) => api<{ imported: ImportPlan["counts"] & { newTags: number } }>("/import", { method: "POST", body }),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: checklistKeys.all }),
  });

  const choose = async (chosen: File | undefined) => {
    preview.reset();
    confirm.reset();
    setLocalProblem(null);
    setFile(null);
    if (!chosen) return;
    // The server checks again; this saves sending a file that cannot be taken.
    if (chosen.size > MAX_CHECKLIST_FILE_BYTES) return setLocalProblem("The file is larger than 10 MB. Split it into smaller files and import them one after another.");
    const next = { fileName: chosen.name, text: await chosen.text() };
    setFile(next);
    preview.mutate(next);
  };

  const refusal = preview.error instanceof ApiError ? preview.error : null;
  const plan = preview.data?.plan;
  const writes = plan ? plan.counts.added + plan.counts.changed + plan.newTags.length : 0;

  return (
    <div className="space-y-4">
      <div className="card max-w-xl">
        <label htmlFor="checklist-file" className="field-label">Checklist file (CSV, UTF-8, at most 10 MB)</label>
        <input id="checklist-file" type="file" accept=".csv,text/csv" className="field-input" onChange={(e) => void choose(e.target.files?.[0])} />
        {localProblem && <p role="alert" className="field-error">{localProblem}</p>}
      </div>

      {preview.isPending && <p role="status">Reading the file…</p>}

      {refusal && (
        <section aria-labelledby="problems-heading" className="card border-rust-700">
          <h2 id="problems-heading" className="text-xl font-bold text-rust-700">{refusal.message}</h2>
          {refusal.problems.length > 0 ? (
            <ul className="mt-2 list-disc space-y-1 pl-6">
              {refusal.problems.map((p, i) => <li key={i}>{problemText(p)}</li>)}
            </ul>
          ) : (
            Object.values(refusal.fields).flat().map((m) => <p key={m} className="mt-2">{m}</p>)
          )}
          <p className="mt-2 text-sm">Correct the file and choose it again.</p>
        </section>
      )}

      {plan && file && !confirm.isSuccess && (
        <section aria-labelledby="preview-heading" className="space-y-3">
          <h2 id="preview-heading" className="text-xl font-bold">Preview of {file.fileName}</h2>
          <p role="status">
            <strong>{plan.counts.added}</strong> new, <strong>{plan.counts.changed}</strong> changed, <strong>{plan.counts.unchanged}</strong> unchanged
            {plan.newTags.length > 0 && <>; new tags: {plan.newTags.join(", ")}</>}. Nothing is written until you import.
          </p>
          <label className="inline-flex min-h-tap items-center gap-2">
            <input type="checkbox" className="h-5 w-5" checked={showUnchanged} onChange={(e) => setShowUnchanged(e.target.checked)} />
            Show unchanged entries too
          </label>
          <ImportPreview plan={plan} showUnchanged={showUnchanged} />
          <div className="flex flex-wrap items-center gap-3">
            <button type="button" className="btn-primary" disabled={writes === 0 || confirm.isPending} onClick={() => confirm.mutate({ ...file, previewHash: preview.data!.previewHash })}>
              {confirm.isPending ? "Importing…" : writes === 0 ? "Nothing to import" : `Import ${plan.counts.added} new and ${plan.counts.changed} changed`}
            </button>
            {confirm.error && (
              <p role="alert" className="font-bold text-rust-700">
                {confirm.error.message}{" "}
                {confirm.error instanceof ApiError && confirm.error.status === 409 && <button type="button" className="btn-quiet" onClick={() => preview.mutate(file)}>Preview again</button>}
              </p>
            )}
          </div>
        </section>
      )}

      {confirm.isSuccess && (
        <p role="status" className="card font-bold text-lichen-700">
          Imported: {confirm.data.imported.added} new and {confirm.data.imported.changed} changed entries{confirm.data.imported.newTags > 0 && `, ${confirm.data.imported.newTags} new tags`}.{" "}
          <Link href="/network/checklist" className="underline">See the checklist</Link> or <Link href="/network/history?entity=import" className="underline">the import in the history</Link>.
        </p>
      )}
    </div>
  );
}
