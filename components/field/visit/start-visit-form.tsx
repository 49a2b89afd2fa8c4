"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useState } from "react";
import { useForm, useWatch } from "react-hook-form";
import { beaufortScale } from "@/lib/field/beaufort";
import { conditionWarnings, type ConditionsRules } from "@/lib/field/conditions";
import { fieldDateBounds, fieldDateProblem, NO_SEASON_TAKES_WALKS, type FieldSeason } from "@/lib/field/season-dates";
import { rainLabel, skyLabel, startVisitSchema, timeNow, todayLocal, type StartVisitInput, type StartVisitValues } from "@/lib/field/visit-form";
import type { LocalVisit } from "@/lib/offline/phone-store";
import { createVisit, updateVisit } from "@/lib/offline/records";
import { rainValues, skyValues } from "@/lib/sync/protocol";

type Transect = { id: string; code: string; name: string; coastal: boolean };

const asText = (n: number | null | undefined) => (n == null ? "" : String(n));
const watchedNumber = (v: unknown) => (v === "" || v == null || Number.isNaN(Number(v)) ? null : Number(v));

/** The form's starting values: today and now for a new walk, or the saved walk's own. */
function startingValues(transects: Transect[], transectId: string, visit?: LocalVisit) {
  if (!visit) return { transectId, visitDate: todayLocal(), startTime: timeNow(), temperatureC: "", windBeaufort: "", cloudCoverPercent: "", sky: "", sunshinePercent: "", rain: "", coRecorders: "" };
  return {
    // A transect no longer assigned cannot be kept: the volunteer must choose one of theirs.
    transectId: transects.some((t) => t.id === visit.transectId) ? visit.transectId : "",
    visitDate: visit.visitDate,
    startTime: visit.startTime,
    temperatureC: asText(visit.temperatureC),
    windBeaufort: asText(visit.windBeaufort),
    cloudCoverPercent: asText(visit.cloudCoverPercent),
    sky: visit.sky ?? "",
    // Walks stored before sunshine and rain were asked have neither.
    sunshinePercent: asText(visit.sunshinePercent),
    rain: visit.rain ?? "",
    coRecorders: visit.coRecorders ?? "",
  };
}

/**
 * Starts a walk, or with `visit` corrects one already on the phone (a draft, or one the server
 * sent back): every field of the start of the walk can be changed. The date stays inside the
 * seasons taking walks that the phone knows of (`seasons`; absent in a copy saved before the
 * server sent them, when the server's own check is the only one).
 */
export function StartVisitForm({
  transects,
  transectId,
  rules,
  seasons,
  visit,
  onSaved,
  onCancel,
}: {
  transects: Transect[];
  transectId: string;
  rules: ConditionsRules;
  seasons?: readonly FieldSeason[];
  visit?: LocalVisit;
  onSaved: (visitId: string, transectId: string) => void;
  onCancel?: () => void;
}) {
  const [saveError, setSaveError] = useState<string | null>(null);
  const today = todayLocal();
  const bounds = seasons ? fieldDateBounds(seasons, today) : null;
  const { register, handleSubmit, control, setError, formState: { errors, isSubmitting } } = useForm<StartVisitInput, unknown, StartVisitValues>({
    resolver: zodResolver(startVisitSchema),
    defaultValues: startingValues(transects, transectId, visit) as unknown as StartVisitInput,
  });
  const watched = useWatch({ control });
  const rain = rainValues.find((r) => r === watched.rain) ?? null;
  const warnings = conditionWarnings(rules, {
    temperatureC: watchedNumber(watched.temperatureC),
    windBeaufort: watchedNumber(watched.windBeaufort),
    sunshinePercent: watchedNumber(watched.sunshinePercent),
    rain,
    startTime: typeof watched.startTime === "string" ? watched.startTime : null,
  });
  const chosen = transects.find((t) => t.id === watched.transectId);

  const onSubmit = handleSubmit(async (values) => {
    setSaveError(null);
    const dateProblem = seasons ? fieldDateProblem(values.visitDate, seasons, today) : null;
    if (dateProblem) return setError("visitDate", { message: dateProblem }, { shouldFocus: true });
    const fields = {
      transectId: values.transectId,
      visitDate: values.visitDate,
      startTime: values.startTime,
      temperatureC: values.temperatureC,
      windBeaufort: values.windBeaufort,
      cloudCoverPercent: values.cloudCoverPercent,
      sky: values.sky,
      sunshinePercent: values.sunshinePercent,
      rain: values.rain,
      coRecorders: values.coRecorders,
    };
    try {
      if (visit && visit.endTime && visit.endTime < values.startTime) throw new Error(`The walk ended at ${visit.endTime}: the start time must be before that.`);
      const id = visit ? (await updateVisit(visit.id, fields), visit.id) : await createVisit(fields);
      onSaved(id, values.transectId);
    } catch (e) {
      setSaveError(e instanceof Error ? e.message : "The walk could not be saved on this phone.");
    }
  });

  const err = (name: keyof StartVisitInput) => errors[name] && <p className="field-error" id={`${name}-error`}>{String(errors[name]?.message)}</p>;

  return (
    <form onSubmit={onSubmit} noValidate className="space-y-4">
      {visit ? <h2 className="text-xl font-bold text-tideline-800">Correct the walk details</h2> : <h1 className="text-2xl font-bold text-tideline-800">Start a walk</h1>}
      {saveError && <p role="alert" className="font-bold text-rust-700">{saveError}</p>}
      {seasons && !bounds && <p role="alert" className="font-bold text-rust-700">{NO_SEASON_TAKES_WALKS}</p>}
      <div>
        <label htmlFor="transectId" className="field-label">Transect</label>
        <select id="transectId" className="field-input" {...register("transectId")}>
          {visit && !transects.some((t) => t.id === visit.transectId) && <option value="">Choose one of your transects</option>}
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
          <input
            id="visitDate"
            type="date"
            className="field-input"
            min={bounds?.min}
            max={bounds?.max}
            aria-describedby={bounds ? "visitDate-range" : undefined}
            aria-invalid={errors.visitDate ? true : undefined}
            {...register("visitDate")}
          />
          {bounds && <p id="visitDate-range" className="mt-1 text-sm text-shingle-600">{bounds.min} to {bounds.max}</p>}
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
        <div className="grid grid-cols-2 gap-3">
          <div>
            <label htmlFor="sunshinePercent" className="field-label">Sunshine (% of the walk)</label>
            <input id="sunshinePercent" type="number" inputMode="numeric" min={0} max={100} step={10} className="field-input" {...register("sunshinePercent")} />
            {err("sunshinePercent")}
          </div>
          <div>
            <label htmlFor="rain" className="field-label">Rain</label>
            <select id="rain" className="field-input" {...register("rain")}>
              <option value="">Not recorded</option>
              {rainValues.map((r) => (
                <option key={r} value={r}>{rainLabel[r]}</option>
              ))}
            </select>
            {err("rain")}
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
      {visit ? (
        <div className="grid grid-cols-2 gap-2">
          <button type="button" className="btn-quiet min-w-tap" onClick={onCancel} disabled={isSubmitting}>Back</button>
          <button type="submit" className="btn-primary min-w-tap" disabled={isSubmitting}>Save details</button>
        </div>
      ) : (
        <button type="submit" className="btn-primary min-w-tap w-full" disabled={isSubmitting}>Start recording</button>
      )}
    </form>
  );
}
