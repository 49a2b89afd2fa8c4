import type { Metadata } from "next";
import { SafetyNotice } from "@/components/safety/safety-notice";
import { requirePageActor } from "@/lib/auth/guard";
import { assignedTransects } from "@/lib/queries/field";

export const metadata: Metadata = { title: "My transects" };

export default async function FieldHome() {
  const actor = await requirePageActor(["volunteer"], "/field");
  const { season, transects } = await assignedTransects(actor);
  return (
    <div className="space-y-6">
      <div>
        <h1 className="text-2xl font-bold text-tideline-800">Hello, {actor.name.split(" ")[0]}</h1>
        {season && <p className="text-shingle-600">{season.name}: {season.startsOn} to {season.endsOn}</p>}
      </div>
      <section aria-labelledby="my-transects">
        <h2 id="my-transects" className="mb-3 text-xl font-bold">My transects</h2>
        {transects.length === 0 ? (
          <p className="card">You have no transects yet. Your network organiser assigns them.</p>
        ) : (
          <ul className="space-y-3">
            {transects.map((t) => (
              <li key={t.id} className="card" data-testid="assigned-transect">
                <div className="flex items-baseline justify-between gap-2">
                  <h3 className="text-lg font-bold">
                    <span className="mr-2 rounded bg-tideline-100 px-2 py-0.5 font-mono text-tideline-800">{t.code}</span>
                    {t.name}
                  </h3>
                </div>
                <p className="mt-1 text-shingle-600">
                  {t.habitat} · {t.sectionCount} sections · {(t.lengthMetres / 1000).toFixed(1)} km
                  {t.coastal && " · coastal: check the tides"}
                </p>
                <p className="mt-1">
                  Last visit: <strong>{t.lastVisit ?? "none yet"}</strong>
                  {season && (
                    <>
                      {" "}· This season: <strong>{t.visitsThisSeason}</strong> of {season.targetVisits} visits
                    </>
                  )}
                </p>
              </li>
            ))}
          </ul>
        )}
      </section>
      <SafetyNotice compact />
    </div>
  );
}
