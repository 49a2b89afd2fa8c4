"use client";

import { useState } from "react";

/**
 * A destructive action that asks first, in the page rather than a browser dialog, so the question
 * reads the same on every phone and a slipped thumb changes nothing.
 */
export function ConfirmButton({
  label,
  ariaLabel,
  question,
  confirmLabel,
  onConfirm,
  className = "btn-quiet min-w-tap",
}: {
  label: string;
  ariaLabel?: string;
  question: string;
  confirmLabel: string;
  onConfirm: () => Promise<void> | void;
  className?: string;
}) {
  const [asking, setAsking] = useState(false);
  const [busy, setBusy] = useState(false);
  if (!asking) {
    return (
      <button type="button" className={className} aria-label={ariaLabel} onClick={() => setAsking(true)}>
        {label}
      </button>
    );
  }
  return (
    <div role="alertdialog" aria-label={question} className="w-full rounded-lg border-2 border-rust-700 bg-rust-100 p-3">
      <p className="font-bold text-rust-700">{question}</p>
      <div className="mt-2 grid grid-cols-2 gap-2">
        {/* Focus lands on the safe choice, so pressing Enter keeps the record. */}
        <button type="button" className="btn-quiet min-w-tap" onClick={() => setAsking(false)} disabled={busy} autoFocus>
          Keep it
        </button>
        <button
          type="button"
          className="btn min-w-tap bg-rust-700 text-white"
          disabled={busy}
          onClick={async () => {
            setBusy(true);
            try {
              await onConfirm();
            } finally {
              setBusy(false);
              setAsking(false);
            }
          }}
        >
          {confirmLabel}
        </button>
      </div>
    </div>
  );
}
