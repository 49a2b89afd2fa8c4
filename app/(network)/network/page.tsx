import type { Metadata } from "next";
import Link from "next/link";
import { EffortAlerts, EffortGrid, EffortLegend } from "@/components/network/effort/effort-grid";
import { ProgressMap } from "@/components/network/effort/progress-map";
import { requirePageActor } from "@/lib/auth/guard";
import { roleLabel } from "@/lib/auth/roles";
import { env } from "@/lib/env";
import type { SeasonPhase } from "@/lib/seasons/rules";
import { networkHome } from "@/lib/queries/effort";
import { statusForReviewer } from "@/lib/review/words";

export const metadata: Metadata = { title: "Network overview" };

const PHASE_WORDS: Record<SeasonPhase, string> = {
  planning: "being planned",
  open: "open",
  grace: "closed, in its grace period for late walks and their review",
  frozen: "closed and frozen for analysis",
};

const LINKS = [
  { href: "/network/transects", label: "Transects" },
  { href: "/network/seasons", label: "Seasons" },
  { href: "/network/checklist", label: "Species checklist" },
  { href: "/network/people", label: "People" },
  { href: "/network/agreement", label: "Recorder agreement" },
  { href: "/network/earlier-seasons", label: "Earlier seasons" },
  { href: "/network/history", label: "History" },
  { href: "/review", label: "Review sightings" },
];

const n = (x: number) => x.toLocaleString("en-GB");

export default async function NetworkHome() {
  const actor = await requirePageActor(["organiser"], "/network");
  const { settings, byHabitat, people, seasons, effort } = await networkHome(actor);
  return (
    <div className="space-y-6">
      <h1 className="text-2xl font-bold text-tideline-800">{settings?.name ?? "Your network"}</h1>
      <nav aria-label="Running the network">
        <ul className="flex flex-wrap gap-2">
          {LINKS.map((l) => (
            <li key={l.href}>
              <Link href={l.href} className="btn-quiet">{l.label}</Link>
            </li>
          ))}
        </ul>
      </nav>

      {effort ? (
        <>
          <section aria-labelledby="effort-heading" className="space-y-3">
            <h2 id="effort-heading" className="text-xl font-bold">Effort week by week: {effort.season.name}</h2>
            <p className="text-shingle-700">
              The {effort.season.name} runs from {effort.season.startsOn} to {effort.season.endsOn} and is {PHASE_WORDS[effort.season.phase]}. Its target is{" "}
              {effort.season.targetVisits} walks per transect. A walk with nothing seen still counts as a walk.
            </p>
            <EffortLegend />
            <EffortGrid effort={effort} />
          </section>
          <EffortAlerts effort={effort} />
          <section aria-labelledby="map-heading" className="space-y-2">
            <h2 id="map-heading" className="text-xl font-bold">Walks against the target on the map</h2>
            <ProgressMap routes={effort.routes} target={effort.season.targetVisits} tileUrl={env().MAP_TILE_URL ?? null} />
          </section>
        </>
      ) : (
        <p className="card">
          There is no season yet. <Link href="/network/seasons" className="underline">Create the first season</Link> to see walks week by week.
        </p>
      )}

      <section aria-labelledby="seasons-heading">
        <h2 id="seasons-heading" className="mb-3 text-xl font-bold">Seasons</h2>
        <ul className="grid gap-3 sm:grid-cols-2">
          {seasons.map((s) => (
            <li key={s.id} className="card">
              <h3 className="font-bold">{s.name} <span className="text-sm font-normal text-shingle-600">({s.status})</span></h3>
              <p className="text-sm text-shingle-600">{s.startsOn} to {s.endsOn}</p>
              <p className="mt-2">{n(s.walks)} walks · {n(s.pending + s.queried + s.accepted + s.rejected)} sightings</p>
              <p>
                {statusForReviewer.accepted}: <strong>{n(s.accepted)}</strong> · {statusForReviewer.pending}: <strong>{n(s.pending)}</strong> · {statusForReviewer.queried}: <strong>{n(s.queried)}</strong>
              </p>
            </li>
          ))}
        </ul>
      </section>
      <div className="grid gap-6 sm:grid-cols-2">
        <section aria-labelledby="habitat-heading" className="card">
          <h2 id="habitat-heading" className="mb-2 text-xl font-bold">Transects by habitat group</h2>
          <ul>
            {byHabitat.map((h) => (
              <li key={h.code} className="flex justify-between border-b border-shingle-100 py-1">
                <span>{h.name}</span>
                <strong>{h.transects}</strong>
              </li>
            ))}
          </ul>
        </section>
        <section aria-labelledby="people-heading" className="card">
          <h2 id="people-heading" className="mb-2 text-xl font-bold">People</h2>
          <ul>
            {people.map((p) => (
              <li key={p.role} className="flex justify-between border-b border-shingle-100 py-1">
                <span>{roleLabel[p.role]}</span>
                <strong>{p.n}</strong>
              </li>
            ))}
          </ul>
        </section>
      </div>
    </div>
  );
}
