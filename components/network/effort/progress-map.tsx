"use client";

import { useRouter } from "next/navigation";
import { RoutesMap, type MapRoute } from "@/components/map/lazy";
import { colourHex } from "@/lib/geo/palette";
import type { EffortRoute } from "@/lib/queries/effort";
import { PROGRESS_BANDS, PROGRESS_ORDER } from "./states";

/** The routes coloured by walks against the season's target, with the key in words; a click opens the transect. */
export function ProgressMap({ routes, target, tileUrl }: { routes: EffortRoute[]; target: number; tileUrl: string | null }) {
  const router = useRouter();
  const lines: MapRoute[] = routes.map((r) => ({
    id: r.id,
    label: `${r.code} ${r.name}`,
    colour: PROGRESS_BANDS[r.progress].colour,
    dashed: PROGRESS_BANDS[r.progress].dashed,
    coordinates: r.route.type === "LineString" ? r.route.coordinates : null,
    centre: r.route.type === "generalised" ? r.route.centre : undefined,
    detail: `${r.walks} of ${target} walks · ${PROGRESS_BANDS[r.progress].label}`,
  }));
  return (
    <div className="space-y-2">
      <RoutesMap routes={lines} tileUrl={tileUrl} label="Map of the transects, coloured by walks against the target" onOpen={(id) => router.push(`/network/transects/${id}`)} />
      <ul aria-label="Map key: walks against the target" className="flex flex-wrap gap-x-5 gap-y-1 text-sm">
        {PROGRESS_ORDER.map((p) => (
          <li key={p} className="flex items-center gap-2">
            <svg aria-hidden="true" width="28" height="8">
              <line x1="0" y1="4" x2="28" y2="4" stroke={colourHex(PROGRESS_BANDS[p].colour)} strokeWidth="4" strokeDasharray={PROGRESS_BANDS[p].dashed ? "6 4" : undefined} />
            </svg>
            {PROGRESS_BANDS[p].label}
            {p === "none" ? " (dashed)" : ""}
          </li>
        ))}
      </ul>
    </div>
  );
}
