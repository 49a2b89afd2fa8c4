import type { Metadata } from "next";
import Link from "next/link";
import { TagManager } from "@/components/network/checklist/tag-manager";
import { requirePageActor } from "@/lib/auth/guard";

export const metadata: Metadata = { title: "Species tags" };

export default async function TagsPage() {
  await requirePageActor(["organiser"], "/network/checklist/tags");
  return (
    <div className="space-y-4">
      <p><Link href="/network/checklist" className="underline">Back to the checklist</Link></p>
      <h1 className="text-2xl font-bold text-tideline-800">Species tags</h1>
      <p className="max-w-3xl text-shingle-700">
        Tags group species for analysis, such as &ldquo;grassland specialist&rdquo; or &ldquo;non-native&rdquo;. A tag keeps its slug when renamed, so files and analyses that name it still find it.
      </p>
      <TagManager />
    </div>
  );
}
