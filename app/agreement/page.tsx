import type { Metadata } from "next";
import { LogoMark } from "@/components/brand/logo-mark";
import { licenceLabel, licenceUrl } from "@/lib/agreement/licences";
import { requirePageActor } from "@/lib/auth/guard";
import { acceptancesOf, currentAgreement } from "@/lib/queries/agreements";
import { AcceptanceForm } from "./acceptance-form";

export const metadata: Metadata = { title: "Recorder agreement" };

/** Where the field pages send a volunteer until they have accepted the current version (app/(field)/layout.tsx). */
export default async function RecorderAgreementPage() {
  const actor = await requirePageActor(["volunteer"], "/agreement");
  const [agreement, answers] = await Promise.all([currentAgreement(), acceptancesOf(actor.id)]);
  const mine = answers.find((a) => a.version === agreement?.version);
  return (
    <main id="main" className="mx-auto max-w-md px-4 py-6">
      <div className="mb-4 flex items-center gap-2">
        <LogoMark size={32} />
        <span className="text-lg font-bold text-tideline-800">Turnstone</span>
      </div>
      <h1 className="mb-3 text-2xl font-bold text-tideline-800">Recorder agreement</h1>
      {!agreement ? (
        <p className="card">Your network has not written a recorder agreement yet. <a href="/field" className="inline-flex min-h-tap items-center font-bold text-tideline-700">Go to your transects</a></p>
      ) : (
        <>
          <p className="mb-3">
            {mine
              ? `You accepted version ${agreement.version} on ${mine.acceptedAt.toISOString().slice(0, 10)}. You can change your answers here at any time.`
              : answers.length
                ? `The agreement has changed since you last accepted it. Please read version ${agreement.version} and answer again before recording.`
                : "Before you record, please read how the network uses your sightings and answer two questions."}
          </p>
          <section aria-labelledby="terms-heading" className="card mb-4">
            <h2 id="terms-heading" className="mb-2 text-lg font-bold">Version {agreement.version}</h2>
            <div className="whitespace-pre-line">{agreement.body}</div>
            <p className="mt-3">
              Sightings are published under{" "}
              <a href={licenceUrl[agreement.licence]} className="font-bold text-tideline-700" rel="noreferrer" target="_blank">{licenceLabel[agreement.licence]}</a>.
            </p>
          </section>
          <AcceptanceForm version={agreement.version} previous={mine ? { publishName: mine.publishName, newsletter: mine.newsletter } : null} />
        </>
      )}
    </main>
  );
}
