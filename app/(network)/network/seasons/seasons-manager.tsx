"use client";

import { useQuery } from "@tanstack/react-query";
import Link from "next/link";
import { useState } from "react";
import { api, type SeasonRow, seasonKeys, type SeasonsOverview } from "./api";
import { GraceForm } from "./grace-form";
import { phaseHelp, phaseLabel } from "./phase-text";
import { SeasonForm } from "./season-form";
import { SeasonMoves } from "./season-moves";

function SeasonCard({ season, graceDays, others }: { season: SeasonRow; graceDays: number; others: SeasonRow[] }) {
  const [editing, setEditing] = useState(false);
  const headingId = `season-${season.id}-heading`;
  return (
    <li className="card space-y-2" aria-labelledby={headingId}>
      <div className="flex flex-wrap items-baseline justify-between gap-2">
        <h3 id={headingId} className="text-lg font-bold">{season.name}</h3>
        <p className="font-bold text-tideline-800">{phaseLabel(season)}</p>
      </div>
      <p className="text-shingle-700">{season.startsOn} to {season.endsOn} · target {season.targetVisits} walks per transect, at least {season.minVisits} to be compared · {season.walks} walk{season.walks === 1 ? "" : "s"} so far</p>
      <p className="text-sm text-shingle-700">{phaseHelp(season)}</p>
      {editing ? (
        <SeasonForm season={season} onDone={() => setEditing(false)} />
      ) : (
        <div className="flex flex-wrap gap-2">
          <button type="button" className="btn-quiet" onClick={() => setEditing(true)}>Edit {season.name}</button>
          <SeasonMoves season={season} graceDays={graceDays} anotherOpen={others.find((o) => o.id !== season.id && o.status === "open")} />
        </div>
      )}
    </li>
  );
}

/** The seasons page: every season with its phase, a new one, and the grace period after closing. */
export function SeasonsManager() {
  const overview = useQuery({ queryKey: seasonKeys.overview, queryFn: () => api<SeasonsOverview>("/api/network/seasons") });
  const seasons = overview.data?.seasons ?? [];
  const graceDays = overview.data?.graceDays ?? 0;
  return (
    <div className="space-y-6">
      <div className="flex flex-wrap items-center justify-between gap-3">
        <h1 className="text-2xl font-bold text-tideline-800">Seasons</h1>
        <Link href="/network/history?entity=season" className="btn-quiet">History</Link>
      </div>
      <p className="text-shingle-700">
        A season is planned, then opened for walks, then closed. After closing, late walks and their review are still taken for the grace period; then the season is frozen so its comparisons stay put. Seasons never share a day.
      </p>
      {overview.error && <p role="alert" className="card font-bold text-rust-700">{overview.error.message}</p>}
      {overview.isPending ? (
        <p className="card">Loading…</p>
      ) : seasons.length === 0 ? (
        <p className="card">No seasons yet. Create the first one below.</p>
      ) : (
        <ul className="space-y-3" aria-label="Seasons, newest first">
          {seasons.map((s) => <SeasonCard key={`${s.id}-${s.status}-${s.name}-${s.startsOn}-${s.endsOn}-${s.targetVisits}-${s.minVisits}`} season={s} graceDays={graceDays} others={seasons} />)}
        </ul>
      )}
      <section aria-labelledby="new-season-heading" className="card space-y-3">
        <h2 id="new-season-heading" className="text-xl font-bold">New season</h2>
        <SeasonForm />
      </section>
      {overview.data && (
        <section aria-labelledby="grace-heading" className="card space-y-3">
          <h2 id="grace-heading" className="text-xl font-bold">Grace period after closing</h2>
          <GraceForm graceDays={graceDays} />
        </section>
      )}
    </div>
  );
}
