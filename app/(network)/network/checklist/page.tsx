import type { Metadata } from "next";
import Link from "next/link";
import { ChecklistTable } from "@/components/network/checklist/checklist-table";
import { requirePageActor } from "@/lib/auth/guard";

export const metadata: Metadata = { title: "Species checklist" };

export default async function ChecklistPage() {
  await requirePageActor(["organiser"], "/network/checklist");
  return (
    <div className="space-y-4">
      <h1 className="text-2xl font-bold text-tideline-800">Species checklist</h1>
      <p className="text-shingle-700">The species volunteers choose from when they record a sighting. Choose a scientific name to edit the entry.</p>
      <nav aria-label="Checklist tasks" className="flex flex-wrap gap-2">
        <Link href="/network/checklist/import" className="btn-quiet">Import from CSV</Link>
        <Link href="/network/checklist/merge" className="btn-quiet">Merge two entries</Link>
        <Link href="/network/checklist/tags" className="btn-quiet">Species tags</Link>
        <Link href="/network/history?entity=species" className="btn-quiet">Checklist history</Link>
      </nav>
      <ChecklistTable />
    </div>
  );
}
