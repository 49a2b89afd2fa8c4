"use client";

import { useMemo, useRef, useState } from "react";
import { searchSpecies, type ChecklistEntry } from "@/lib/field/species-search";
import { MAX_SIGHTING_NOTE_LENGTH } from "@/lib/limits/text";
import { phoneStore, type LocalSighting } from "@/lib/offline/phone-store";
import { saveSightingWithPhotos } from "@/lib/offline/records";
import { Stepper } from "../stepper";
import { useLive } from "../use-live";
import { PhotoThumbnail } from "./photo-thumbnail";

type Position = { latitude: number; longitude: number; accuracyMetres: number };

export function SightingForm({
  visitId,
  checklist,
  seenHere,
  sectionCount,
  editing,
  onDone,
}: {
  visitId: string;
  checklist: ChecklistEntry[];
  seenHere: string[];
  sectionCount: number;
  editing?: LocalSighting;
  onDone: () => void;
}) {
  const [query, setQuery] = useState("");
  const [speciesId, setSpeciesId] = useState<string | null>(editing?.speciesId ?? null);
  const [count, setCount] = useState(editing?.count ?? 1);
  const [section, setSection] = useState<number | null>(editing?.section ?? null);
  const [note, setNote] = useState(editing?.note ?? "");
  const [position, setPosition] = useState<Position | null>(
    editing?.latitude != null && editing.longitude != null ? { latitude: editing.latitude, longitude: editing.longitude, accuracyMetres: editing.accuracyMetres ?? 0 } : null,
  );
  const [locating, setLocating] = useState(false);
  // Photos chosen in this form, kept only when the record is saved.
  const [files, setFiles] = useState<{ key: number; file: File }[]>([]);
  const nextFileKey = useRef(0);
  // Stored photos the volunteer removed here; they go only when the record is saved, so Cancel undoes it.
  const [removedIds, setRemovedIds] = useState<string[]>([]);
  const [error, setError] = useState<string | null>(null);
  const [saving, setSaving] = useState(false);
  // A ref, not only state: two taps can land before React re-renders the disabled button.
  const savingRef = useRef(false);
  const stored = useLive(async () => (editing ? phoneStore().photos.where("sightingId").equals(editing.id).sortBy("createdAt") : []), [editing?.id]);
  const storedPhotos = (stored ?? []).filter((p) => !removedIds.includes(p.id));
  const matches = useMemo(() => searchSpecies(checklist, query, seenHere, 8), [checklist, query, seenHere]);
  const chosen = checklist.find((s) => s.id === speciesId);

  const locate = () => {
    if (!("geolocation" in navigator)) return setError("This phone cannot give a position.");
    setLocating(true);
    navigator.geolocation.getCurrentPosition(
      (p) => {
        setPosition({ latitude: p.coords.latitude, longitude: p.coords.longitude, accuracyMetres: Math.round(p.coords.accuracy) });
        setLocating(false);
      },
      () => {
        setError("No position: allow location for Turnstone, or leave it out.");
        setLocating(false);
      },
      { enableHighAccuracy: true, timeout: 20_000, maximumAge: 30_000 },
    );
  };

  const save = async () => {
    if (savingRef.current) return;
    if (!speciesId) return setError("Choose a species first.");
    const fields = {
      speciesId,
      count,
      section,
      note: note.trim() || null,
      latitude: position?.latitude ?? null,
      longitude: position?.longitude ?? null,
      accuracyMetres: position?.accuracyMetres ?? null,
    };
    savingRef.current = true;
    setSaving(true);
    try {
      await saveSightingWithPhotos(visitId, editing?.id ?? null, fields, { add: files.map((f) => f.file), remove: removedIds });
      onDone();
    } catch (e) {
      setError(e instanceof Error ? e.message : "Could not save the sighting.");
    } finally {
      savingRef.current = false;
      setSaving(false);
    }
  };

  const photoCount = storedPhotos.length + files.length;

  return (
    <section aria-labelledby="sighting-form-heading" className="card space-y-4 border-2 border-tideline-600">
      <h2 id="sighting-form-heading" className="text-lg font-bold">{editing ? "Change this sighting" : "Add a sighting"}</h2>
      {error && <p role="alert" className="font-bold text-rust-700">{error}</p>}
      {chosen ? (
        <div className="flex items-center justify-between gap-2 rounded-lg bg-tideline-50 p-3">
          <p>
            <strong data-testid="chosen-species">{chosen.vernacularName}</strong> <i className="text-shingle-600">{chosen.scientificName}</i>
          </p>
          <button type="button" className="btn-quiet min-w-tap" onClick={() => setSpeciesId(null)}>Change</button>
        </div>
      ) : (
        <div>
          <label htmlFor="species-search" className="field-label">Species</label>
          <input id="species-search" type="search" autoComplete="off" className="field-input" placeholder="Type a common or scientific name" value={query} onChange={(e) => setQuery(e.target.value)} />
          <ul className="mt-2 space-y-1" aria-label="Matching species">
            {matches.map((s) => (
              <li key={s.id}>
                <button type="button" className="btn-quiet min-w-tap w-full justify-start text-left" onClick={() => { setSpeciesId(s.id); setQuery(""); setError(null); }}>
                  <span>
                    {s.vernacularName} <i className="font-normal text-shingle-600">{s.scientificName}</i>
                    {seenHere.includes(s.id) && <span className="ml-2 rounded bg-lichen-100 px-1 text-xs text-lichen-700">seen here before</span>}
                  </span>
                </button>
              </li>
            ))}
          </ul>
        </div>
      )}
      <div>
        <span className="field-label" id="count-label">How many</span>
        <Stepper label="Count" value={count} onChange={setCount} />
      </div>
      <div>
        <label htmlFor="section" className="field-label">Section</label>
        <select id="section" className="field-input" value={section ?? ""} onChange={(e) => setSection(e.target.value ? Number(e.target.value) : null)}>
          <option value="">Not noted</option>
          {Array.from({ length: sectionCount }, (_, i) => i + 1).map((n) => (
            <option key={n} value={n}>Section {n}</option>
          ))}
        </select>
      </div>
      <div>
        <label htmlFor="sighting-note" className="field-label">Note (optional)</label>
        <textarea id="sighting-note" rows={2} maxLength={MAX_SIGHTING_NOTE_LENGTH} className="field-input" value={note} onChange={(e) => setNote(e.target.value)} />
      </div>
      <div className="flex flex-wrap items-center gap-2">
        <button type="button" className="btn-quiet min-w-tap" onClick={locate} disabled={locating}>{locating ? "Finding position…" : position ? "Update position" : "Add my position"}</button>
        {position && (
          <span className="flex items-center gap-2 text-sm">
            {position.latitude.toFixed(5)}, {position.longitude.toFixed(5)} (±{position.accuracyMetres} m)
            <button type="button" className="btn-quiet min-w-tap px-3 text-sm" onClick={() => setPosition(null)} aria-label="Remove the position">Remove</button>
          </span>
        )}
      </div>
      <div>
        <label htmlFor="sighting-photos" className="field-label">Photos (optional)</label>
        <input
          id="sighting-photos"
          type="file"
          accept="image/jpeg,image/png,image/webp,image/heic,image/heif"
          multiple
          className="field-input"
          onChange={(e) => {
            const chosen = Array.from(e.target.files ?? []);
            setFiles((kept) => [...kept, ...chosen.map((file) => ({ key: nextFileKey.current++, file }))]);
            // Cleared so the same picture can be chosen again after removing it.
            e.target.value = "";
          }}
        />
        {photoCount > 0 && (
          <>
            <p className="mt-1 text-sm">{photoCount} photo{photoCount > 1 ? "s" : ""} with this sighting{files.length + removedIds.length > 0 ? ": changes are kept when you save" : ""}.</p>
            <ul className="mt-2 flex flex-wrap gap-3" aria-label="Photos with this sighting">
              {storedPhotos.map((p, i) => (
                <PhotoThumbnail key={p.id} blob={p.blob} label={`Photo ${i + 1}`} onRemove={() => setRemovedIds((ids) => [...ids, p.id])} />
              ))}
              {files.map(({ key, file }, i) => (
                <PhotoThumbnail key={key} blob={file} label={`Photo ${storedPhotos.length + i + 1} (new)`} onRemove={() => setFiles((kept) => kept.filter((k) => k.key !== key))} />
              ))}
            </ul>
          </>
        )}
      </div>
      <div className="grid grid-cols-2 gap-2">
        <button type="button" className="btn-quiet min-w-tap" onClick={onDone} disabled={saving}>Cancel</button>
        <button type="button" className="btn-primary min-w-tap" onClick={() => void save()} disabled={saving} aria-busy={saving}>{saving ? "Saving…" : "Save sighting"}</button>
      </div>
    </section>
  );
}
