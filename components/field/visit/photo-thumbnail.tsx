"use client";

import { useEffect, useRef } from "react";

/** A small preview of a photo kept on the phone; its object URL is let go when it leaves the screen. */
export function PhotoThumbnail({ blob, label, onRemove }: { blob: Blob; label: string; onRemove?: () => void }) {
  const image = useRef<HTMLImageElement>(null);
  // The object URL is made and let go with the element that shows it, outside React's state.
  useEffect(() => {
    const made = URL.createObjectURL(blob);
    if (image.current) image.current.src = made;
    return () => URL.revokeObjectURL(made);
  }, [blob]);
  return (
    <li className="flex flex-col items-center gap-1" data-testid="photo-thumbnail">
      {/* eslint-disable-next-line @next/next/no-img-element -- a local Blob, which next/image cannot optimise */}
      <img ref={image} alt={label} className="h-20 w-20 rounded-lg border border-shingle-200 bg-shingle-100 object-cover" />
      {onRemove && (
        <button type="button" className="btn-quiet min-w-tap px-2 text-sm" onClick={onRemove} aria-label={`Remove ${label}`}>
          Remove
        </button>
      )}
    </li>
  );
}
