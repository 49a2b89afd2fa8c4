"use client";

import { useQuery } from "@tanstack/react-query";
import Link from "next/link";
import { roleLabel } from "@/lib/auth/roles";
import { walkSourceText } from "@/lib/import/walk-source";
import { api, peopleKeys, type PersonAnswer } from "../people-api";
import { AssignmentsPanel } from "./assignments-panel";
import { ErasurePanel } from "./erasure-panel";
import { RolesForm } from "./roles-form";

/** One person: roles and access, transects, walks this season, history, erasure. */
export function PersonEditor({ id }: { id: string }) {
  const { data, error, isPending } = useQuery({ queryKey: peopleKeys.person(id), queryFn: () => api<PersonAnswer>(`/api/network/people/${id}`) });
  if (isPending) return <p role="status">Loading…</p>;
  if (error) return <p role="alert" className="font-bold text-rust-700">{error.message}</p>;
  const { person, transects, season, walks } = data;
  return (
    <div className="space-y-6">
      <p><Link href="/network/people" className="font-bold text-tideline-700">← People</Link></p>
      <h1 className="text-2xl font-bold text-tideline-800">{person.name}</h1>
      <p>
        {person.erased ? "Erased on request." : person.email} · {person.roles.map((r) => roleLabel[r]).join(", ")} · {person.erased ? "" : person.active ? "Active" : "Deactivated"} · pseudonym {person.pseudonym}
      </p>
      {!person.erased && <RolesForm person={person} />}
      {!person.erased && person.roles.includes("volunteer") && <AssignmentsPanel person={person} assigned={transects} />}
      <section aria-labelledby="walks-heading" className="card">
        <h2 id="walks-heading" className="mb-2 text-xl font-bold">{season ? `Walks in ${season.name}` : "Walks this season"}</h2>
        {walks.length === 0 ? (
          <p>{season ? "No walks this season yet." : "There is no season yet."}</p>
        ) : (
          <table className="w-full border-collapse text-left">
            <thead>
              <tr className="border-b border-shingle-200">
                <th scope="col" className="p-2">Date</th>
                <th scope="col" className="p-2">Transect</th>
                <th scope="col" className="p-2">Sightings</th>
                <th scope="col" className="p-2">Waiting for review</th>
                <th scope="col" className="p-2">Every species recorded</th>
                <th scope="col" className="p-2">Entered by / imported</th>
              </tr>
            </thead>
            <tbody>
              {walks.map((w) => (
                <tr key={w.id} className="border-b border-shingle-100">
                  <td className="p-2 whitespace-nowrap">{w.date}</td>
                  <td className="p-2 font-mono">{w.transectCode}</td>
                  <td className="p-2">{w.sightings === 0 ? "nothing seen" : w.sightings}</td>
                  <td className="p-2">{w.waiting}</td>
                  <td className="p-2">{w.completeList ? "yes" : "no"}</td>
                  <td className="p-2 text-sm">{walkSourceText({ ...w, recorder: person.name }) ?? "from their phone"}</td>
                </tr>
              ))}
            </tbody>
          </table>
        )}
      </section>
      <p className="flex flex-wrap gap-4">
        <Link href={`/network/history?entity=person&id=${person.id}`} className="font-bold text-tideline-700">History of this person</Link>
        <Link href={`/network/history?entity=assignment&id=${person.id}`} className="font-bold text-tideline-700">History of their assignments</Link>
      </p>
      {!person.erased && <ErasurePanel person={person} />}
    </div>
  );
}
