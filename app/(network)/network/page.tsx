import type { Metadata } from "next";
import { requirePageActor } from "@/lib/auth/guard";
import { roleLabel } from "@/lib/auth/roles";
import { networkOverview } from "@/lib/queries/network";

export const metadata: Metadata = { title: "Network overview" };

export default async function NetworkHome() {
  await requirePageActor(["organiser"], "/network");
  const { settings, byHabitat, people, bySeason } = await networkOverview();
  return (
    <div className="space-y-6">
      <h1 className="text-2xl font-bold text-tideline-800">{settings?.name ?? "Your network"}</h1>
      <section aria-labelledby="seasons-heading">
        <h2 id="seasons-heading" className="mb-3 text-xl font-bold">Seasons</h2>
        <ul className="grid gap-3 sm:grid-cols-2">
          {bySeason.map((s) => (
            <li key={s.id} className="card">
              <h3 className="font-bold">{s.name} <span className="text-sm font-normal text-shingle-600">({s.status})</span></h3>
              <p className="text-sm text-shingle-600">{s.startsOn} to {s.endsOn}</p>
              <p className="mt-2">{s.visits} visits · {s.sightings} records</p>
              <p>
                <strong>{s.accepted}</strong> accepted · <strong>{s.pending}</strong> waiting for a checker
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
