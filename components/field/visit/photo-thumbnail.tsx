"use client";

import { useEffect, useState } from "react";

/** A small preview of a photo kept on the phone; its object URL is let go when it leaves the screen. */
export function PhotoThumbnail({ blob, label, onRemove }: { blob: Blob; label: string; onRemove?: () => void }) {
  const [url, setUrl] = useState<string | null>(null);
  useEffect(() => {
    const made = URL.createObjectURL(blob);
    setUrl(made);
    return () => URL.revokeObjectURL(made);
  }, [blob]);
  return (
    <li className="flex flex-col items-center gap-1" data-testid="photo-thumbnail">
      {url ? (
        // A plain img: next/image cannot optimise a local Blob.
        <img src={url} alt={label} className="h-20 w-20 rounded-lg border border-shingle-200 object-cover" />
      ) : (
        <span className="h-20 w-20 rounded-lg bg-shingle-100" aria-hidden />
      )}
      {onRemove && (
        <button type="button" className="btn-quiet min-w-tap px-2 text-sm" onClick={onRemove} aria-label={`Remove ${label}`}>
          Remove
        </button>
      )}
    </li>
  );
}
