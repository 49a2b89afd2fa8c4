"use client";

import { useQuery } from "@tanstack/react-query";
import Link from "next/link";
import type { TransectDetail } from "@/lib/queries/transects";
import { api, queryKeys } from "../api";
import { dayOf, distance, plural } from "../format";
import { HabitatSwatch } from "../habitat-swatch";
import { DetailsForm } from "./details-form";
import { RetirePanel } from "./retire-panel";
import { RouteChange } from "./route-change";

/** One transect: its details, its route and sections (changed as dated versions), retiring it, and its history. */
export function TransectEditor({ id, tileUrl }: { id: string; tileUrl: string | null }) {
  const { data, error, isPending } = useQuery({ queryKey: queryKeys.transect(id), queryFn: async () => (await api<{ transect: TransectDetail }>(`/api/network/transects/${id}`)).transect });

  if (isPending) return <p className="card">Loading the transect…</p>;
  if (error || !data) return <p role="alert" className="card font-bold text-rust-700">The transect could not be loaded: {error?.message ?? "not found"}.</p>;

  return (
    <div className="space-y-6">
      <div className="flex flex-wrap items-center justify-between gap-3">
        <div>
          <h1 className="text-2xl font-bold text-tideline-800">
            {data.code} {data.name}
          </h1>
          <p className="text-shingle-700">
            <HabitatSwatch colour={data.habitatColour} name={data.habitatName} /> · {distance(data.lengthMetres)} in {plural(data.sectionCount, "section")} · {plural(data.walks, "walk")} recorded
            {data.active ? "" : ` · retired ${dayOf(data.retiredAt)}`}
          </p>
        </div>
        <div className="flex flex-wrap gap-2">
          <Link href={`/network/history?entity=transect&id=${data.id}`} className="btn-quiet">History of this transect</Link>
          <Link href="/network/transects" className="btn-quiet">All transects</Link>
        </div>
      </div>
      {!data.active && (
        <p role="status" className="rounded-lg border border-sand-800 bg-sand-100 p-3 text-sand-800">
          This transect is retired: no walks are recorded on it and volunteers&apos; phones no longer offer it. Its walks and past seasons are kept and still compare.
        </p>
      )}
      <section aria-labelledby="details-heading" className="card space-y-3">
        <h2 id="details-heading" className="text-xl font-bold">Details</h2>
        <DetailsForm transect={data} />
      </section>
      <section aria-labelledby="route-heading" className="card space-y-3">
        <h2 id="route-heading" className="text-xl font-bold">Route and sections</h2>
        <RouteChange transect={data} tileUrl={tileUrl} />
      </section>
      <section aria-labelledby="versions-heading" className="card space-y-3">
        <h2 id="versions-heading" className="text-xl font-bold">Route versions</h2>
        <p className="text-sm text-shingle-700">Each walk is measured against the route in force on its date; the first version also covers walks from before it.</p>
        <table className="w-full text-left text-sm">
          <thead className="bg-shingle-100">
            <tr>
              <th scope="col" className="p-2">Version</th>
              <th scope="col" className="p-2">Walked from</th>
              <th scope="col" className="p-2 text-right">Sections</th>
              <th scope="col" className="p-2 text-right">Length</th>
              <th scope="col" className="p-2">Saved</th>
            </tr>
          </thead>
          <tbody>
            {data.versions.map((v) => (
              <tr key={v.version} className="border-t border-shingle-100">
                <td className="p-2 font-bold">{v.version}</td>
                <td className="p-2">{dayOf(v.validFrom)}</td>
                <td className="p-2 text-right">{v.sectionCount}</td>
                <td className="p-2 text-right">{distance(v.lengthMetres)}</td>
                <td className="p-2">{dayOf(v.createdAt)} by {v.createdBy ?? "someone no longer in the network"}</td>
              </tr>
            ))}
          </tbody>
        </table>
      </section>
      <section aria-labelledby="retire-heading" className="card space-y-3">
        <h2 id="retire-heading" className="text-xl font-bold">{data.active ? "Retire this transect" : "Bring it back into use"}</h2>
        <RetirePanel transect={data} />
      </section>
    </div>
  );
}
