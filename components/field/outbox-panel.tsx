"use client";

import { useEffect, useState } from "react";
import { fieldDb, type OutboxState } from "@/lib/offline/db";
import { onSyncState, syncNow } from "@/lib/offline/sync-controller";
import { useLive } from "./use-live";

const stateLabel: Record<OutboxState, string> = {
  "on-phone": "On this phone",
  sending: "Sending",
  sent: "Sent",
  "needs-attention": "Needs attention",
};

/** What is waiting to leave the phone, what went, and what needs the volunteer. */
export function OutboxPanel() {
  const [syncing, setSyncing] = useState(false);
  const [online, setOnline] = useState(true);
  useEffect(() => {
    setOnline(navigator.onLine);
    const up = () => setOnline(true);
    const down = () => setOnline(false);
    window.addEventListener("online", up);
    window.addEventListener("offline", down);
    const off = onSyncState((s) => setSyncing(s.running));
    return () => {
      window.removeEventListener("online", up);
      window.removeEventListener("offline", down);
      off();
    };
  }, []);
  const items = useLive(async () => {
    const db = fieldDb();
    const visits = (await db.visits.where("phase").equals("submitted").toArray()).sort((a, b) => b.visitDate.localeCompare(a.visitDate));
    const sightings = await db.sightings.toArray();
    const photos = await db.photos.toArray();
    const submitted = new Set(visits.map((v) => v.id));
    return {
      visits,
      sightings: sightings.filter((s) => submitted.has(s.visitId)),
      photos: photos.filter((p) => submitted.has(p.visitId)),
    };
  }, []);

  const all = items ? [...items.visits, ...items.sightings, ...items.photos] : [];
  const count = (state: OutboxState) => all.filter((i) => i.outbox === state).length;
  const waiting = count("on-phone") + count("sending");

  return (
    <section aria-labelledby="outbox-heading" className="card" data-testid="outbox">
      <div className="flex items-center justify-between gap-2">
        <h2 id="outbox-heading" className="text-lg font-bold">Outbox</h2>
        <span className={`rounded-full px-3 py-1 text-sm font-bold ${online ? "bg-lichen-100 text-lichen-700" : "bg-sand-100 text-sand-800"}`}>
          {online ? "Online" : "No signal"}
        </span>
      </div>
      <p className="mt-1" data-testid="outbox-summary">
        {waiting === 0 && count("needs-attention") === 0 ? "Everything is sent." : `${waiting} waiting to send.`}
        {syncing && " Sending now…"}
      </p>
      <dl className="mt-2 grid grid-cols-2 gap-2 text-sm sm:grid-cols-4">
        {(Object.keys(stateLabel) as OutboxState[]).map((s) => (
          <div key={s} className="rounded-lg bg-shingle-50 p-2">
            <dt className="text-shingle-600">{stateLabel[s]}</dt>
            <dd className="text-xl font-bold" data-testid={`outbox-${s}`}>{count(s)}</dd>
          </div>
        ))}
      </dl>
      {items?.visits.some((v) => v.attention) && (
        <ul className="mt-3 space-y-2">
          {items.visits
            .filter((v) => v.attention)
            .map((v) => (
              <li key={v.id} className="rounded-lg border border-rust-700 bg-rust-100 p-2 text-sm text-rust-700">
                Visit on {v.visitDate}: {v.attention}{" "}
                {v.outbox === "needs-attention" && (
                  <a className="font-bold underline" href={`/field/visit?id=${v.id}&transect=${v.transectId}`}>Open it</a>
                )}
              </li>
            ))}
        </ul>
      )}
      <button type="button" className="btn-quiet mt-3 w-full" onClick={() => void syncNow()} disabled={!online || syncing}>
        Send now
      </button>
    </section>
  );
}
