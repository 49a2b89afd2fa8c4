"use client";

import { useState, useTransition } from "react";
import type { Role } from "@/lib/auth/roles";
import { roleLabel, roles } from "@/lib/auth/roles";
import { updatePersonAction } from "./actions";

export function PersonRow({ person }: { person: { id: string; name: string; email: string; role: Role; active: boolean } }) {
  const [role, setRole] = useState<Role>(person.role);
  const [active, setActive] = useState(person.active);
  const [message, setMessage] = useState<string | null>(null);
  const [pending, startTransition] = useTransition();
  const changed = role !== person.role || active !== person.active;

  const save = () =>
    startTransition(async () => {
      const result = await updatePersonAction({ userId: person.id, role, active });
      setMessage(result.ok ? "Saved." : (result.fieldErrors?.role?.[0] ?? result.message));
    });

  return (
    <tr className="border-b border-shingle-100">
      <th scope="row" className="p-2 text-left">{person.name}</th>
      <td className="p-2 break-all">{person.email}</td>
      <td className="p-2">
        <label className="sr-only" htmlFor={`role-${person.id}`}>Role for {person.name}</label>
        <select id={`role-${person.id}`} className="field-input mt-0" value={role} onChange={(e) => setRole(e.target.value as Role)}>
          {roles.map((r) => (
            <option key={r} value={r}>{roleLabel[r]}</option>
          ))}
        </select>
      </td>
      <td className="p-2">
        <label className="inline-flex min-h-tap items-center gap-2">
          <input type="checkbox" className="h-5 w-5" checked={active} onChange={(e) => setActive(e.target.checked)} />
          Active
        </label>
      </td>
      <td className="p-2">
        <button type="button" className="btn-quiet" disabled={!changed || pending} onClick={save}>Save</button>
        {message && <span role="status" className="ml-2 text-sm">{message}</span>}
      </td>
    </tr>
  );
}
