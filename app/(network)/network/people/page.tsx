import type { Metadata } from "next";
import { requirePageActor } from "@/lib/auth/guard";
import { InviteForm } from "./invite-form";
import { PeopleDirectory } from "./people-directory";

export const metadata: Metadata = { title: "People" };

export default async function PeoplePage() {
  await requirePageActor(["organiser"], "/network/people");
  return (
    <div className="space-y-6">
      <h1 className="text-2xl font-bold text-tideline-800">People</h1>
      <section className="card" aria-labelledby="invite-heading">
        <h2 id="invite-heading" className="mb-3 text-xl font-bold">Invite someone</h2>
        <InviteForm />
      </section>
      <PeopleDirectory />
    </div>
  );
}
