"use client";

import { useMutation, useQueryClient } from "@tanstack/react-query";
import { useState } from "react";
import { ApiError, api, peopleKeys, type PersonAnswer } from "../people-api";

/** Erasure on the person's request; typed confirmation, because it cannot be undone. */
export function ErasurePanel({ person }: { person: PersonAnswer["person"] }) {
  const queryClient = useQueryClient();
  const [confirm, setConfirm] = useState("");
  const erase = useMutation({
    mutationFn: () => api(`/api/network/people/${person.id}/erasure`, { body: { confirm } }),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: peopleKeys.all }),
  });
  const problem = erase.error instanceof ApiError ? (erase.error.fields.confirm?.[0] ?? erase.error.message) : erase.error?.message;
  return (
    <section className="card space-y-3 border-rust-700" aria-labelledby="erase-heading">
      <h2 id="erase-heading" className="text-xl font-bold">Erase this person on request</h2>
      <p>
        Removes their name and e-mail everywhere, their notes and messages, their name from other people&apos;s walks, and mail to them. Their walks and sightings stay for the
        science under {person.pseudonym}. This cannot be undone.
      </p>
      <div>
        <label htmlFor="erase-confirm" className="field-label">Type {person.pseudonym} to confirm</label>
        <input id="erase-confirm" className="field-input" value={confirm} autoComplete="off" onChange={(e) => setConfirm(e.target.value)} aria-describedby={problem ? "erase-error" : undefined} />
      </div>
      <button type="button" className="btn-quiet text-rust-700" disabled={erase.isPending || confirm.trim() === ""} onClick={() => erase.mutate()}>Erase {person.name}</button>
      {problem && <p id="erase-error" role="alert" className="font-bold text-rust-700">{problem}</p>}
    </section>
  );
}
