import type { Metadata } from "next";
import { licenceLabel } from "@/lib/agreement/licences";
import { requirePageActor } from "@/lib/auth/guard";
import { areasFor, hasRole, roleLabel, roles } from "@/lib/auth/roles";
import { acceptancesOf } from "@/lib/queries/agreements";
import { personDetail } from "@/lib/queries/people";

export const metadata: Metadata = { title: "Your account" };

export default async function AccountPage() {
  const actor = await requirePageActor(roles, "/account");
  const [{ person }, answers] = await Promise.all([personDetail(actor.id), acceptancesOf(actor.id)]);
  const latest = answers[0];
  return (
    <div className="max-w-2xl space-y-6">
      <h1 className="text-2xl font-bold text-tideline-800">Your account</h1>
      <section className="card" aria-labelledby="profile-heading">
        <h2 id="profile-heading" className="mb-2 text-xl font-bold">You</h2>
        <dl className="grid grid-cols-[auto_1fr] gap-x-4 gap-y-1">
          <dt className="font-bold">Name</dt>
          <dd>{person.name}</dd>
          <dt className="font-bold">E-mail</dt>
          <dd className="break-all">{person.email}</dd>
          <dt className="font-bold">Roles</dt>
          <dd>{person.roles.map((r) => roleLabel[r]).join(", ")}</dd>
          <dt className="font-bold">Pseudonym</dt>
          <dd>{person.pseudonym} <span className="text-sm text-shingle-600">(stands for you in published data unless you chose your name)</span></dd>
        </dl>
        <p className="mt-3">Your areas: {areasFor(actor.roles).map((a) => a.label).join(", ")}.</p>
      </section>
      {hasRole(actor, "volunteer") && (
        <section className="card" aria-labelledby="agreement-heading">
          <h2 id="agreement-heading" className="mb-2 text-xl font-bold">Recorder agreement</h2>
          {latest ? (
            <p>
              You accepted version {latest.version} ({licenceLabel[latest.licence]}) on {latest.acceptedAt.toISOString().slice(0, 10)}:
              published data shows your sightings {latest.publishName ? "under your name" : "under your pseudonym"}, and you {latest.newsletter ? "receive" : "do not receive"} the newsletter.
            </p>
          ) : (
            <p>You have not accepted a recorder agreement yet.</p>
          )}
          <p className="mt-2"><a href="/agreement" className="inline-flex min-h-tap items-center font-bold text-tideline-700">Read the agreement or change your answers</a></p>
        </section>
      )}
      <section className="card" aria-labelledby="data-heading">
        <h2 id="data-heading" className="mb-2 text-xl font-bold">Your data</h2>
        <p>
          Download everything Turnstone holds about you: your profile, agreement answers, transects, walks with their sightings, the questions and answers about them, and
          messages and changes you made. It is a JSON file, readable by any text editor.
        </p>
        <p className="mt-3">
          <a href="/api/account/data" download className="btn-primary inline-flex min-h-tap items-center">Download my data</a>
        </p>
        <p className="mt-3 text-sm">To have your data erased, ask your network organiser: your sightings stay for the science under your pseudonym, everything else that names you is removed.</p>
      </section>
    </div>
  );
}
