"use client";

import { useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import { useState } from "react";

type RecordSighting = {
  id: string;
  vernacularName: string;
  scientificName: string;
  count: number;
  section: number | null;
  status: "pending" | "accepted" | "queried" | "rejected";
  question?: string | null;
};
type RecordVisit = { id: string; visitDate: string; transectCode: string; transectName: string; sightings: RecordSighting[] };

const statusLabel: Record<RecordSighting["status"], string> = {
  pending: "Waiting for a checker",
  accepted: "Accepted",
  queried: "Question from the checker",
  rejected: "Not accepted",
};
const statusStyle: Record<RecordSighting["status"], string> = {
  pending: "bg-shingle-100 text-shingle-800",
  accepted: "bg-lichen-100 text-lichen-700",
  queried: "bg-sand-100 text-sand-800",
  rejected: "bg-rust-100 text-rust-700",
};

async function fetchRecords(): Promise<RecordVisit[]> {
  const res = await fetch("/api/field/records", { credentials: "same-origin" });
  if (!res.ok) throw new Error(res.status === 401 ? "Sign in again to see your records." : "Your records could not be loaded.");
  const body = (await res.json()) as { visits: RecordVisit[] };
  return body.visits;
}

function Reply({ sightingId }: { sightingId: string }) {
  const [message, setMessage] = useState("");
  const client = useQueryClient();
  const reply = useMutation({
    mutationFn: async () => {
      const res = await fetch("/api/field/records/reply", {
        method: "POST",
        credentials: "same-origin",
        headers: { "Content-Type": "application/json" },
        body: JSON.stringify({ sightingId, message }),
      });
      if (!res.ok) {
        const body = (await res.json().catch(() => ({}))) as { error?: { message?: string } };
        throw new Error(body.error?.message ?? "The answer could not be sent.");
      }
    },
    onSuccess: () => {
      setMessage("");
      void client.invalidateQueries({ queryKey: ["my-records"] });
    },
  });
  return (
    <form className="mt-2 space-y-2" onSubmit={(e) => { e.preventDefault(); reply.mutate(); }}>
      <label htmlFor={`reply-${sightingId}`} className="field-label">Your answer</label>
      <textarea id={`reply-${sightingId}`} rows={2} maxLength={1000} className="field-input" value={message} onChange={(e) => setMessage(e.target.value)} required />
      {reply.isError && <p role="alert" className="field-error">{(reply.error as Error).message}</p>}
      {reply.isSuccess && <p role="status" className="text-sm text-lichen-700">Sent to the checker.</p>}
      <button type="submit" className="btn-quiet" disabled={reply.isPending || message.trim().length === 0}>Send answer</button>
    </form>
  );
}

/** The volunteer's past visits with each record's review status, and the checkers' questions. */
export function MyRecords() {
  const records = useQuery({ queryKey: ["my-records"], queryFn: fetchRecords });
  return (
    <div className="space-y-4">
      <h1 className="text-2xl font-bold text-tideline-800">My records</h1>
      {records.isPending && <p>Loading…</p>}
      {records.isError && <p className="card">{(records.error as Error).message} Records still on this phone are in the outbox on your home page.</p>}
      {records.data?.length === 0 && <p className="card">No visits sent yet.</p>}
      <ul className="space-y-3">
        {records.data?.map((v) => (
          <li key={v.id} className="card">
            <h2 className="font-bold">{v.visitDate} · {v.transectCode} {v.transectName}</h2>
            <ul className="mt-2 divide-y divide-shingle-100">
              {v.sightings.map((s) => (
                <li key={s.id} className="py-2">
                  <div className="flex flex-wrap items-center justify-between gap-2">
                    <span>{s.vernacularName} × {s.count}{s.section ? ` · section ${s.section}` : ""}</span>
                    <span className={`rounded-full px-2 py-0.5 text-sm font-bold ${statusStyle[s.status]}`}>{statusLabel[s.status]}</span>
                  </div>
                  {s.status === "queried" && s.question && (
                    <div className="mt-2 rounded-lg bg-sand-100 p-2">
                      <p className="text-sm"><strong>Checker asks:</strong> {s.question}</p>
                      <Reply sightingId={s.id} />
                    </div>
                  )}
                </li>
              ))}
            </ul>
          </li>
        ))}
      </ul>
    </div>
  );
}
