import type { Metadata } from "next";
import Link from "next/link";
import { ChecklistImport } from "@/components/network/checklist/checklist-import";
import { requirePageActor } from "@/lib/auth/guard";
import { CHECKLIST_COLUMNS, columnHelp, REQUIRED_COLUMNS } from "@/lib/checklist/columns";

export const metadata: Metadata = { title: "Import a checklist" };

const example = `scientific_name,vernacular_name,taxon_rank,tags,sensitive,active_months,synonyms,covers
Aglais io,Peacock,species,Wider countryside,no,3-10,Inachis io,
Thymelicus sylvestris/lineola,Small/Essex Skipper,species_aggregate,,no,6-8,,Thymelicus sylvestris;Thymelicus lineola`;

export default async function ImportChecklistPage() {
  await requirePageActor(["organiser"], "/network/checklist/import");
  return (
    <div className="space-y-4">
      <p><Link href="/network/checklist" className="underline">Back to the checklist</Link></p>
      <h1 className="text-2xl font-bold text-tideline-800">Import a checklist from CSV</h1>
      <p className="max-w-3xl text-shingle-700">
        Entries already on the checklist are matched by scientific name and updated; the others are added. Nothing is removed.
        You see what would change before anything is written, and a file with any problem is not imported at all.
      </p>
      <details className="card max-w-3xl">
        <summary className="cursor-pointer font-bold">How to lay out the file</summary>
        <p className="mt-2">
          The first line names the columns, separated by commas. {REQUIRED_COLUMNS.join(" and ")} are needed; a column left out leaves that field as it is.
          Lists inside a cell are separated by semicolons; a value holding a comma goes in double quotes.
        </p>
        <dl className="mt-2 grid gap-x-3 gap-y-1 sm:grid-cols-[auto_1fr]">
          {CHECKLIST_COLUMNS.map((c) => (
            <div key={c} className="contents">
              <dt className="font-mono text-sm font-bold">{c}</dt>
              <dd>{columnHelp[c]}</dd>
            </div>
          ))}
        </dl>
        <pre className="mt-2 overflow-x-auto rounded bg-shingle-100 p-2 text-sm">{example}</pre>
      </details>
      <ChecklistImport />
    </div>
  );
}
