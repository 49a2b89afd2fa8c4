import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { EntryEditor } from "@/components/network/checklist/entry-editor";
import { requirePageActor } from "@/lib/auth/guard";
import { rankLabel } from "@/lib/checklist/ranks";
import { isAppError } from "@/lib/errors";
import { checklistEntry } from "@/lib/queries/checklist";
import { idParams } from "../schema";

export const metadata: Metadata = { title: "Checklist entry" };

export default async function EntryPage({ params }: { params: Promise<{ id: string }> }) {
  const parsed = idParams.safeParse(await params);
  await requirePageActor(["organiser"], parsed.success ? `/network/checklist/${parsed.data.id}` : "/network/checklist");
  if (!parsed.success) notFound();
  const entry = await checklistEntry(parsed.data.id).catch((error: unknown) => {
    if (isAppError(error) && error.status === 404) notFound();
    throw error;
  });
  return (
    <div className="space-y-4">
      <p><Link href="/network/checklist" className="underline">Back to the checklist</Link></p>
      <h1 className="text-2xl font-bold text-tideline-800">
        <i>{entry.scientificName}</i> <span className="font-normal">({entry.vernacularName})</span>
      </h1>
      <p className="text-shingle-700">
        {rankLabel[entry.taxonRank]} · {entry.sightings.toLocaleString("en-GB")} sighting{entry.sightings === 1 ? "" : "s"}
        {entry.coveredBy.length > 0 && <> · covered by {entry.coveredBy.map((a, i) => <span key={a.id}>{i > 0 && ", "}<Link href={`/network/checklist/${a.id}`} className="italic underline">{a.scientificName}</Link></span>)}</>}
      </p>
      <nav aria-label="This entry" className="flex flex-wrap gap-2">
        <Link href={`/network/history?entity=species&id=${entry.id}`} className="btn-quiet">History of this entry</Link>
        <Link href={`/network/checklist/merge?keep=${entry.id}`} className="btn-quiet">Merge another entry into this one</Link>
      </nav>
      <EntryEditor id={entry.id} />
    </div>
  );
}
