"use client";

import { SafetyNotice } from "@/components/safety/safety-notice";
import { OfflineReadiness } from "./offline-readiness";
import { belongsTo, phoneStore } from "@/lib/offline/phone-store";
import type { FieldReference } from "@/lib/offline/reference";
import { useFieldUserId } from "./field-providers";
import { OutboxPanel } from "./outbox-panel";
import { UnownedWalks } from "./unowned-walks";
import { WeatherReport } from "./weather-report";
import { useLive } from "./use-live";
import { useFieldReference } from "./use-reference";

/**
 * The volunteer's home: their transects (each with its one-tap weather report), walks this phone holds without a known owner, drafts in
 * progress, the outbox, the safety notice.
 */
export function FieldHome({ firstName, initial }: { firstName: string; initial?: FieldReference }) {
  const reference = useFieldReference(initial);
  const userId = useFieldUserId();
  const local = useLive(async () => {
    // Only the signed-in volunteer's visits: a shared phone may hold someone else's too.
    const visits = (await phoneStore().visits.toArray()).filter((v) => belongsTo(v, userId));
    return {
      drafts: visits.filter((v) => v.phase === "draft").sort((a, b) => b.updatedAt.localeCompare(a.updatedAt)),
      unsentByTransect: visits.filter((v) => v.phase === "submitted" && v.outbox !== "sent"),
    };
  }, [userId]);
  const data = reference.data;
  const season = data?.season;

  return (
    <div className="space-y-6">
      <div>
        <h1 className="text-2xl font-bold text-tideline-800">Hello, {firstName}</h1>
        {season && <p className="text-shingle-600">{season.name}: {season.startsOn} to {season.endsOn}</p>}
        {reference.offlineCopy && <p className="text-sm text-sand-800">No signal: showing the copy saved on this phone.</p>}
        <OfflineReadiness hasReference={Boolean(data)} />
      </div>

      <section aria-labelledby="my-transects">
        <h2 id="my-transects" className="mb-3 text-xl font-bold">My transects</h2>
        {reference.loading && <p>Loading your transects…</p>}
        {reference.error && <p className="card text-rust-700">{reference.error}</p>}
        {data && data.transects.length === 0 && <p className="card">You have no transects yet. Your network organiser assigns them.</p>}
        <ul className="space-y-3">
          {data?.transects.map((t) => {
            const unsent = local?.unsentByTransect.filter((v) => v.transectId === t.id).length ?? 0;
            return (
              <li key={t.id} className="card" data-testid="assigned-transect">
                <h3 className="text-lg font-bold">
                  <span className="mr-2 rounded bg-tideline-100 px-2 py-0.5 font-mono text-tideline-800">{t.code}</span>
                  {t.name}
                </h3>
                <p className="mt-1 text-shingle-600">
                  {t.habitat} · {t.sectionCount} sections · {(t.lengthMetres / 1000).toFixed(1)} km
                </p>
                {t.accessNotes && <p className="mt-1 text-sm text-sand-800">{t.accessNotes}</p>}
                <p className="mt-1">
                  Last walk: <strong>{t.lastVisit ?? "none yet"}</strong>
                  {season && (
                    <>
                      {" "}· This season: <strong>{t.visitsThisSeason + unsent}</strong> of {season.targetVisits} walks
                    </>
                  )}
                </p>
                <a className="btn-primary mt-3 min-w-tap w-full" href={`/field/visit?transect=${t.id}`}>Start a walk</a>
                <WeatherReport transectId={t.id} transectCode={t.code} seasons={data.seasons} />
              </li>
            );
          })}
        </ul>
      </section>

      <UnownedWalks transects={data?.transects ?? []} />

      {local && local.drafts.length > 0 && (
        <section aria-labelledby="drafts-heading" className="card border-tideline-600">
          <h2 id="drafts-heading" className="text-lg font-bold">Walks in progress</h2>
          <ul className="mt-2 space-y-2">
            {local.drafts.map((d) => {
              const t = data?.transects.find((x) => x.id === d.transectId);
              return (
                <li key={d.id}>
                  <a className="btn-quiet min-w-tap w-full justify-between" href={`/field/visit?id=${d.id}&transect=${d.transectId}`}>
                    <span>{t ? `${t.code} ${t.name}` : "Transect"} · {d.visitDate}</span>
                    <span aria-hidden>›</span>
                  </a>
                </li>
              );
            })}
          </ul>
        </section>
      )}

      <OutboxPanel />
      <p>
        <a className="btn-quiet min-w-tap w-full" href="/field/records">My walks and questions</a>
      </p>
      <SafetyNotice compact />
    </div>
  );
}
