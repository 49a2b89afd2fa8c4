"use client";

import type { UseFormRegisterReturn } from "react-hook-form";
import { roleLabel, roles } from "@/lib/auth/roles";

/** Roles as checkboxes in a fieldset: a person may hold several. */
export function RoleChoices({ idPrefix, register, error, legend = "Roles" }: { idPrefix: string; register: UseFormRegisterReturn<"roles">; error?: string; legend?: string }) {
  return (
    <fieldset aria-describedby={error ? `${idPrefix}-roles-error` : undefined}>
      <legend className="field-label">{legend}</legend>
      <div className="flex flex-wrap gap-x-4">
        {roles.map((r) => (
          <label key={r} className="inline-flex min-h-tap items-center gap-2">
            <input type="checkbox" className="h-5 w-5" value={r} {...register} />
            {roleLabel[r]}
          </label>
        ))}
      </div>
      {error && <p id={`${idPrefix}-roles-error`} className="field-error">{error}</p>}
    </fieldset>
  );
}
