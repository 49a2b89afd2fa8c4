"use client";

import dynamic from "next/dynamic";
import { useSearchParams } from "next/navigation";
import { useState } from "react";
import type { FieldReference } from "@/lib/offline/reference";
import { SafetyGate } from "../safety-gate";
import { useFieldReference } from "../use-reference";
import { RecordingScreen } from "./recording-screen";

// The start form carries the form and validation libraries; the recording screen does not need them.
const StartVisitForm = dynamic(() => import("./start-visit-form").then((m) => m.StartVisitForm), { ssr: false, loading: () => <p>Loading…</p> });

export const visitHref = (visitId: string, transectId: string) => `/field/visit?id=${visitId}&transect=${transectId}`;

/** /field/visit?transect=ID starts a visit; /field/visit?id=ID records into one. Works offline. */
export function VisitScreen({ initial }: { initial?: FieldReference }) {
  const params = useSearchParams();
  const [visitId, setVisitId] = useState<string | null>(params.get("id"));
  const reference = useFieldReference(initial);
  if (reference.error) return <p className="card text-rust-700">{reference.error}</p>;
  const data = reference.data;
  if (!data) return <p>Loading…</p>;

  if (visitId) {
    return <RecordingScreen visitId={visitId} transectHint={params.get("transect")} transects={data.transects} checklist={data.checklist} seenByTransect={data.seenByTransect} rules={data.rules} seasons={data.seasons} />;
  }
  const transectId = params.get("transect") ?? data.transects[0]?.id;
  if (!transectId) return <p className="card">You have no transects to record on yet. Your network organiser assigns them.</p>;
  return (
    <SafetyGate acceptedAt={data.safetyAcceptedAt}>
      <StartVisitForm
        transects={data.transects}
        transectId={transectId}
        rules={data.rules}
        seasons={data.seasons}
        onSaved={(id, startedOn) => {
          // Stay on this page (no request needed offline) but make a reload reopen the visit.
          window.history.replaceState(null, "", visitHref(id, startedOn));
          setVisitId(id);
        }}
      />
    </SafetyGate>
  );
}
