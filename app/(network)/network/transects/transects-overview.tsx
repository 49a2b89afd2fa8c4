"use client";

import { useQuery } from "@tanstack/react-query";
import Link from "next/link";
import { useRouter } from "next/navigation";
import { useState } from "react";
import { RoutesMap, type MapRoute } from "@/components/map/lazy";
import type { TransectList } from "@/lib/queries/transects";
import { api, queryKeys } from "./api";
import { dayOf, distance, plural } from "./format";
import { HabitatSwatch } from "./habitat-swatch";

type Row = TransectList["transects"][number];

function progressOf(row: Row, target: number | null) {
  if (!target) return `${plural(row.walks, "walk")}`;
  return `${row.walks} of ${target} walks`;
}

function Progress({ walks, target }: { walks: number; target: number | null }) {
  if (!target) return <span>{plural(walks, "walk")}</span>;
  const share = Math.min(1, walks / target);
  return (
    <span className="flex items-center gap-2">
      <span aria-hidden="true" className="inline-block h-2 w-16 overflow-hidden rounded bg-shingle-200">
        <span className="block h-full bg-tideline-600" style={{ width: `${share * 100}%` }} />
      </span>
      <span>
        {walks} of {target}
      </span>
    </span>
  );
}

/** Every transect in a table and on a map coloured by habitat group, with this season's walks against the target. */
export function TransectsOverview({ tileUrl }: { tileUrl: string | null }) {
  const router = useRouter();
  const [showRetired, setShowRetired] = useState(false);
  const { data, error, isPending } = useQuery({ queryKey: queryKeys.transects, queryFn: () => api<TransectList>("/api/network/transects") });

  const rows = (data?.transects ?? []).filter((t) => showRetired || t.active);
  const target = data?.season?.targetVisits ?? null;
  const routes: MapRoute[] = rows.map((t) => ({
    id: t.id,
    label: `${t.code} ${t.name}`,
    colour: t.habitatColour,
    coordinates: t.route.type === "LineString" ? t.route.coordinates : null,
    centre: t.route.type === "generalised" ? t.route.centre : undefined,
    detail: `${t.habitatName} · ${distance(t.lengthMetres)} · ${progressOf(t, target)}${t.active ? "" : " · retired"}`,
    dimmed: !t.active,
  }));
  const habitats = [...new Map((data?.transects ?? []).map((t) => [t.habitatGroupId, { name: t.habitatName, colour: t.habitatColour }])).values()];

  return (
    <div className="space-y-4">
      <div className="flex flex-wrap items-center justify-between gap-3">
        <h1 className="text-2xl font-bold text-tideline-800">Transects</h1>
        <div className="flex flex-wrap gap-2">
          <Link href="/network/habitats" className="btn-quiet">Habitat groups</Link>
          <Link href="/network/transects/new" className="btn-primary">New transect</Link>
        </div>
      </div>
      <p className="text-shingle-700">
        {data?.season ? `Walks this season (${data.season.name}) against its target of ${data.season.targetVisits} per transect.` : "No season has started yet, so there are no walks to count."}
      </p>
      {error && <p role="alert" className="card font-bold text-rust-700">The transects could not be loaded: {error.message}</p>}
      {isPending ? (
        <p className="card">Loading transects…</p>
      ) : (
        <>
          <RoutesMap routes={routes} tileUrl={tileUrl} label="Map of the transects, coloured by habitat group" onOpen={(id) => router.push(`/network/transects/${id}`)} />
          {habitats.length > 0 && (
            <ul aria-label="Habitat group colours" className="flex flex-wrap gap-4 text-sm">
              {habitats.map((h) => (
                <li key={h.name}>
                  <HabitatSwatch colour={h.colour} name={h.name} />
                </li>
              ))}
            </ul>
          )}
          <label className="flex min-h-tap items-center gap-2">
            <input type="checkbox" className="h-5 w-5" checked={showRetired} onChange={(e) => setShowRetired(e.target.checked)} />
            Show retired transects
          </label>
          <div className="overflow-x-auto rounded-xl border border-shingle-200 bg-white">
            <table className="w-full text-left text-sm">
              <caption className="sr-only">Transects</caption>
              <thead className="bg-shingle-100">
                <tr>
                  <th scope="col" className="p-2">Code</th>
                  <th scope="col" className="p-2">Name</th>
                  <th scope="col" className="p-2">Habitat group</th>
                  <th scope="col" className="p-2 text-right">Length</th>
                  <th scope="col" className="p-2 text-right">Sections</th>
                  <th scope="col" className="p-2">Sensitive</th>
                  <th scope="col" className="p-2">In use</th>
                  <th scope="col" className="p-2">This season</th>
                </tr>
              </thead>
              <tbody>
                {rows.map((t) => (
                  <tr key={t.id} className="border-t border-shingle-100">
                    <td className="p-2 font-bold">
                      <Link href={`/network/transects/${t.id}`} className="text-tideline-700 underline">{t.code}</Link>
                    </td>
                    <td className="p-2">{t.name}</td>
                    <td className="p-2"><HabitatSwatch colour={t.habitatColour} name={t.habitatName} /></td>
                    <td className="p-2 text-right">{distance(t.lengthMetres)}</td>
                    <td className="p-2 text-right">{t.sectionCount}</td>
                    <td className="p-2">{t.sensitive ? "Yes" : "No"}</td>
                    <td className="p-2">{t.active ? "Yes" : `Retired ${dayOf(t.retiredAt)}`}</td>
                    <td className="p-2"><Progress walks={t.walks} target={target} /></td>
                  </tr>
                ))}
                {rows.length === 0 && (
                  <tr>
                    <td colSpan={8} className="p-4 text-center">No transects yet. <Link href="/network/transects/new" className="underline">Create the first one.</Link></td>
                  </tr>
                )}
              </tbody>
            </table>
          </div>
        </>
      )}
    </div>
  );
}
