"use client";

import { useState } from "react";

/** Synonyms typed one per line; the form holds them as a list. */
export function SynonymsField({ id, value, onChange, onBlur }: { id: string; value: string[]; onChange: (names: string[]) => void; onBlur: () => void }) {
  // The typed text is kept as typed (blank lines included) while the list follows it.
  const [text, setText] = useState(() => value.join("\n"));
  return (
    <textarea
      id={id}
      className="field-input min-h-24"
      value={text}
      onBlur={onBlur}
      onChange={(e) => {
        setText(e.target.value);
        onChange(e.target.value.split("\n").map((s) => s.trim()).filter(Boolean));
      }}
    />
  );
}
