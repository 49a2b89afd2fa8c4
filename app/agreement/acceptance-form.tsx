"use client";

import { useState, useTransition } from "react";
import { acceptAgreementAction } from "./actions";

type Answers = { publishName: boolean; newsletter: boolean };

function Choice({ name, legend, options, value, onChange, error }: { name: string; legend: string; options: [boolean, string][]; value: boolean | null; onChange: (v: boolean) => void; error?: string }) {
  return (
    <fieldset className="mb-4" aria-describedby={error ? `${name}-error` : undefined}>
      <legend className="mb-1 font-bold">{legend}</legend>
      {options.map(([v, label]) => (
        <label key={String(v)} className="flex min-h-tap items-center gap-3 rounded-lg border border-shingle-200 px-3 py-2 mb-2">
          <input type="radio" name={name} className="h-6 w-6" checked={value === v} onChange={() => onChange(v)} required />
          {label}
        </label>
      ))}
      {error && <p id={`${name}-error`} className="field-error">{error}</p>}
    </fieldset>
  );
}

/** The recorder's two answers: nothing is chosen for a first acceptance (consent is never assumed). */
export function AcceptanceForm({ version, previous }: { version: number; previous: Answers | null }) {
  const [publishName, setPublishName] = useState<boolean | null>(previous?.publishName ?? null);
  const [newsletter, setNewsletter] = useState<boolean | null>(previous?.newsletter ?? null);
  const [errors, setErrors] = useState<Record<string, string>>({});
  const [message, setMessage] = useState<string | null>(null);
  const [pending, startTransition] = useTransition();

  const submit = (event: React.FormEvent) => {
    event.preventDefault();
    const missing: Record<string, string> = {};
    if (publishName === null) missing.publishName = "Choose how published data shows you.";
    if (newsletter === null) missing.newsletter = "Say whether you want the newsletter.";
    setErrors(missing);
    if (publishName === null || newsletter === null) return;
    startTransition(async () => {
      const result = await acceptAgreementAction({ version, publishName, newsletter });
      if (result.ok) {
        // A document load: the field pages come from the service worker's cache when offline.
        window.location.assign("/field"); // eslint-disable-line @next/next/no-location-assign-relative-destination -- field pages must be document loads the service worker can answer offline
        return;
      }
      setErrors(Object.fromEntries(Object.entries(result.fieldErrors ?? {}).map(([k, v]) => [k, v[0] ?? ""])));
      setMessage(result.message);
    });
  };

  return (
    <form onSubmit={submit} noValidate>
      <Choice
        name="publishName"
        legend="In data the network publishes, show my sightings"
        options={[[true, "under my name"], [false, "under my pseudonym, without my name"]]}
        value={publishName}
        onChange={setPublishName}
        error={errors.publishName}
      />
      <Choice
        name="newsletter"
        legend="The network's newsletter by e-mail"
        options={[[true, "Yes, send it to me"], [false, "No, thank you"]]}
        value={newsletter}
        onChange={setNewsletter}
        error={errors.newsletter}
      />
      <button type="submit" className="btn-primary w-full" disabled={pending}>{pending ? "Saving…" : "I accept the agreement"}</button>
      {message && <p role="alert" className="mt-3 font-bold text-rust-700">{message}</p>}
    </form>
  );
}
