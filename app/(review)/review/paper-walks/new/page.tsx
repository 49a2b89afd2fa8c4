import type { Metadata } from "next";
import { PaperWalkForm } from "@/components/review/paper-walk-form";
import { requirePageActor } from "@/lib/auth/guard";
import { REVIEWERS } from "@/lib/auth/roles";
import { paperWalkChoices } from "@/lib/queries/paper-walks";

export const metadata: Metadata = { title: "Enter a paper walk" };

export default async function NewPaperWalkPage() {
  await requirePageActor(REVIEWERS, "/review/paper-walks/new");
  const choices = await paperWalkChoices();
  return (
    <div className="max-w-3xl space-y-4">
      <h1 className="text-2xl font-bold text-tideline-800">Enter a walk recorded on paper</h1>
      <p className="text-shingle-700">
        For a volunteer who recorded on a paper sheet. The walk is theirs and says that you entered it; its sightings wait for review like any other.
        Walks can be entered while their season is open or in its grace period; a frozen season takes them from an organiser only.
      </p>
      <PaperWalkForm choices={choices} />
    </div>
  );
}
