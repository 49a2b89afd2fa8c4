"use client";

import { useEffect, useId, useRef, type ReactNode } from "react";
import { createPortal } from "react-dom";

const focusable = 'a[href], button:not([disabled]), input:not([disabled]), select:not([disabled]), textarea:not([disabled]), [tabindex]:not([tabindex="-1"])';

/**
 * A modal dialog: focus moves in and stays in (Tab and Shift+Tab cycle), Escape or the close
 * button closes it, and focus returns to where it was. The queue's shortcuts are off while one is
 * open (they look for aria-modal).
 */
export function Dialog({ title, onClose, children, wide = false, onKeyDown }: { title: string; onClose: () => void; children: ReactNode; wide?: boolean; onKeyDown?: (e: React.KeyboardEvent) => void }) {
  const titleId = useId();
  const box = useRef<HTMLDivElement>(null);
  const close = useRef(onClose);
  useEffect(() => {
    close.current = onClose;
  });

  useEffect(() => {
    const before = document.activeElement as HTMLElement | null;
    const first = box.current?.querySelector<HTMLElement>("[data-autofocus]") ?? box.current?.querySelector<HTMLElement>(focusable);
    (first ?? box.current)?.focus();
    return () => before?.focus?.();
  }, []);

  const keys = (e: React.KeyboardEvent) => {
    if (e.key === "Escape") {
      e.preventDefault();
      e.stopPropagation();
      close.current();
      return;
    }
    if (e.key === "Tab" && box.current) {
      const items = [...box.current.querySelectorAll<HTMLElement>(focusable)];
      if (items.length === 0) return e.preventDefault();
      const [first, last] = [items[0]!, items.at(-1)!];
      if (e.shiftKey && document.activeElement === first) {
        e.preventDefault();
        last.focus();
      } else if (!e.shiftKey && document.activeElement === last) {
        e.preventDefault();
        first.focus();
      }
      return;
    }
    onKeyDown?.(e);
  };

  return createPortal(
    <div className="fixed inset-0 z-[1000] flex items-center justify-center bg-shingle-900/60 p-2 sm:p-6" onMouseDown={(e) => e.target === e.currentTarget && close.current()}>
      <div
        ref={box}
        role="dialog"
        aria-modal="true"
        aria-labelledby={titleId}
        tabIndex={-1}
        onKeyDown={keys}
        className={`flex max-h-full w-full flex-col rounded-xl bg-white shadow-lg ${wide ? "max-w-6xl" : "max-w-lg"}`}
      >
        <div className="flex items-center gap-3 border-b border-shingle-200 px-4 py-2">
          <h2 id={titleId} className="text-lg font-bold text-tideline-800">{title}</h2>
          <button type="button" className="btn-quiet ml-auto" onClick={() => close.current()}>
            Close <span aria-hidden="true" className="text-xs text-shingle-600">Esc</span>
          </button>
        </div>
        <div className="min-h-0 flex-1 overflow-auto p-4">{children}</div>
      </div>
    </div>,
    document.body,
  );
}
