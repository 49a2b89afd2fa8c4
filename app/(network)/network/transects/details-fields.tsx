"use client";

import type { UseFormRegisterReturn } from "react-hook-form";
import type { HabitatGroupRow } from "@/lib/queries/habitat-groups";

export type DetailName = "code" | "name" | "habitatGroupId" | "sensitive" | "coastal" | "accessNotes";

/** The transect's own fields, shared by the new-transect and edit forms. */
export function DetailsFields({ register, errors, habitats, idPrefix }: {
  register: (name: DetailName) => UseFormRegisterReturn;
  errors: Partial<Record<DetailName, { message?: string }>>;
  habitats: HabitatGroupRow[];
  idPrefix: string;
}) {
  const id = (name: string) => `${idPrefix}-${name}`;
  return (
    <div className="grid gap-3 sm:grid-cols-2">
      <div>
        <label htmlFor={id("code")} className="field-label">Code</label>
        <input id={id("code")} className="field-input uppercase" autoComplete="off" {...register("code")} aria-describedby={id("code-hint")} />
        <p id={id("code-hint")} className="text-sm text-shingle-600">Letters, digits and hyphens, e.g. CHK-07.</p>
        {errors.code && <p className="field-error">{errors.code.message}</p>}
      </div>
      <div>
        <label htmlFor={id("name")} className="field-label">Name</label>
        <input id={id("name")} className="field-input" {...register("name")} />
        {errors.name && <p className="field-error">{errors.name.message}</p>}
      </div>
      <div>
        <label htmlFor={id("habitat")} className="field-label">Habitat group</label>
        <select id={id("habitat")} className="field-input" {...register("habitatGroupId")}>
          <option value="">Choose a habitat group</option>
          {habitats.map((h) => (
            <option key={h.id} value={h.id}>{h.name}</option>
          ))}
        </select>
        {errors.habitatGroupId && <p className="field-error">{errors.habitatGroupId.message}</p>}
      </div>
      <div className="space-y-2">
        <label className="flex min-h-tap items-center gap-2">
          <input type="checkbox" className="h-5 w-5" {...register("sensitive")} aria-describedby={id("sensitive-hint")} />
          <span className="font-bold">Sensitive route</span>
        </label>
        <p id={id("sensitive-hint")} className="text-sm text-shingle-600">
          Its exact route is then shown only to organisers, reviewers and the volunteers assigned to it; everyone else sees only roughly where it is.
        </p>
        <label className="flex min-h-tap items-center gap-2">
          <input type="checkbox" className="h-5 w-5" {...register("coastal")} />
          <span className="font-bold">Coastal route</span> <span className="text-sm text-shingle-600">(volunteers are reminded to check the tide)</span>
        </label>
      </div>
      <div className="sm:col-span-2">
        <label htmlFor={id("notes")} className="field-label">Access notes for volunteers</label>
        <textarea id={id("notes")} rows={3} className="field-input" {...register("accessNotes")} />
        {errors.accessNotes && <p className="field-error">{errors.accessNotes.message}</p>}
      </div>
    </div>
  );
}
