"use client";

/** Large +/- buttons for counting with one thumb (each at least 44 px, WCAG 2.5.5 target size). */
export function Stepper({ value, onChange, min = 0, max = 100_000, label }: { value: number; onChange: (v: number) => void; min?: number; max?: number; label: string }) {
  const set = (v: number) => onChange(Math.max(min, Math.min(max, Number.isFinite(v) ? Math.round(v) : min)));
  return (
    <div className="flex items-center gap-2" role="group" aria-label={label}>
      <button type="button" className="btn-quiet h-14 w-14 text-2xl" aria-label={`Fewer (${label})`} onClick={() => set(value - 1)} disabled={value <= min}>
        −
      </button>
      <input
        type="number"
        inputMode="numeric"
        aria-label={label}
        className="field-input mt-0 h-14 w-24 text-center text-2xl font-bold"
        value={value}
        min={min}
        max={max}
        onChange={(e) => set(Number(e.target.value))}
      />
      <button type="button" className="btn-quiet h-14 w-14 text-2xl" aria-label={`More (${label})`} onClick={() => set(value + 1)} disabled={value >= max}>
        +
      </button>
    </div>
  );
}
