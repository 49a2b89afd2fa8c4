"use client";

import { useQuery } from "@tanstack/react-query";
import type { Ref } from "react";
import type { Conflict, QueueRow, SightingDetail as Detail } from "@/lib/review/contract";
import { walkSourceText } from "@/lib/import/walk-source";
import { statusMeaning } from "@/lib/review/words";
import { fetchSighting, reviewKeys } from "./api";
import { clock, walkDate, when } from "./format";
import { HistoryList, QuestionThread } from "./history-list";
import { SightingMap } from "./lazy-map";
import { ReviewActions, type Panel, type RunAction } from "./review-actions";
import { sectionWords, statusWords, warningWords } from "./rows";

const rainWords = { none: "None", light: "Light rain", heavy: "Heavy rain" } as const;

function Conditions({ walk }: { walk: Detail["walkDetail"] }) {
  const items: [string, string][] = [
    ["Time", [clock(walk.startTime), clock(walk.endTime)].filter(Boolean).join("–") || "Not recorded"],
    ["Temperature", walk.temperatureC === null ? "Not recorded" : `${walk.temperatureC} °C`],
    ["Sunshine", walk.sunshinePercent === null ? "Not recorded" : `${walk.sunshinePercent} % of the walk`],
    ["Cloud cover", walk.cloudCoverPercent === null ? "Not recorded" : `${walk.cloudCoverPercent} %`],
    ["Wind", walk.windBeaufort === null ? "Not recorded" : `Force ${walk.windBeaufort} (Beaufort)`],
    ["Rain", walk.rain === null ? "Not recorded" : rainWords[walk.rain]],
    ["Every species seen recorded?", walk.completeList ? "Yes: a complete list" : "No: only some species were recorded"],
  ];
  return (
    <>
      <dl className="grid grid-cols-[auto_1fr] gap-x-4 gap-y-1 text-sm">
        {items.map(([k, v]) => (
          <div key={k} className="contents">
            <dt className="font-bold text-shingle-800">{k}</dt>
            <dd>{v}</dd>
          </div>
        ))}
      </dl>
      {walk.breachTexts.length > 0 && (
        <div className="mt-2 rounded-lg bg-sand-100 p-2 text-sm text-sand-800">
          <p className="font-bold">Outside the walk rules (the walk still counts as effort; judge each sighting on its own):</p>
          <ul className="list-disc pl-5">
            {walk.breachTexts.map((t) => (
              <li key={t}>{t}</li>
            ))}
          </ul>
        </div>
      )}
      {walk.notes && <p className="mt-2 text-sm"><strong>Walk notes:</strong> {walk.notes}</p>}
    </>
  );
}

function Earlier({ earlier, species }: { earlier: Detail["earlier"]; species: string }) {
  if (earlier.length === 0) return <p className="text-sm text-shingle-600">No checked sightings of {species} on this transect in any season.</p>;
  return (
    <table className="w-full text-left text-sm">
      <caption className="sr-only">Checked sightings of {species} on this transect, by season</caption>
      <thead>
        <tr className="border-b border-shingle-200">
          <th scope="col" className="py-1">Season</th>
          <th scope="col" className="py-1">Sightings</th>
          <th scope="col" className="py-1">Counted in all</th>
          <th scope="col" className="py-1">Highest count</th>
        </tr>
      </thead>
      <tbody>
        {earlier.map((e) => (
          <tr key={e.seasonId} className="border-b border-shingle-100">
            <th scope="row" className="py-1 font-normal">{e.seasonName}</th>
            <td className="py-1">{e.sightings}</td>
            <td className="py-1">{e.total}</td>
            <td className="py-1">{e.maxCount}</td>
          </tr>
        ))}
      </tbody>
    </table>
  );
}

function Part({ title, children }: { title: string; children: React.ReactNode }) {
  return (
    <section className="space-y-2 border-t border-shingle-200 pt-3">
      <h3 className="font-bold text-tideline-800">{title}</h3>
      {children}
    </section>
  );
}

export type DetailProps = {
  id: string;
  /** The row as the list has it (newest revision), when it is on this page. */
  row: QueueRow | null;
  tileUrl: string | null;
  panel: Panel | null;
  onPanel: (p: Panel | null) => void;
  run: RunAction;
  onConfirm: () => void;
  busy: boolean;
  confirmError: unknown;
  changed: Conflict | null;
  onBack: () => void;
  onPhoto: (index: number) => void;
  headingRef: Ref<HTMLHeadingElement>;
};

/** One sighting in full: what was seen, photos, the walk, the map, earlier seasons, questions and the history. */
export function SightingDetail({ headingRef, ...props }: DetailProps) {
  const detail = useQuery({ queryKey: reviewKeys.sighting(props.id), queryFn: () => fetchSighting(props.id) });
  const d = detail.data;
  const row = props.row ?? d ?? null;
  const back = (
    <button type="button" className="btn-quiet lg:hidden" onClick={props.onBack}>
      <span aria-hidden="true">←</span> Back to the list
    </button>
  );
  if (!row) {
    return (
      <div className="space-y-3">
        {back}
        {detail.isError ? (
          <div role="alert" className="card">
            <p>The sighting could not be loaded: {detail.error.message}</p>
            <button type="button" className="btn-quiet mt-2" onClick={() => void detail.refetch()}>Try again</button>
          </div>
        ) : (
          <p role="status" className="card">Loading the sighting…</p>
        )}
      </div>
    );
  }
  const { status, marks } = statusWords(row);
  const warnings = warningWords(row);
  return (
    <article className="space-y-3" aria-labelledby="sighting-heading" data-testid="sighting-detail" data-sighting-id={row.id}>
      {back}
      <header>
        <h2 id="sighting-heading" ref={headingRef} tabIndex={-1} className="text-xl font-bold text-tideline-800">
          {row.species.vernacularName} <i className="font-normal text-shingle-600">{row.species.scientificName}</i>
        </h2>
        {row.species.aggregate && <p className="text-sm text-sand-800">An aggregate: similar species named together.</p>}
        <p>
          <strong>{row.count}</strong> · {row.transect.code} {row.transect.name}, {sectionWords(row.section)} · {walkDate(row.walk.date)} · {row.volunteer.name}
        </p>
        {walkSourceText(row.walk) && <p className="text-sm text-shingle-600">The walk was {walkSourceText(row.walk)}.</p>}
        {row.tally.entries > 1 && (
          <p className="text-sm text-tideline-800">
            One of {row.tally.entries} entries of this species in this section on the walk: the volunteer&apos;s tally, {row.tally.sum} in all.
          </p>
        )}
        <p className="mt-1">
          <span className="font-bold">{status}</span>
          {marks.map((m) => (
            <span key={m} className="ml-2 rounded bg-tideline-50 px-1 text-sm font-bold text-tideline-800">{m}</span>
          ))}
          <span className="block text-sm text-shingle-600">{statusMeaning[row.status]}</span>
        </p>
      </header>

      {props.changed && (
        <div role="alert" className="rounded-lg border border-rust-700 bg-rust-100 p-3 text-rust-700">
          <p className="font-bold">{props.changed.error.changedBy ?? "Someone"} changed this sighting{props.changed.error.changedAt ? ` at ${when(props.changed.error.changedAt)}` : ""}, after it was shown to you.</p>
          <p>Your action was not saved. It now shows as it stands; decide again if you still need to.</p>
        </div>
      )}

      {warnings.length > 0 && (
        <ul aria-label="Warnings" className="flex flex-wrap gap-1">
          {warnings.map((w) => (
            <li key={w} className="rounded bg-sand-100 px-2 py-0.5 text-sm text-sand-800">{w}</li>
          ))}
        </ul>
      )}

      <ReviewActions row={row} canReopen={d ? d.canReopen : null} panel={props.panel} onPanel={props.onPanel} run={props.run} onConfirm={props.onConfirm} busy={props.busy} confirmError={props.confirmError} />

      {detail.isError && !d && (
        <p role="alert" className="field-error">
          The rest of the sighting could not be loaded: {detail.error.message}{" "}
          <button type="button" className="underline" onClick={() => void detail.refetch()}>Try again</button>
        </p>
      )}
      {!d && !detail.isError && <p role="status" className="text-sm text-shingle-600">Loading the photos, walk and history…</p>}

      {d && (
        <>
          <Part title={d.photos.length === 1 ? "Photo" : `Photos (${d.photos.length})`}>
            {d.photos.length === 0 ? (
              <p className="text-sm text-shingle-600">No photo{d.sensitive ? " (a sensitive species: a photo is asked for)" : ""}.</p>
            ) : (
              <ul className="flex flex-wrap gap-2">
                {d.photos.map((p, i) => (
                  <li key={p.id}>
                    <button type="button" className="rounded-lg border border-shingle-200 p-0.5 hover:border-tideline-600" onClick={() => props.onPhoto(i)} aria-keyshortcuts={i === 0 ? "p" : undefined}>
                      {/* eslint-disable-next-line @next/next/no-img-element -- a short-lived signed thumbnail from the object store */}
                      <img src={p.thumbnailUrl} alt={`Enlarge photo ${i + 1} of ${d.photos.length}`} className="h-24 w-24 rounded object-cover" />
                    </button>
                  </li>
                ))}
              </ul>
            )}
            {d.note && <p className="text-sm"><strong>The volunteer&apos;s note:</strong> {d.note}</p>}
          </Part>

          <Part title="The walk">
            <Conditions walk={d.walkDetail} />
          </Part>

          <Part title="Where">
            {d.sensitive && <p className="text-sm text-sand-800">A sensitive species: where it was is shown only to reviewers, organisers and the volunteer who recorded it.</p>}
            {!d.position && <p className="text-sm text-shingle-600">No position was recorded with this sighting; the route is shown alone.</p>}
            <SightingMap route={d.route} position={d.position} tileUrl={props.tileUrl} label={`Map of ${row.transect.code} ${row.transect.name} with the sighting`} />
          </Part>

          <Part title="Checked sightings of this species here, by season">
            <Earlier earlier={d.earlier} species={row.species.vernacularName} />
          </Part>

          <Part title="Questions and answers">
            <QuestionThread history={d.history} />
          </Part>

          <Part title="History">
            <HistoryList history={d.history} />
          </Part>
        </>
      )}
    </article>
  );
}
