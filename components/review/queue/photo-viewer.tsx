"use client";

import { useState } from "react";
import type { SightingDetail } from "@/lib/review/contract";
import { Dialog } from "./dialog";

const ZOOMS = [1, 1.5, 2, 3, 4] as const;

/** One sighting's photos at display size, with zoom (buttons, or + − 0) and ← → between photos. */
export function PhotoViewer({ photos, start, speciesName, onClose }: { photos: SightingDetail["photos"]; start: number; speciesName: string; onClose: () => void }) {
  const [index, setIndex] = useState(Math.min(Math.max(start, 0), photos.length - 1));
  const [zoom, setZoom] = useState(0);
  const photo = photos[index];
  if (!photo) return null;
  const go = (to: number) => {
    setIndex((to + photos.length) % photos.length);
    setZoom(0);
  };
  const zoomIn = () => setZoom((z) => Math.min(z + 1, ZOOMS.length - 1));
  const zoomOut = () => setZoom((z) => Math.max(z - 1, 0));
  const keys = (e: React.KeyboardEvent) => {
    const handled: Record<string, () => void> = { "+": zoomIn, "=": zoomIn, "-": zoomOut, "0": () => setZoom(0), ArrowRight: () => go(index + 1), ArrowLeft: () => go(index - 1) };
    const run = handled[e.key];
    if (run && !(e.target instanceof HTMLInputElement)) {
      e.preventDefault();
      run();
    }
  };
  const scale = ZOOMS[zoom]!;
  return (
    <Dialog title={`Photo ${index + 1} of ${photos.length}: ${speciesName}`} onClose={onClose} wide onKeyDown={keys}>
      <div className="mb-3 flex flex-wrap items-center gap-2">
        <button type="button" className="btn-quiet" onClick={zoomOut} disabled={zoom === 0} aria-keyshortcuts="-">Zoom out</button>
        <span className="min-w-16 text-center font-bold" aria-live="polite">{Math.round(scale * 100)} %</span>
        <button type="button" className="btn-quiet" onClick={zoomIn} disabled={zoom === ZOOMS.length - 1} aria-keyshortcuts="+" data-autofocus>Zoom in</button>
        <button type="button" className="btn-quiet" onClick={() => setZoom(0)} disabled={zoom === 0} aria-keyshortcuts="0">Fit</button>
        {photos.length > 1 && (
          <span className="ml-auto flex gap-2">
            <button type="button" className="btn-quiet" onClick={() => go(index - 1)} aria-keyshortcuts="ArrowLeft">Previous photo</button>
            <button type="button" className="btn-quiet" onClick={() => go(index + 1)} aria-keyshortcuts="ArrowRight">Next photo</button>
          </span>
        )}
      </div>
      <div className="h-[70vh] overflow-auto rounded-lg bg-shingle-900" data-testid="photo-frame">
        {/* eslint-disable-next-line @next/next/no-img-element -- a short-lived signed URL from the object store, already sized there */}
        <img
          src={photo.displayUrl}
          alt={`Photo ${index + 1} of ${photos.length} of the ${speciesName} sighting`}
          style={zoom === 0 ? { maxWidth: "100%", maxHeight: "100%", margin: "0 auto" } : { width: `${scale * 100}%`, maxWidth: "none" }}
          className="block object-contain"
          data-zoom={scale}
        />
      </div>
      <p className="mt-2 text-sm text-shingle-600">+ and − zoom, 0 fits the photo again{photos.length > 1 ? ", ← and → show the other photos" : ""}; Esc closes.</p>
    </Dialog>
  );
}
