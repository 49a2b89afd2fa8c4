import type { Metadata } from "next";
import { ColumnList } from "@/components/network/earlier-seasons/column-list";
import { SeasonImport } from "@/components/network/earlier-seasons/season-import";
import { requirePageActor } from "@/lib/auth/guard";
import { REQUIRED_SIGHTING_COLUMNS, REQUIRED_WALK_COLUMNS, SIGHTING_COLUMNS, WALK_COLUMNS, exampleSightingsCsv, exampleWalksCsv, sightingColumnHelp, walkColumnHelp } from "@/lib/import/columns";
import { importedFromText, listSeasonImports } from "@/lib/queries/season-import";
import { listSeasons } from "@/lib/queries/seasons";
import { statusForReviewer } from "@/lib/review/words";

export const metadata: Metadata = { title: "Earlier seasons" };

const download = (text: string) => `data:text/csv;charset=utf-8,${encodeURIComponent(text)}`;

export default async function EarlierSeasonsPage() {
  await requirePageActor(["organiser"], "/network/earlier-seasons");
  const [seasonRows, imports] = await Promise.all([listSeasons(), listSeasonImports()]);
  return (
    <div className="space-y-4">
      <h1 className="text-2xl font-bold text-tideline-800">Earlier seasons from spreadsheets</h1>
      <p className="max-w-3xl text-shingle-700">
        Bring in a season recorded before Turnstone from two CSV files: one line per walk (empty walks too), and one line per sighting.
        You see the counts and every problem before anything is written; files with any problem are not imported at all.
      </p>
      <details className="card max-w-3xl">
        <summary className="cursor-pointer font-bold">How to lay out the two files</summary>
        <p className="mt-2">
          Each file&apos;s first line names its columns, separated by commas, in any order and letter case; a value holding a comma goes in double quotes.
          Save from your spreadsheet as &quot;CSV UTF-8&quot;. Each file may be up to 10 MB.
        </p>
        <h2 className="mt-3 font-bold">Walks file</h2>
        <ColumnList columns={WALK_COLUMNS} required={REQUIRED_WALK_COLUMNS} help={walkColumnHelp} />
        <p className="mt-1"><a className="underline" href={download(exampleWalksCsv)} download="walks-example.csv">Download an example walks file</a></p>
        <h2 className="mt-3 font-bold">Sightings file</h2>
        <ColumnList columns={SIGHTING_COLUMNS} required={REQUIRED_SIGHTING_COLUMNS} help={sightingColumnHelp} />
        <p className="mt-1"><a className="underline" href={download(exampleSightingsCsv)} download="sightings-example.csv">Download an example sightings file</a></p>
      </details>
      <SeasonImport seasons={seasonRows.map((s) => ({ id: s.id, name: s.name, startsOn: s.startsOn, endsOn: s.endsOn, status: s.status }))} />
      {imports.length > 0 && (
        <section aria-labelledby="imports-heading" className="space-y-2">
          <h2 id="imports-heading" className="text-xl font-bold">Imported so far</h2>
          <ul className="space-y-1">
            {imports.map((i) => (
              <li key={i.id} className="card">
                {i.season}: {i.walks.toLocaleString("en-GB")} walks and {i.sightings.toLocaleString("en-GB")} sightings {importedFromText(i)} and {i.sightingsFileName}
                {i.by ? ` by ${i.by}` : ""}, as {statusForReviewer[i.recordStatus === "accepted" ? "accepted" : "pending"].toLowerCase()}.
              </li>
            ))}
          </ul>
        </section>
      )}
    </div>
  );
}
