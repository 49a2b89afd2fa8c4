import type { Metadata } from "next";
import { requirePageActor } from "@/lib/auth/guard";
import { verifiedDataBySeason } from "@/lib/queries/partner";
import { REVIEWER } from "@/lib/review/words";

export const metadata: Metadata = { title: "Network data" };

export default async function PartnerHome() {
  await requirePageActor(["partner"], "/data");
  const seasons = await verifiedDataBySeason();
  return (
    <div className="space-y-6">
      <h1 className="text-2xl font-bold text-tideline-800">Network data</h1>
      <p>{`Only sightings a ${REVIEWER} has confirmed are counted here. Your access is read-only.`}</p>
      <div className="overflow-x-auto">
        <table className="w-full border-collapse bg-white text-left">
          <thead>
            <tr className="border-b border-shingle-200">
              <th scope="col" className="p-2">Season</th>
              <th scope="col" className="p-2">Dates</th>
              <th scope="col" className="p-2">Transects</th>
              <th scope="col" className="p-2">Walks</th>
              <th scope="col" className="p-2">Confirmed sightings</th>
              <th scope="col" className="p-2">Species</th>
            </tr>
          </thead>
          <tbody>
            {seasons.map((s) => (
              <tr key={s.id} className="border-b border-shingle-100">
                <th scope="row" className="p-2">{s.name}</th>
                <td className="p-2 whitespace-nowrap">{s.startsOn} to {s.endsOn}</td>
                <td className="p-2">{s.transects}</td>
                <td className="p-2">{s.visits}</td>
                <td className="p-2">{s.acceptedRecords}</td>
                <td className="p-2">{s.species}</td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
    </div>
  );
}
