import type { Metadata } from "next";
import Link from "next/link";
import { MergeForm } from "@/components/network/checklist/merge-form";
import { requirePageActor } from "@/lib/auth/guard";
import { idParams } from "../schema";

export const metadata: Metadata = { title: "Merge checklist entries" };

export default async function MergePage({ searchParams }: { searchParams: Promise<Record<string, string | string[] | undefined>> }) {
  await requirePageActor(["organiser"], "/network/checklist/merge");
  const keep = idParams.safeParse({ id: (await searchParams).keep });
  return (
    <div className="space-y-4">
      <p><Link href="/network/checklist" className="underline">Back to the checklist</Link></p>
      <h1 className="text-2xl font-bold text-tideline-800">Merge two checklist entries</h1>
      <p className="max-w-3xl text-shingle-700">
        For a taxonomic lump, or a name that was a misidentification: every sighting of the entry you fold in moves to the entry you keep,
        and the folded name stays on as a synonym, so imports and searches by the old name still find it.
      </p>
      <MergeForm keepId={keep.success ? keep.data.id : undefined} />
    </div>
  );
}
