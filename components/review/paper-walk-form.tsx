"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useState } from "react";
import { useFieldArray, useForm, useWatch, type FieldErrors } from "react-hook-form";
import { paperWalkSchema, type PaperWalkInput, type PaperWalkValues } from "@/app/(review)/review/paper-walks/schema";
import { rainLabel, skyLabel } from "@/lib/field/visit-form";
import type { PaperWalkChoices } from "@/lib/queries/paper-walks";
import { rainValues, skyValues } from "@/lib/sync/protocol";
import { SpeciesAdder } from "./species-adder";

type FormShape = {
  volunteerId: string; transectId: string; visitDate: string; startTime: string; endTime: string;
  temperatureC: string; windBeaufort: string; cloudCoverPercent: string; sky: string; sunshinePercent: string; rain: string; completeList?: "yes" | "no"; notes: string;
  sightings: { speciesId: string; count: string; section: string }[];
};
const empty: FormShape = { volunteerId: "", transectId: "", visitDate: "", startTime: "", endTime: "", temperatureC: "", windBeaufort: "", cloudCoverPercent: "", sky: "", sunshinePercent: "", rain: "", notes: "", sightings: [] };

type Saved = { visitId: string; sightings: number; volunteer: string; date: string };
type ErrorAnswer = { error?: { message?: string; fields?: Record<string, string[]> } };

const messageOf = (errors: FieldErrors, path: string): string | undefined => {
  let node: unknown = errors;
  for (const key of path.split(".")) node = (node as Record<string, unknown> | undefined)?.[key];
  return (node as { message?: string } | undefined)?.message;
};

/** The paper walk form: the volunteer, the walk and its conditions, then each sighting. */
export function PaperWalkForm({ choices }: { choices: PaperWalkChoices }) {
  const [who, setWho] = useState("");
  const [saved, setSaved] = useState<Saved | null>(null);
  const [serverError, setServerError] = useState<string | null>(null);
  const { register, handleSubmit, control, reset, setError, formState: { errors, isSubmitting } } = useForm<PaperWalkInput, unknown, PaperWalkValues>({
    resolver: zodResolver(paperWalkSchema),
    defaultValues: empty as unknown as PaperWalkInput,
  });
  const lines = useFieldArray({ control, name: "sightings" as never });
  const volunteerId = useWatch({ control, name: "volunteerId" }) as string;
  const volunteer = choices.volunteers.find((v) => v.id === volunteerId);
  const theirs = choices.transects.filter((t) => volunteer?.transectIds.includes(t.id));
  const others = choices.transects.filter((t) => !volunteer?.transectIds.includes(t.id));
  const shownVolunteers = choices.volunteers.filter((v) => v.id === volunteerId || v.name.toLowerCase().includes(who.trim().toLowerCase()));
  const speciesName = new Map(choices.checklist.map((s) => [s.id, s.vernacularName]));
  const error = (path: string) => messageOf(errors as FieldErrors, path);

  const submit = async (values: PaperWalkValues) => {
    setServerError(null);
    setSaved(null);
    let response: Response;
    try {
      response = await fetch("/api/review/paper-walks", { method: "POST", headers: { "content-type": "application/json" }, body: JSON.stringify(values) });
    } catch {
      return setServerError("The server could not be reached. Nothing was saved; try again.");
    }
    const json = (await response.json().catch(() => null)) as ({ created?: { visitId: string; sightings: number } } & ErrorAnswer) | null;
    if (!response.ok || !json?.created) {
      for (const [field, messages] of Object.entries(json?.error?.fields ?? {})) setError(field as never, { message: messages[0] });
      return setServerError(json?.error?.message ?? `The server answered ${response.status}. Nothing was saved.`);
    }
    setSaved({ ...json.created, volunteer: volunteer?.name ?? "", date: values.visitDate });
    reset(empty as unknown as PaperWalkInput);
    setWho("");
  };

  const field = (name: keyof FormShape, label: string, props: React.InputHTMLAttributes<HTMLInputElement> = {}) => (
    <div>
      <label htmlFor={`pw-${name}`} className="field-label">{label}</label>
      <input id={`pw-${name}`} className="field-input" aria-invalid={Boolean(error(name))} {...props} {...register(name as never)} />
      {error(name) && <p className="field-error">{error(name)}</p>}
    </div>
  );

  return (
    <form className="space-y-4" noValidate onSubmit={handleSubmit(submit)}>
      {saved && <p role="status" className="card font-bold text-lichen-700">Saved the walk of {saved.volunteer} on {saved.date} with {saved.sightings} sightings, waiting for review.</p>}
      <fieldset className="card space-y-3">
        <legend className="font-bold">Who walked it</legend>
        <div>
          <label htmlFor="pw-who" className="field-label">Find the volunteer by name</label>
          <input id="pw-who" type="search" autoComplete="off" className="field-input" value={who} onChange={(e) => setWho(e.target.value)} />
        </div>
        <div>
          <label htmlFor="pw-volunteerId" className="field-label">Volunteer</label>
          <select id="pw-volunteerId" className="field-input" {...register("volunteerId")}>
            <option value="">Choose…</option>
            {shownVolunteers.map((v) => <option key={v.id} value={v.id}>{v.name}</option>)}
          </select>
          {error("volunteerId") && <p className="field-error">{error("volunteerId")}</p>}
        </div>
      </fieldset>
      <fieldset className="card grid gap-3 sm:grid-cols-2">
        <legend className="font-bold">The walk</legend>
        <div className="sm:col-span-2">
          <label htmlFor="pw-transectId" className="field-label">Transect</label>
          <select id="pw-transectId" className="field-input" {...register("transectId")}>
            <option value="">Choose…</option>
            {theirs.length > 0 && <optgroup label="Their transects">{theirs.map((t) => <option key={t.id} value={t.id}>{t.code} {t.name}</option>)}</optgroup>}
            <optgroup label={theirs.length ? "Other active transects" : "Active transects"}>{others.map((t) => <option key={t.id} value={t.id}>{t.code} {t.name}</option>)}</optgroup>
          </select>
          {error("transectId") && <p className="field-error">{error("transectId")}</p>}
        </div>
        {field("visitDate", "Date", { type: "date" })}
        {field("startTime", "Start time", { type: "time" })}
        {field("endTime", "End time (optional)", { type: "time" })}
        {field("temperatureC", "Temperature °C (optional)", { inputMode: "decimal" })}
        {field("windBeaufort", "Wind, Beaufort force (optional)", { inputMode: "numeric" })}
        {field("cloudCoverPercent", "Cloud cover % (optional)", { inputMode: "numeric" })}
        <div>
          <label htmlFor="pw-sky" className="field-label">Sky (optional)</label>
          <select id="pw-sky" className="field-input" {...register("sky")}>
            <option value="">Not noted</option>
            {skyValues.map((s) => <option key={s} value={s}>{skyLabel[s]}</option>)}
          </select>
        </div>
        {field("sunshinePercent", "Sunshine, % of the walk (optional)", { inputMode: "numeric" })}
        <div>
          <label htmlFor="pw-rain" className="field-label">Rain (optional)</label>
          <select id="pw-rain" className="field-input" {...register("rain")}>
            <option value="">Not noted</option>
            {rainValues.map((r) => <option key={r} value={r}>{rainLabel[r]}</option>)}
          </select>
          {error("rain") && <p className="field-error">{error("rain")}</p>}
        </div>
        <fieldset className="sm:col-span-2">
          <legend className="field-label">Did they write down every species they saw?</legend>
          <label className="mr-4 inline-flex min-h-tap items-center gap-2"><input type="radio" value="yes" className="h-5 w-5" {...register("completeList")} /> Yes, a complete list</label>
          <label className="inline-flex min-h-tap items-center gap-2"><input type="radio" value="no" className="h-5 w-5" {...register("completeList")} /> No, only some</label>
          {error("completeList") && <p className="field-error">{error("completeList")}</p>}
        </fieldset>
        <div className="sm:col-span-2">
          <label htmlFor="pw-notes" className="field-label">Notes (optional)</label>
          <textarea id="pw-notes" rows={2} className="field-input" {...register("notes")} />
          {error("notes") && <p className="field-error">{error("notes")}</p>}
        </div>
      </fieldset>
      <fieldset className="card space-y-3">
        <legend className="font-bold">Sightings ({lines.fields.length})</legend>
        {lines.fields.length === 0 && <p className="text-sm">None yet: a walk with nothing seen is saved as it is.</p>}
        <ul className="space-y-2">
          {lines.fields.map((line, i) => {
            const value = line as unknown as { id: string; speciesId: string };
            return (
              <li key={value.id} className="grid items-end gap-2 sm:grid-cols-[1fr_7rem_7rem_auto]" data-testid="paper-sighting">
                <p className="font-bold">{speciesName.get(value.speciesId) ?? "Unknown species"}{error(`sightings.${i}.speciesId`) && <span className="field-error block">{error(`sightings.${i}.speciesId`)}</span>}</p>
                <div>
                  <label htmlFor={`pw-count-${i}`} className="field-label">Count</label>
                  <input id={`pw-count-${i}`} inputMode="numeric" className="field-input" {...register(`sightings.${i}.count` as never)} />
                  {error(`sightings.${i}.count`) && <p className="field-error">{error(`sightings.${i}.count`)}</p>}
                </div>
                <div>
                  <label htmlFor={`pw-section-${i}`} className="field-label">Section</label>
                  <input id={`pw-section-${i}`} inputMode="numeric" className="field-input" {...register(`sightings.${i}.section` as never)} />
                  {error(`sightings.${i}.section`) && <p className="field-error">{error(`sightings.${i}.section`)}</p>}
                </div>
                <button type="button" className="btn-quiet" onClick={() => lines.remove(i)}>Remove</button>
              </li>
            );
          })}
        </ul>
        <SpeciesAdder checklist={choices.checklist} onAdd={(s) => lines.append({ speciesId: s.id, count: "1", section: "" } as never)} />
      </fieldset>
      {serverError && <p role="alert" className="font-bold text-rust-700">{serverError}</p>}
      <button type="submit" className="btn-primary" disabled={isSubmitting}>{isSubmitting ? "Saving…" : "Save the walk"}</button>
    </form>
  );
}
