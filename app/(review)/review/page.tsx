import type { Metadata } from "next";
import { requirePageActor } from "@/lib/auth/guard";
import { REVIEWERS } from "@/lib/auth/roles";
import { walkSourceText } from "@/lib/import/walk-source";
import { reviewCounts, reviewQueue } from "@/lib/queries/review";

export const metadata: Metadata = { title: "Records to check" };

export default async function ReviewHome() {
  await requirePageActor(REVIEWERS, "/review");
  const [counts, queue] = await Promise.all([reviewCounts(), reviewQueue(30)]);
  return (
    <div className="space-y-6">
      <h1 className="text-2xl font-bold text-tideline-800">Records to check</h1>
      <dl className="grid grid-cols-2 gap-3 sm:grid-cols-4">
        {(["pending", "queried", "accepted", "rejected"] as const).map((s) => (
          <div key={s} className="card">
            <dt className="text-sm font-bold capitalize text-shingle-600">{s === "pending" ? "waiting" : s}</dt>
            <dd className="text-2xl font-bold">{counts[s]}</dd>
          </div>
        ))}
      </dl>
      <section aria-labelledby="queue-heading">
        <h2 id="queue-heading" className="mb-3 text-xl font-bold">Newest waiting</h2>
        {queue.length === 0 ? (
          <p className="card">Nothing is waiting. Well done.</p>
        ) : (
          <div className="overflow-x-auto">
            <table className="w-full border-collapse bg-white text-left">
              <thead>
                <tr className="border-b border-shingle-200">
                  <th scope="col" className="p-2">Date</th>
                  <th scope="col" className="p-2">Transect</th>
                  <th scope="col" className="p-2">Species</th>
                  <th scope="col" className="p-2">Count</th>
                  <th scope="col" className="p-2">Recorder</th>
                  <th scope="col" className="p-2">Worth a look</th>
                </tr>
              </thead>
              <tbody>
                {queue.map((r) => (
                  <tr key={r.id} className="border-b border-shingle-100">
                    <td className="p-2 whitespace-nowrap">{r.visitDate}</td>
                    <td className="p-2 font-mono">{r.transectCode}</td>
                    <td className="p-2">{r.vernacularName} <i className="text-shingle-600">{r.scientificName}</i></td>
                    <td className="p-2">{r.count}</td>
                    <td className="p-2">{r.recorder}{walkSourceText({ ...r, recorder: null }) && <span className="block text-sm text-shingle-600">{walkSourceText({ ...r, recorder: null })}</span>}</td>
                    <td className="p-2 text-sm">{r.flags.join(", ") || "—"}</td>
                  </tr>
                ))}
              </tbody>
            </table>
          </div>
        )}
      </section>
    </div>
  );
}
