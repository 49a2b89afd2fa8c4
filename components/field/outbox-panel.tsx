"use client";

import { useEffect, useState, useSyncExternalStore } from "react";
import { belongsTo, phoneStore, type KeptOnServer, type OutboxState } from "@/lib/offline/phone-store";
import { onSyncState, syncNow } from "@/lib/offline/sync-controller";
import { withdrawWeatherMiss } from "@/lib/offline/weather";
import { REVIEWER } from "@/lib/review/words";
import { useFieldUserId } from "./field-providers";
import { useLive } from "./use-live";

// The sending code loads on demand (see lib/offline/sync-controller.ts); these rare actions fetch it too.
const removeRefusedPhoto = async (photoId: string) => (await import("@/lib/offline/photo-upload")).removeRefusedPhoto(photoId);
const acknowledgeKeptOnServer = async (visitId: string) => (await import("@/lib/offline/outbox")).acknowledgeKeptOnServer(visitId);

const stateLabel: Record<OutboxState, string> = {
  "on-phone": "On this phone",
  sending: "Sending",
  sent: "Sent",
  "needs-attention": "Needs attention",
};

const plural = (n: number, one: string) => `${n} ${one}${n === 1 ? "" : "s"}`;

/** Our words for a `kept-server` answer: sent, but the phone's later edit was not applied. */
export function keptOnServerNote(kept: KeptOnServer): string {
  const what = [kept.visit ? "the walk details" : null, kept.sightings ? plural(kept.sightings, "sighting") : null].filter(Boolean).join(" and ");
  return `Sent, but your later changes to ${what} were not applied: a ${REVIEWER} had already reviewed it, or a newer change had arrived first. What Turnstone had stays as it was.`;
}

function subscribeToConnectivity(changed: () => void): () => void {
  window.addEventListener("online", changed);
  window.addEventListener("offline", changed);
  return () => {
    window.removeEventListener("online", changed);
    window.removeEventListener("offline", changed);
  };
}

const clock = (at: number) => new Date(at).toLocaleTimeString([], { hour: "2-digit", minute: "2-digit" });

/** What is waiting to leave the phone, what went, and what needs the volunteer. */
export function OutboxPanel() {
  const userId = useFieldUserId();
  const [syncing, setSyncing] = useState(false);
  const [nextRetryAt, setNextRetryAt] = useState<number | null>(null);
  // Rendered on the server as online; the browser's own answer replaces it once hydrated.
  const online = useSyncExternalStore(subscribeToConnectivity, () => navigator.onLine, () => true);
  useEffect(
    () =>
      onSyncState((s) => {
        setSyncing(s.running);
        setNextRetryAt(s.nextRetryAt);
      }),
    [],
  );
  const items = useLive(async () => {
    const db = phoneStore();
    // Only this volunteer's items: a shared phone may hold someone else's too.
    const visits = (await db.visits.where("phase").equals("submitted").toArray())
      .filter((v) => belongsTo(v, userId))
      .sort((a, b) => b.visitDate.localeCompare(a.visitDate));
    const ids = visits.map((v) => v.id);
    const [sightings, photos, weather] = await Promise.all([
      db.sightings.where("visitId").anyOf(ids).toArray(),
      db.photos.where("visitId").anyOf(ids).toArray(),
      userId ? db.weatherMisses.where("ownerId").equals(userId).toArray() : [],
    ]);
    return { visits, sightings, photos, weather };
  }, [userId]);

  const all = items ? [...items.visits, ...items.sightings, ...items.photos, ...items.weather] : [];
  const count = (state: OutboxState) => all.filter((i) => i.outbox === state).length;
  const waiting = count("on-phone") + count("sending");
  const visitDate = (visitId: string) => items?.visits.find((v) => v.id === visitId)?.visitDate ?? "";
  const refusedPhotos = items?.photos.filter((p) => p.outbox === "needs-attention") ?? [];
  const refusedWeather = items?.weather.filter((w) => w.outbox === "needs-attention") ?? [];
  const keptNotes = items?.visits.filter((v) => v.keptOnServer && (v.keptOnServer.visit || v.keptOnServer.sightings > 0)) ?? [];

  return (
    <section aria-labelledby="outbox-heading" className="card" data-testid="outbox">
      <div className="flex items-center justify-between gap-2">
        <h2 id="outbox-heading" className="text-lg font-bold">Sending from this phone</h2>
        <span className={`rounded-full px-3 py-1 text-sm font-bold ${online ? "bg-lichen-100 text-lichen-700" : "bg-sand-100 text-sand-800"}`}>
          {online ? "Online" : "No signal"}
        </span>
      </div>
      <p className="mt-1" data-testid="outbox-summary">
        {waiting === 0 && count("needs-attention") === 0 ? "Everything is sent." : `${waiting} waiting to send.`}
        {syncing && " Sending now…"}
        {!syncing && waiting > 0 && nextRetryAt && ` Trying again at ${clock(nextRetryAt)}.`}
      </p>
      <dl className="mt-2 grid grid-cols-2 gap-2 text-sm sm:grid-cols-4">
        {(Object.keys(stateLabel) as OutboxState[]).map((s) => (
          <div key={s} className="rounded-lg bg-shingle-50 p-2">
            <dt className="text-shingle-600">{stateLabel[s]}</dt>
            <dd className="text-xl font-bold" data-testid={`outbox-${s}`}>{count(s)}</dd>
          </div>
        ))}
      </dl>
      {items?.visits.some((v) => v.attention) && (
        <ul className="mt-3 space-y-2">
          {items.visits
            .filter((v) => v.attention)
            .map((v) => (
              <li key={v.id} className="rounded-lg border border-rust-700 bg-rust-100 p-2 text-sm text-rust-700">
                Walk on {v.visitDate}: {v.attention}{" "}
                {v.outbox === "needs-attention" && (
                  <a className="inline-flex min-h-tap min-w-tap items-center font-bold underline" href={`/field/visit?id=${v.id}&transect=${v.transectId}`}>Open it</a>
                )}
              </li>
            ))}
        </ul>
      )}
      {refusedPhotos.length > 0 && (
        <ul className="mt-3 space-y-2" aria-label="Photos Turnstone refused">
          {refusedPhotos.map((p) => (
            <li key={p.id} className="rounded-lg border border-rust-700 bg-rust-100 p-2 text-sm text-rust-700" data-testid="refused-photo">
              Photo from the walk on {visitDate(p.visitId)}: {p.attention} It cannot be sent.{" "}
              <button
                type="button"
                className="font-bold underline"
                onClick={() => {
                  if (window.confirm("Remove this photo from this phone? Turnstone will not take it.")) void removeRefusedPhoto(p.id);
                }}
              >
                Remove it from this phone
              </button>
            </li>
          ))}
        </ul>
      )}
      {refusedWeather.length > 0 && (
        <ul className="mt-3 space-y-2" aria-label="Weather reports Turnstone refused">
          {refusedWeather.map((w) => (
            <li key={w.id} className="rounded-lg border border-rust-700 bg-rust-100 p-2 text-sm text-rust-700" data-testid="refused-weather">
              Weather report for the week of {w.weekStart}: {w.attention}{" "}
              <button type="button" className="inline-flex min-h-tap items-center font-bold underline" onClick={() => void withdrawWeatherMiss(w.id)}>
                Remove it from this phone
              </button>
            </li>
          ))}
        </ul>
      )}
      {keptNotes.length > 0 && (
        <ul className="mt-3 space-y-2" aria-label="Notes about sent walks">
          {keptNotes.map((v) => (
            <li key={v.id} role="note" className="rounded-lg border border-tideline-600 bg-tideline-50 p-2 text-sm" data-testid="kept-on-server">
              Walk on {v.visitDate}: {keptOnServerNote(v.keptOnServer!)}{" "}
              <button type="button" className="font-bold underline" onClick={() => void acknowledgeKeptOnServer(v.id)}>
                Got it
              </button>
            </li>
          ))}
        </ul>
      )}
      <button type="button" className="btn-quiet mt-3 w-full" onClick={() => void syncNow()} disabled={!online || syncing}>
        Send now
      </button>
    </section>
  );
}
