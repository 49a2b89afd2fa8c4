"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useForm, useWatch } from "react-hook-form";
import { beaufortScale } from "@/lib/field/beaufort";
import { conditionWarnings, type ConditionsRules } from "@/lib/field/conditions";
import { skyLabel, startVisitSchema, timeNow, todayLocal, type StartVisitInput, type StartVisitValues } from "@/lib/field/visit-form";
import { createVisit } from "@/lib/offline/records";
import { skyValues } from "@/lib/sync/protocol";

type Transect = { id: string; code: string; name: string; coastal: boolean };

export function StartVisitForm({ transects, transectId, rules, onStarted }: { transects: Transect[]; transectId: string; rules: ConditionsRules; onStarted: (visitId: string, transectId: string) => void }) {
  const { register, handleSubmit, control, formState: { errors, isSubmitting } } = useForm<StartVisitInput, unknown, StartVisitValues>({
    resolver: zodResolver(startVisitSchema),
    defaultValues: { transectId, visitDate: todayLocal(), startTime: timeNow(), temperatureC: "", windBeaufort: "", cloudCoverPercent: "", sky: "", coRecorders: "" } as unknown as StartVisitInput,
  });
  const watched = useWatch({ control });
  const warnings = conditionWarnings(rules, {
    temperatureC: watched.temperatureC === "" || watched.temperatureC == null ? null : Number(watched.temperatureC),
    windBeaufort: watched.windBeaufort === "" || watched.windBeaufort == null ? null : Number(watched.windBeaufort),
    startTime: typeof watched.startTime === "string" ? watched.startTime : null,
  });
  const chosen = transects.find((t) => t.id === watched.transectId);

  const onSubmit = handleSubmit(async (values) => {
    const id = await createVisit({
      transectId: values.transectId,
      visitDate: values.visitDate,
      startTime: values.startTime,
      temperatureC: values.temperatureC,
      windBeaufort: values.windBeaufort,
      cloudCoverPercent: values.cloudCoverPercent,
      sky: values.sky,
      coRecorders: values.coRecorders,
    });
    onStarted(id, values.transectId);
  });

  const err = (name: keyof StartVisitInput) => errors[name] && <p className="field-error" id={`${name}-error`}>{String(errors[name]?.message)}</p>;

  return (
    <form onSubmit={onSubmit} noValidate className="space-y-4">
      <h1 className="text-2xl font-bold text-tideline-800">Start a visit</h1>
      <div>
        <label htmlFor="transectId" className="field-label">Transect</label>
        <select id="transectId" className="field-input" {...register("transectId")}>
          {transects.map((t) => (
            <option key={t.id} value={t.id}>{t.code} {t.name}</option>
          ))}
        </select>
        {err("transectId")}
        {chosen?.coastal && <p className="mt-1 text-sm font-bold text-sand-800">Coastal route: check the tide table before you set off.</p>}
      </div>
      <div className="grid grid-cols-2 gap-3">
        <div>
          <label htmlFor="visitDate" className="field-label">Date</label>
          <input id="visitDate" type="date" className="field-input" {...register("visitDate")} />
          {err("visitDate")}
        </div>
        <div>
          <label htmlFor="startTime" className="field-label">Start time</label>
          <input id="startTime" type="time" className="field-input" {...register("startTime")} />
          {err("startTime")}
        </div>
      </div>
      <fieldset className="space-y-3 rounded-xl border border-shingle-200 p-3">
        <legend className="px-1 font-bold">Conditions</legend>
        <div>
          <label htmlFor="temperatureC" className="field-label">Temperature (°C)</label>
          <input id="temperatureC" type="number" inputMode="decimal" step="0.5" className="field-input" {...register("temperatureC")} />
          {err("temperatureC")}
        </div>
        <div>
          <label htmlFor="windBeaufort" className="field-label">Wind (Beaufort force)</label>
          <select id="windBeaufort" className="field-input" {...register("windBeaufort")}>
            <option value="">Not recorded</option>
            {beaufortScale.map((b) => (
              <option key={b.force} value={b.force}>{b.force}: {b.name} ({b.sign})</option>
            ))}
          </select>
          {err("windBeaufort")}
        </div>
        <div className="grid grid-cols-2 gap-3">
          <div>
            <label htmlFor="sky" className="field-label">Sun and cloud</label>
            <select id="sky" className="field-input" {...register("sky")}>
              <option value="">Not recorded</option>
              {skyValues.map((s) => (
                <option key={s} value={s}>{skyLabel[s]}</option>
              ))}
            </select>
          </div>
          <div>
            <label htmlFor="cloudCoverPercent" className="field-label">Cloud cover (%)</label>
            <input id="cloudCoverPercent" type="number" inputMode="numeric" min={0} max={100} step={10} className="field-input" {...register("cloudCoverPercent")} />
            {err("cloudCoverPercent")}
          </div>
        </div>
      </fieldset>
      {warnings.length > 0 && (
        <ul role="status" className="space-y-1 rounded-xl border-2 border-sand-300 bg-sand-100 p-3 text-sand-800">
          {warnings.map((w) => (
            <li key={w}>⚠ {w} You can still record the walk.</li>
          ))}
        </ul>
      )}
      <div>
        <label htmlFor="coRecorders" className="field-label">Walking with (optional)</label>
        <input id="coRecorders" className="field-input" placeholder="Names of co-recorders" {...register("coRecorders")} />
        {err("coRecorders")}
      </div>
      <button type="submit" className="btn-primary w-full" disabled={isSubmitting}>Start recording</button>
    </form>
  );
}
