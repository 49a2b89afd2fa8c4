import type { Metadata } from "next";
import { requirePageActor } from "@/lib/auth/guard";
import { roleLabel } from "@/lib/auth/roles";
import { listPeople, pendingInvitations } from "@/lib/queries/people";
import { InviteForm } from "./invite-form";
import { PersonRow } from "./person-row";

export const metadata: Metadata = { title: "People" };

export default async function PeoplePage() {
  await requirePageActor(["organiser"], "/network/people");
  const [people, invites] = await Promise.all([listPeople(), pendingInvitations()]);
  return (
    <div className="space-y-6">
      <h1 className="text-2xl font-bold text-tideline-800">People</h1>
      <section className="card" aria-labelledby="invite-heading">
        <h2 id="invite-heading" className="mb-3 text-xl font-bold">Invite someone</h2>
        <InviteForm />
      </section>
      {invites.length > 0 && (
        <section aria-labelledby="invites-heading">
          <h2 id="invites-heading" className="mb-2 text-xl font-bold">Invitations not yet answered</h2>
          <ul className="card">
            {invites.map((i) => (
              <li key={i.id}>{i.name} ({i.email}): {roleLabel[i.role]}, until {i.expiresAt.toISOString().slice(0, 10)}</li>
            ))}
          </ul>
        </section>
      )}
      <section aria-labelledby="everyone-heading">
        <h2 id="everyone-heading" className="mb-2 text-xl font-bold">Everyone in the network</h2>
        <div className="overflow-x-auto">
          <table className="w-full border-collapse bg-white">
            <thead>
              <tr className="border-b border-shingle-200 text-left">
                <th scope="col" className="p-2">Name</th>
                <th scope="col" className="p-2">E-mail</th>
                <th scope="col" className="p-2">Role</th>
                <th scope="col" className="p-2">Status</th>
                <th scope="col" className="p-2"><span className="sr-only">Save</span></th>
              </tr>
            </thead>
            <tbody>
              {people.map((p) => (
                <PersonRow key={p.id} person={p} />
              ))}
            </tbody>
          </table>
        </div>
      </section>
    </div>
  );
}
