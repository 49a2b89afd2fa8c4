import Link from "next/link";
import type { SeasonEffort } from "@/lib/queries/effort";
import { CELL_STATE_ORDER, CELL_STATES, longDay, plainDay, shortDay } from "./states";

const plural = (n: number, one: string, many = `${one}s`) => `${n.toLocaleString("en-GB")} ${n === 1 ? one : many}`;

/** What the grid's symbols mean, in words. */
export function EffortLegend() {
  return (
    <div>
      <h3 className="sr-only">Key to the grid</h3>
      <ul aria-label="Key to the grid" className="flex flex-wrap gap-x-5 gap-y-2 text-sm">
        {CELL_STATE_ORDER.map((state) => (
          <li key={state} className="flex items-center gap-2">
            <span aria-hidden="true" className={`inline-flex h-6 w-6 items-center justify-center rounded border border-shingle-200 font-bold ${CELL_STATES[state].className}`}>
              {CELL_STATES[state].symbol}
            </span>
            {CELL_STATES[state].label}
          </li>
        ))}
      </ul>
    </div>
  );
}

/**
 * The season's transects (rows) by week (columns, weeks starting Monday), with each transect's
 * walks against the target, sightings waiting for review and last walk beside its name.
 */
export function EffortGrid({ effort }: { effort: Pick<SeasonEffort, "season" | "weeks" | "rows"> }) {
  const { season, weeks, rows } = effort;
  return (
    <div className="overflow-x-auto rounded-xl border border-shingle-200 bg-white">
      <table className="border-collapse text-left text-sm">
        <caption className="p-2 text-left text-shingle-700">
          Walks week by week in the {season.name}: one row per transect, one column per week (weeks start on Monday).
        </caption>
        <thead className="bg-shingle-100">
          <tr>
            <th scope="col" className="sticky left-0 z-10 bg-shingle-100 p-2">Transect</th>
            <th scope="col" className="p-2 text-right">Walks (target {season.targetVisits})</th>
            <th scope="col" className="p-2 text-right">Waiting for review</th>
            <th scope="col" className="p-2">Last walk</th>
            {weeks.map((week) => (
              <th key={week} scope="col" className="whitespace-nowrap p-1 text-center text-xs font-normal">
                <span aria-hidden="true">{shortDay(week)}</span>
                <span className="sr-only">Week of {longDay(week)}</span>
              </th>
            ))}
          </tr>
        </thead>
        <tbody>
          {rows.map((row) => (
            <tr key={row.id} className="border-t border-shingle-100">
              <th scope="row" className="sticky left-0 z-10 whitespace-nowrap bg-white p-2 font-normal">
                <Link href={`/network/transects/${row.id}`} className="font-bold text-tideline-700 underline">{row.code}</Link>{" "}
                <span className="text-shingle-700">{row.name}</span>
                {!row.active && <span className="text-shingle-600"> (retired)</span>}
              </th>
              <td className="p-2 text-right">{row.walks} of {season.targetVisits}</td>
              <td className="p-2 text-right">{row.pending}</td>
              <td className="whitespace-nowrap p-2">{row.lastWalk ? plainDay(row.lastWalk) : "None yet"}</td>
              {row.cells.map((cell) => {
                const look = CELL_STATES[cell.state];
                const detail = cell.walks > 0 ? ` (${plural(cell.walks, "walk")}, ${plural(cell.sightings, "sighting")})` : "";
                return (
                  <td key={cell.weekStart} data-state={cell.state} title={`${look.label}${detail}, week of ${plainDay(cell.weekStart)}`} className={`h-8 min-w-8 border border-shingle-100 text-center font-bold ${look.className}`}>
                    <span aria-hidden="true">{look.symbol}</span>
                    <span className="sr-only">{look.label}{detail}</span>
                  </td>
                );
              })}
            </tr>
          ))}
          {rows.length === 0 && (
            <tr>
              <td colSpan={4 + weeks.length} className="p-4 text-center">No transects yet. <Link href="/network/transects/new" className="underline">Create the first one.</Link></td>
            </tr>
          )}
        </tbody>
      </table>
    </div>
  );
}

/** Transects unwalked for three ended weeks or more, while the season is open. */
export function EffortAlerts({ effort }: { effort: Pick<SeasonEffort, "season" | "alerts"> }) {
  const open = effort.season.status === "open";
  return (
    <section aria-labelledby="alerts-heading" className="card space-y-2">
      <h2 id="alerts-heading" className="text-xl font-bold">Not walked for three weeks or more</h2>
      <p className="text-sm text-shingle-700">
        Only weeks that have ended count: the week under way can still be walked. A week marked as not walked because of the weather counts as not walked.
      </p>
      {!open ? (
        <p>The {effort.season.name} is not open, so nothing is listed here.</p>
      ) : effort.alerts.length === 0 ? (
        <p>Every transect in use has been walked within the last three weeks.</p>
      ) : (
        <ul className="divide-y divide-shingle-100">
          {effort.alerts.map((a) => (
            <li key={a.id} className="py-1">
              <Link href={`/network/transects/${a.id}`} className="font-bold text-tideline-700 underline">{a.code}</Link> {a.name}:{" "}
              {plural(a.weeksWithoutWalk, "week")} without a walk ({a.lastWalk ? `last walked ${plainDay(a.lastWalk)}` : "not walked this season"})
            </li>
          ))}
        </ul>
      )}
    </section>
  );
}
