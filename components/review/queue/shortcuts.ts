"use client";

import { useEffect, useRef } from "react";

// The queue's keyboard shortcuts: one list, used by the key handler and the help overlay.

export type ShortcutAction = "next" | "previous" | "confirm" | "question" | "setAside" | "photo" | "help";

export const shortcuts: { keys: string[]; action: ShortcutAction; what: string }[] = [
  { keys: ["j", "ArrowDown"], action: "next", what: "Next sighting" },
  { keys: ["k", "ArrowUp"], action: "previous", what: "Previous sighting" },
  { keys: ["c"], action: "confirm", what: "Confirm the open sighting" },
  { keys: ["q"], action: "question", what: "Ask the volunteer a question" },
  { keys: ["s"], action: "setAside", what: "Set it aside (not used in counts), with a reason" },
  { keys: ["p"], action: "photo", what: "Open its first photo (then + and − zoom, ← and → other photos)" },
  { keys: ["?"], action: "help", what: "Show this list" },
];

/** "Escape" closes any dialog; listed in the help but handled by the dialog itself. */
export const ESCAPE_HELP = { keys: ["Esc"], what: "Close a dialog or this list" };

const keyName: Record<string, string> = { ArrowDown: "↓", ArrowUp: "↑" };
export const keyLabel = (key: string) => keyName[key] ?? key;

/** Typing somewhere: then letters are text, not shortcuts. */
export function isTextEntry(target: EventTarget | null): boolean {
  if (!(target instanceof HTMLElement)) return false;
  if (target.isContentEditable) return true;
  if (target instanceof HTMLTextAreaElement || target instanceof HTMLSelectElement) return true;
  if (target instanceof HTMLInputElement) return !["checkbox", "radio", "button", "submit", "reset"].includes(target.type);
  return false;
}

const byKey = new Map(shortcuts.flatMap((s) => s.keys.map((k) => [k, s.action] as const)));

/** Calls `run` for a shortcut pressed anywhere on the page, except in a text field or under an open dialog. */
export function useShortcuts(run: (action: ShortcutAction) => boolean | void) {
  const latest = useRef(run);
  useEffect(() => {
    latest.current = run;
  });
  useEffect(() => {
    const onKey = (e: KeyboardEvent) => {
      if (e.defaultPrevented || e.ctrlKey || e.metaKey || e.altKey || isTextEntry(e.target)) return;
      if (document.querySelector('[aria-modal="true"]')) return;
      const action = byKey.get(e.key);
      if (!action) return;
      if (latest.current(action) !== false) e.preventDefault();
    };
    document.addEventListener("keydown", onKey);
    return () => document.removeEventListener("keydown", onKey);
  }, []);
}
