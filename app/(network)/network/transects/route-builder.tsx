"use client";

import { useMutation } from "@tanstack/react-query";
import { useId, useMemo, useState } from "react";
import { RouteEditorMap, type EditorMode } from "@/components/map/lazy";
import { MAX_ROUTE_FILE_BYTES, MAX_SECTION_HABITAT } from "@/lib/geo/limits";
import { buildRoute, splitAt } from "@/lib/geo/sections";
import type { Position, SectionDraft } from "@/lib/geo/types";
import { api, messagesUnder } from "./api";
import { distance, plural } from "./format";

export type RouteDraft = { coordinates: Position[]; boundaries: number[]; habitats: (string | null)[] };

export const emptyDraft: RouteDraft = { coordinates: [], boundaries: [], habitats: [] };

type Preview = { route: { coordinates: Position[] }; sections: { from: number; to: number; habitat: string | null }[]; warnings: string[] };

/** The sections to send, and what the browser already knows is wrong (the server checks again). */
export function draftSections(draft: RouteDraft): SectionDraft[] {
  return splitAt(draft.coordinates, draft.boundaries, draft.habitats);
}

const FILE_MB = MAX_ROUTE_FILE_BYTES / 1024 / 1024;

/**
 * The route of one transect: drawn on the map, edited point by point, or read from a GeoJSON or
 * GPX file (parsed on the server), then split into sections. Lengths are measured with
 * @turf/length here for the organiser to see, and again by the server, which keeps its own.
 */
export function RouteBuilder({ draft, onChange, colour, tileUrl, serverErrors }: { draft: RouteDraft; onChange: (draft: RouteDraft) => void; colour: string; tileUrl: string | null; serverErrors: string[] }) {
  const [mode, setMode] = useState<EditorMode>("view");
  const [fitKey, setFitKey] = useState(0);
  const [fileProblem, setFileProblem] = useState<string[]>([]);
  const [pointNumber, setPointNumber] = useState("");
  const ids = useId();

  const checked = useMemo(() => (draft.coordinates.length ? buildRoute(draftSections(draft)) : null), [draft]);
  const sections = draftSections(draft);

  const preview = useMutation({
    mutationFn: (file: { fileName: string; text: string }) => api<{ preview: Preview }>("/api/network/transects/route-file", { body: file }),
    onSuccess: ({ preview: p }) => {
      setFileProblem([]);
      onChange({ coordinates: p.route.coordinates, boundaries: p.sections.slice(0, -1).map((s) => s.to), habitats: p.sections.map((s) => s.habitat) });
      setMode("view");
      setFitKey((k) => k + 1);
    },
    onError: (error) => setFileProblem(messagesUnder(error, "route").length ? messagesUnder(error, "route") : [error.message]),
  });

  async function readFile(file: File | undefined) {
    if (!file) return;
    if (file.size > MAX_ROUTE_FILE_BYTES) {
      setFileProblem([`${file.name} is ${(file.size / 1024 / 1024).toFixed(1)} MB; route files can be at most ${FILE_MB} MB.`]);
      return;
    }
    preview.mutate({ fileName: file.name, text: await file.text() });
  }

  const toggle = (index: number) => {
    const has = draft.boundaries.includes(index);
    const boundaries = has ? draft.boundaries.filter((b) => b !== index) : [...draft.boundaries, index].sort((a, b) => a - b);
    // Habitats stay with the section that keeps its start.
    const sectionAt = draft.boundaries.filter((b) => b < index).length;
    const habitats = [...draft.habitats];
    if (has) habitats.splice(sectionAt + 1, 1);
    else habitats.splice(sectionAt + 1, 0, null);
    onChange({ ...draft, boundaries, habitats });
  };

  const addAtPoint = () => {
    const n = Number(pointNumber);
    if (Number.isInteger(n) && n > 1 && n < draft.coordinates.length && !draft.boundaries.includes(n - 1)) toggle(n - 1);
    setPointNumber("");
  };

  const problems = [...(checked && !checked.ok ? checked.errors : []), ...serverErrors];
  const warnings = checked?.ok ? checked.warnings : [];

  return (
    <div className="space-y-3">
      <div className="flex flex-wrap items-end gap-2">
        <button type="button" className="btn-quiet" aria-pressed={mode === "draw"} onClick={() => setMode(mode === "draw" ? "view" : "draw")}>
          {mode === "draw" ? "Stop drawing" : "Draw a new line"}
        </button>
        <button type="button" className="btn-quiet" disabled={draft.coordinates.length < 2} aria-pressed={mode === "edit"} onClick={() => setMode(mode === "edit" ? "view" : "edit")}>
          {mode === "edit" ? "Done moving points" : "Move points"}
        </button>
        <div>
          <label htmlFor={`${ids}-file`} className="field-label">Import a route file (GeoJSON or GPX, up to {FILE_MB} MB)</label>
          <input id={`${ids}-file`} type="file" accept=".geojson,.json,.gpx,application/geo+json,application/gpx+xml" className="field-input" onChange={(e) => void readFile(e.target.files?.[0])} />
        </div>
      </div>
      <p className="text-sm text-shingle-700">
        {mode === "draw"
          ? "Click on the map to add points in walking order; click the last point again to finish."
          : mode === "edit"
            ? "Drag points to move them, drag a midpoint to add one, right-click a point to remove it."
            : "Click the line, or a point on it, to end a section there; click a boundary again to join the sections."}
      </p>
      {preview.isPending && <p role="status">Reading the file…</p>}
      {fileProblem.length > 0 && (
        <div role="alert" className="rounded-lg border border-rust-700 bg-rust-100 p-3 text-rust-700">
          <p className="font-bold">The file was not used:</p>
          <ul className="list-disc pl-5">{fileProblem.map((p) => <li key={p}>{p}</li>)}</ul>
        </div>
      )}

      <RouteEditorMap
        tileUrl={tileUrl}
        coordinates={draft.coordinates}
        boundaries={draft.boundaries}
        mode={mode}
        colour={colour}
        fitKey={fitKey}
        onDrawn={(coordinates) => {
          onChange({ coordinates, boundaries: [], habitats: [] });
          setMode("view");
          setFitKey((k) => k + 1);
        }}
        onEdited={(coordinates, boundaries) => onChange({ ...draft, coordinates, boundaries })}
        onToggleBoundary={toggle}
      />

      {problems.length > 0 && (
        <div role="alert" className="rounded-lg border border-rust-700 bg-rust-100 p-3 text-rust-700">
          <ul className="list-disc pl-5">{problems.map((p) => <li key={p}>{p}</li>)}</ul>
        </div>
      )}
      {warnings.map((w) => (
        <p key={w} role="status" className="rounded-lg border border-sand-800 bg-sand-100 p-3 text-sand-800">{w}</p>
      ))}

      {draft.coordinates.length >= 2 && (
        <div className="space-y-2">
          <p>
            <strong>{checked?.ok ? distance(checked.value.lengthMetres) : "—"}</strong> in {plural(sections.length, "section")}, {plural(draft.coordinates.length, "point")}. Lengths are measured along the ground, not typed.
          </p>
          <div className="flex flex-wrap items-end gap-2">
            <div>
              <label htmlFor={`${ids}-point`} className="field-label">End a section at point number (2 to {draft.coordinates.length - 1})</label>
              <input id={`${ids}-point`} inputMode="numeric" className="field-input w-32" value={pointNumber} onChange={(e) => setPointNumber(e.target.value)} />
            </div>
            <button type="button" className="btn-quiet" onClick={addAtPoint}>Add boundary</button>
          </div>
          <table className="w-full text-left text-sm">
            <caption className="sr-only">Sections</caption>
            <thead className="bg-shingle-100">
              <tr>
                <th scope="col" className="p-2">Section</th>
                <th scope="col" className="p-2">Points</th>
                <th scope="col" className="p-2 text-right">Length</th>
                <th scope="col" className="p-2">Habitat</th>
                <th scope="col" className="p-2"><span className="sr-only">Boundary</span></th>
              </tr>
            </thead>
            <tbody>
              {sections.map((s, i) => {
                const from = i === 0 ? 0 : draft.boundaries[i - 1]!;
                const measured = checked?.ok ? checked.value.sections[i]?.lengthMetres : undefined;
                return (
                  <tr key={`${i}-${from}`} className="border-t border-shingle-100">
                    <td className="p-2 font-bold">{i + 1}</td>
                    <td className="p-2">{from + 1}–{from + s.coordinates.length}</td>
                    <td className="p-2 text-right">{measured === undefined ? "—" : distance(measured)}</td>
                    <td className="p-2">
                      <label className="sr-only" htmlFor={`${ids}-habitat-${i}`}>Habitat of section {i + 1}</label>
                      <input
                        id={`${ids}-habitat-${i}`}
                        className="field-input mt-0"
                        maxLength={MAX_SECTION_HABITAT}
                        value={draft.habitats[i] ?? ""}
                        onChange={(e) => {
                          const habitats = [...draft.habitats];
                          habitats[i] = e.target.value || null;
                          onChange({ ...draft, habitats });
                        }}
                      />
                    </td>
                    <td className="p-2">
                      {i < sections.length - 1 && (
                        <button type="button" className="btn-quiet" onClick={() => toggle(draft.boundaries[i]!)}>Join with {i + 2}</button>
                      )}
                    </td>
                  </tr>
                );
              })}
            </tbody>
          </table>
        </div>
      )}
    </div>
  );
}
