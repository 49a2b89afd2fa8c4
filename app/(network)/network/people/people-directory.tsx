"use client";

import { useQuery } from "@tanstack/react-query";
import Link from "next/link";
import { roleLabel } from "@/lib/auth/roles";
import { api, peopleKeys, type PeopleList } from "./people-api";

/** Everyone in the network and the invitations not yet answered, from GET /api/network/people. */
export function PeopleDirectory() {
  const { data, error, isPending } = useQuery({ queryKey: peopleKeys.list, queryFn: () => api<PeopleList>("/api/network/people") });
  if (isPending) return <p role="status">Loading people…</p>;
  if (error) return <p role="alert" className="font-bold text-rust-700">{error.message}</p>;
  return (
    <>
      {data.invitations.length > 0 && (
        <section aria-labelledby="invites-heading">
          <h2 id="invites-heading" className="mb-2 text-xl font-bold">Invitations not yet answered</h2>
          <ul className="card">
            {data.invitations.map((i) => (
              <li key={i.id}>
                {i.name} ({i.email}): {i.roles.map((r) => roleLabel[r]).join(", ")}, until {i.expiresAt.slice(0, 10)}
              </li>
            ))}
          </ul>
        </section>
      )}
      <section aria-labelledby="everyone-heading">
        <h2 id="everyone-heading" className="mb-2 text-xl font-bold">Everyone in the network</h2>
        <div className="overflow-x-auto">
          <table className="w-full border-collapse bg-white text-left">
            <thead>
              <tr className="border-b border-shingle-200">
                <th scope="col" className="p-2">Name</th>
                <th scope="col" className="p-2">E-mail</th>
                <th scope="col" className="p-2">Roles</th>
                <th scope="col" className="p-2">Transects</th>
                <th scope="col" className="p-2">Status</th>
              </tr>
            </thead>
            <tbody>
              {data.people.map((p) => (
                <tr key={p.id} className="border-b border-shingle-100">
                  <th scope="row" className="p-2">
                    <Link href={`/network/people/${p.id}`} className="inline-flex min-h-tap items-center font-bold text-tideline-700">{p.name}</Link>
                  </th>
                  <td className="p-2 break-all">{p.erased ? "—" : p.email}</td>
                  <td className="p-2">{p.roles.map((r) => roleLabel[r]).join(", ")}</td>
                  <td className="p-2 font-mono text-sm">{p.transects.map((t) => t.code).join(", ") || "—"}</td>
                  <td className="p-2">{p.erased ? "Erased" : p.active ? "Active" : "Deactivated"}</td>
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      </section>
    </>
  );
}
