"use client";

import { useQuery } from "@tanstack/react-query";
import { useSearchParams } from "next/navigation";
import { useState } from "react";
import { loadReference } from "@/lib/offline/reference";
import { SafetyGate } from "../safety-gate";
import { RecordingScreen } from "./recording-screen";
import { StartVisitForm } from "./start-visit-form";

/** /field/visit?transect=ID starts a visit; /field/visit?id=ID records into one. Works offline. */
export function VisitScreen() {
  const params = useSearchParams();
  const [visitId, setVisitId] = useState<string | null>(params.get("id"));
  const reference = useQuery({ queryKey: ["field-reference"], queryFn: () => loadReference() });
  if (reference.isPending) return <p>Loading…</p>;
  if (reference.isError) return <p className="card text-rust-700">{(reference.error as Error).message}</p>;
  const data = reference.data.data;

  if (visitId) {
    return <RecordingScreen visitId={visitId} transects={data.transects} checklist={data.checklist} seenByTransect={data.seenByTransect} />;
  }
  const transectId = params.get("transect") ?? data.transects[0]?.id;
  if (!transectId) return <p className="card">You have no transects to record on yet.</p>;
  return (
    <SafetyGate>
      <StartVisitForm
        transects={data.transects}
        transectId={transectId}
        rules={data.rules}
        onStarted={(id) => {
          // Stay on this page (no request needed offline) but make a reload reopen the visit.
          window.history.replaceState(null, "", `/field/visit?id=${id}`);
          setVisitId(id);
        }}
      />
    </SafetyGate>
  );
}
