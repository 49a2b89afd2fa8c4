"use client";

import { useState } from "react";
import { syncNow } from "@/lib/offline/sync-controller";
import { claimWalks, leaveWalks, unownedWalks } from "@/lib/offline/unowned-walks";
import { useFieldUserId } from "./field-providers";
import { useLive } from "./use-live";

const plural = (n: number, one: string) => `${n} ${one}${n === 1 ? "" : "s"}`;

/**
 * Walks stored before this phone knew who was signed in: the volunteer says whether they are
 * theirs (then they are sent with their records) or not (they stay on the phone, out of sight).
 */
export function UnownedWalks({ transects }: { transects: { id: string; code: string; name: string }[] }) {
  const userId = useFieldUserId();
  const walks = useLive(async () => (userId ? unownedWalks(userId) : []), [userId]);
  const [busy, setBusy] = useState(false);
  const [error, setError] = useState<string | null>(null);
  if (!userId || !walks || walks.length === 0) return null;
  const ids = walks.map((w) => w.visit.id);

  const choose = async (mine: boolean) => {
    setBusy(true);
    setError(null);
    try {
      if (mine) {
        await claimWalks(userId, ids);
        void syncNow();
      } else {
        await leaveWalks(userId, ids);
      }
    } catch {
      setError("This phone could not save your answer. Try again.");
    } finally {
      setBusy(false);
    }
  };

  return (
    <section aria-labelledby="unowned-heading" className="card border-sand-300" data-testid="unowned-walks">
      <h2 id="unowned-heading" className="text-lg font-bold">Are these walks yours?</h2>
      <p className="mt-1">These walks were recorded on this phone before it knew who was signed in.</p>
      <ul className="mt-2 space-y-1">
        {walks.map(({ visit, sightings, photos }) => {
          const t = transects.find((x) => x.id === visit.transectId);
          return (
            <li key={visit.id} className="rounded-lg bg-shingle-50 p-2">
              {visit.visitDate} · {t ? `${t.code} ${t.name}` : "a transect that is not one of yours"} · {plural(sightings, "sighting")}, {plural(photos, "photo")}
              {visit.phase === "draft" ? " · not finished" : ""}
            </li>
          );
        })}
      </ul>
      <p className="mt-2 text-sm text-shingle-600">
        If they are yours, they are sent with your walks. If not, they stay on this phone for the volunteer who made them.
      </p>
      {error && <p role="alert" className="mt-2 font-bold text-rust-700">{error}</p>}
      <div className="mt-3 grid grid-cols-2 gap-2">
        <button type="button" className="btn-primary min-w-tap" disabled={busy} onClick={() => void choose(true)}>These are mine</button>
        <button type="button" className="btn-quiet min-w-tap" disabled={busy} onClick={() => void choose(false)}>Not mine</button>
      </div>
    </section>
  );
}
