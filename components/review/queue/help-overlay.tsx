"use client";

import { Dialog } from "./dialog";
import { ESCAPE_HELP, keyLabel, shortcuts } from "./shortcuts";

/** Every shortcut and what it does. They work whenever the cursor is not in a text field. */
export function HelpOverlay({ onClose }: { onClose: () => void }) {
  const rows = [...shortcuts.map((s) => ({ keys: s.keys, what: s.what })), ESCAPE_HELP];
  return (
    <Dialog title="Keyboard shortcuts" onClose={onClose}>
      <p className="mb-3 text-sm text-shingle-700">They work whenever you are not typing in a field. After each decision the next sighting opens, with the focus on it.</p>
      <dl className="divide-y divide-shingle-100">
        {rows.map((r) => (
          <div key={r.what} className="flex items-baseline gap-3 py-2">
            <dt className="flex w-28 shrink-0 gap-1">
              {r.keys.map((k, i) => (
                <span key={k}>
                  {i > 0 && <span className="sr-only"> or </span>}
                  <kbd className="rounded border border-shingle-400 bg-shingle-50 px-2 py-0.5 font-mono text-sm">{keyLabel(k)}</kbd>
                </span>
              ))}
            </dt>
            <dd>{r.what}</dd>
          </div>
        ))}
      </dl>
    </Dialog>
  );
}
