"use client";

import type { UseFormRegisterReturn } from "react-hook-form";
import { habitatColours } from "@/lib/geo/palette";

/** The palette as radio buttons: each colour with its name, so the choice never rests on colour alone. */
export function ColourPicker({ register, legend, error }: { register: UseFormRegisterReturn; legend: string; error?: string }) {
  return (
    <fieldset>
      <legend className="field-label">{legend}</legend>
      <div className="mt-1 flex flex-wrap gap-2">
        {Object.entries(habitatColours).map(([key, c]) => (
          <label key={key} className="flex min-h-tap cursor-pointer items-center gap-2 rounded-lg border border-shingle-400 bg-white px-2 has-[:checked]:ring-2 has-[:checked]:ring-tideline-600">
            <input type="radio" value={key} className="h-4 w-4" {...register} />
            <span aria-hidden="true" className="inline-block h-4 w-6 rounded-sm" style={{ background: c.hex }} />
            <span className="text-sm">{c.label}</span>
          </label>
        ))}
      </div>
      {error && <p className="field-error">{error}</p>}
    </fieldset>
  );
}
