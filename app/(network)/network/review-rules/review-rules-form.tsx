"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useMutation } from "@tanstack/react-query";
import { useForm, type FieldPath } from "react-hook-form";
import { ApiError, api } from "@/components/network/api";
import { beaufortScale } from "@/lib/field/beaufort";
import { DEFAULT_WALK_RULES } from "@/lib/review/walk-rules";
import { DEFAULT_WARNING_RULES } from "@/lib/review/warning-rules";
import { reviewRulesSchema, type ReviewRulesInput, type ReviewRulesValues } from "@/app/(network)/api/network/settings/review-rules/schema";

type Saved = ReviewRulesValues & { walksRejudged: number; sightingsRejudged: number };
type Path = FieldPath<ReviewRulesInput>;

// An empty number box is "no number", which the schema refuses with its message.
const asNumber = { setValueAs: (v: unknown) => (v === "" || v == null ? Number.NaN : Number(v)) };

/** The walk rules and the sightings' warning thresholds, checked here and on the server with one schema. */
export function ReviewRulesForm({ rules }: { rules: ReviewRulesValues }) {
  const { register, handleSubmit, reset, setError, formState: { errors, isDirty } } = useForm<ReviewRulesInput, unknown, ReviewRulesValues>({
    resolver: zodResolver(reviewRulesSchema),
    defaultValues: rules,
  });
  const save = useMutation({
    mutationFn: (values: ReviewRulesValues) => api<Saved>("/api/network/settings/review-rules", { method: "PUT", body: values }),
    onSuccess: (saved) => reset({ walkRules: saved.walkRules, warningRules: saved.warningRules }),
    onError: (error) => {
      if (error instanceof ApiError) for (const [path, messages] of Object.entries(error.fields)) setError(path as Path, { message: messages[0] });
    },
  });
  const fieldsRefused = save.error instanceof ApiError && Object.keys(save.error.fields).length > 0;

  const messageOf = (path: Path): string | undefined => {
    const [group, name] = path.split(".") as ["walkRules" | "warningRules", string];
    return (errors[group] as Record<string, { message?: string } | undefined> | undefined)?.[name]?.message;
  };
  const idOf = (path: Path) => `rr-${path.replace(".", "-")}`;
  const described = (path: Path, hint: boolean) => [hint ? `${idOf(path)}-hint` : null, messageOf(path) ? `${idOf(path)}-error` : null].filter(Boolean).join(" ") || undefined;
  const numberField = (path: Path, label: string, hint: string | null, props: React.InputHTMLAttributes<HTMLInputElement>) => (
    <div>
      <label htmlFor={idOf(path)} className="field-label">{label}</label>
      <input id={idOf(path)} type="number" className="field-input" aria-invalid={messageOf(path) ? true : undefined} aria-describedby={described(path, Boolean(hint))} {...props} {...register(path, asNumber)} />
      {hint && <p id={`${idOf(path)}-hint`} className="mt-1 text-sm text-shingle-700">{hint}</p>}
      {messageOf(path) && <p id={`${idOf(path)}-error`} className="field-error">{messageOf(path)}</p>}
    </div>
  );

  return (
    <form noValidate onSubmit={handleSubmit((v) => save.mutate(v))} className="space-y-6">
      <section className="card space-y-4" aria-labelledby="walk-rules-heading">
        <h2 id="walk-rules-heading" className="text-xl font-bold">Walk rules</h2>
        <p className="max-w-prose">
          The conditions a walk should be made in. A walk outside them is still recorded and still counts as a walk made: the volunteer
          is warned on the phone, reviewers see the walk marked, and each analysis can choose whether to use marked walks. Its sightings
          are confirmed or not on their own merits.
        </p>

        <fieldset className="space-y-3">
          <legend className="font-bold">Time of day</legend>
          <p className="max-w-prose text-sm text-shingle-700">
            The whole walk, start to end, inside this window of local time. A walk without an end time is judged on its start.
          </p>
          <div className="grid max-w-md grid-cols-2 gap-3">
            <div>
              <label htmlFor={idOf("walkRules.windowStart")} className="field-label">Start no earlier than</label>
              <input id={idOf("walkRules.windowStart")} type="time" className="field-input" aria-invalid={messageOf("walkRules.windowStart") ? true : undefined} {...register("walkRules.windowStart")} />
              {messageOf("walkRules.windowStart") && <p className="field-error">{messageOf("walkRules.windowStart")}</p>}
            </div>
            <div>
              <label htmlFor={idOf("walkRules.windowEnd")} className="field-label">End no later than</label>
              <input id={idOf("walkRules.windowEnd")} type="time" className="field-input" aria-invalid={messageOf("walkRules.windowEnd") ? true : undefined} {...register("walkRules.windowEnd")} />
              {messageOf("walkRules.windowEnd") && <p className="field-error">{messageOf("walkRules.windowEnd")}</p>}
            </div>
          </div>
        </fieldset>

        <fieldset className="space-y-3">
          <legend className="font-bold">Temperature and sunshine</legend>
          <p className="max-w-prose text-sm text-shingle-700">
            Below the lowest temperature a walk is outside the rules whatever the sun. From there up to the warm threshold it needs at
            least the share of sunshine below; at or above the warm threshold any sunshine will do. A walk recorded without its
            sunshine (older phones do not ask) is judged on the lowest temperature only.
          </p>
          <div className="grid max-w-2xl gap-3 sm:grid-cols-3">
            {numberField("walkRules.coolMinimumC", "Lowest temperature (°C)", null, { step: 0.5, inputMode: "decimal" })}
            {numberField("walkRules.coolSunshinePercent", "Sunshine needed below the warm threshold (% of the walk)", "0 to 100", { step: 5, min: 0, max: 100, inputMode: "numeric" })}
            {numberField("walkRules.warmEnoughC", "Warm enough for any sun (°C)", "At least the lowest temperature", { step: 0.5, inputMode: "decimal" })}
          </div>
        </fieldset>

        <fieldset className="space-y-3">
          <legend className="font-bold">Wind and rain</legend>
          <div className="max-w-md">
            <label htmlFor={idOf("walkRules.maxWindBeaufort")} className="field-label">Strongest wind (Beaufort force)</label>
            <select id={idOf("walkRules.maxWindBeaufort")} className="field-input" aria-invalid={messageOf("walkRules.maxWindBeaufort") ? true : undefined} {...register("walkRules.maxWindBeaufort", asNumber)}>
              {beaufortScale.map((b) => (
                <option key={b.force} value={b.force}>{b.force}: {b.name}</option>
              ))}
            </select>
            <p className="mt-1 text-sm text-shingle-700">A walk in stronger wind than this is outside the rules.</p>
            {messageOf("walkRules.maxWindBeaufort") && <p className="field-error">{messageOf("walkRules.maxWindBeaufort")}</p>}
          </div>
          <label className="flex min-h-tap items-center gap-2">
            <input type="checkbox" className="h-5 w-5" {...register("walkRules.rainAllowed")} />
            Walks in rain (light or heavy) are inside the rules
          </label>
        </fieldset>
      </section>

      <section className="card space-y-4" aria-labelledby="warnings-heading">
        <h2 id="warnings-heading" className="text-xl font-bold">Warnings on sightings</h2>
        <p className="max-w-prose">
          Reviewers see these warnings beside a sighting and can list the sightings that have one. A warning never refuses a sighting:
          it says what to look at. &ldquo;Earlier&rdquo; means seasons that started before the sighting&apos;s own, and only confirmed
          sightings count. Two warnings have no number to set: a species outside its usual months (from the checklist) and a sensitive
          species without a photo.
        </p>
        <fieldset className="space-y-3">
          <legend className="font-bold">Far above earlier counts</legend>
          <p className="max-w-prose text-sm text-shingle-700">
            A count more than this many times the species&apos; highest count on the transect in earlier seasons, and at least the
            smallest count below. Each entry is judged as entered, not a tally&apos;s sum.
          </p>
          <div className="grid max-w-md grid-cols-2 gap-3">
            {numberField("warningRules.countFactor", "Times the earlier highest", "1 to 100", { step: 0.5, min: 1, max: 100, inputMode: "decimal" })}
            {numberField("warningRules.countMinimum", "Smallest count warned of", "A whole number, at least 1", { step: 1, min: 1, inputMode: "numeric" })}
          </div>
        </fieldset>
        <fieldset className="space-y-3">
          <legend className="font-bold">First on this transect</legend>
          <p className="max-w-prose text-sm text-shingle-700">
            A species never confirmed on the transect before, warned of only once the transect has this many earlier seasons of
            confirmed sightings: a new transect would otherwise flag everything.
          </p>
          <div className="max-w-xs">
            {numberField("warningRules.firstRecordMinSeasons", "Earlier seasons needed", "1 to 50", { step: 1, min: 1, max: 50, inputMode: "numeric" })}
          </div>
        </fieldset>
      </section>

      <p className="max-w-prose text-sm text-shingle-700">
        Saving judges every stored walk and sighting again by the new numbers, and the change is kept in the history.
      </p>
      {save.isError && !fieldsRefused && <p role="alert" className="font-bold text-rust-700">{save.error.message}</p>}
      {fieldsRefused && <p role="alert" className="font-bold text-rust-700">Nothing was saved: correct the marked fields.</p>}
      {save.isSuccess && !isDirty && (
        <p role="status" className="font-bold text-lichen-700">
          Saved. {save.data.walksRejudged} walks and {save.data.sightingsRejudged} sightings are marked differently now.
        </p>
      )}
      <div className="flex flex-wrap gap-3">
        <button type="submit" className="btn-primary" disabled={save.isPending || !isDirty}>Save the rules</button>
        <button
          type="button"
          className="btn-quiet"
          disabled={save.isPending}
          onClick={() => reset({ walkRules: DEFAULT_WALK_RULES, warningRules: DEFAULT_WARNING_RULES }, { keepDefaultValues: true })}
        >
          Fill in the starting values
        </button>
      </div>
    </form>
  );
}
