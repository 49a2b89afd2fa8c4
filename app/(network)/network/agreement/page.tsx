import type { Metadata } from "next";
import { requirePageActor } from "@/lib/auth/guard";
import { AgreementEditor } from "./agreement-editor";

export const metadata: Metadata = { title: "Recorder agreement" };

export default async function AgreementPage() {
  await requirePageActor(["organiser"], "/network/agreement");
  return (
    <div className="space-y-6">
      <h1 className="text-2xl font-bold text-tideline-800">Recorder agreement</h1>
      <p className="max-w-prose">
        What every volunteer accepts before recording: how the network uses their sightings and the licence it publishes them under.
        Each volunteer answers for themselves whether they are named in published data or shown under their pseudonym, and whether they want the newsletter.
        Saving a change makes a new version, which every volunteer is asked to accept the next time they open their field pages.
      </p>
      <AgreementEditor />
    </div>
  );
}
