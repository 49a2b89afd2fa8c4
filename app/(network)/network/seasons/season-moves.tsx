"use client";

import { useMutation, useQueryClient } from "@tanstack/react-query";
import { useState } from "react";
import { api, seasonKeys, type SeasonRow } from "./api";

/**
 * Opening and closing, each confirmed first because neither can be undone: a season moves from
 * planning to open to closed and never back.
 */
export function SeasonMoves({ season, graceDays, anotherOpen }: { season: SeasonRow; graceDays: number; anotherOpen: SeasonRow | undefined }) {
  const queryClient = useQueryClient();
  const [asking, setAsking] = useState(false);
  const to = season.status === "planning" ? "open" : season.status === "open" ? "close" : null;
  const move = useMutation({
    mutationFn: () => api(`/api/network/seasons/${season.id}/${to}`, { method: "POST" }),
    onSuccess: async () => {
      setAsking(false);
      await queryClient.invalidateQueries({ queryKey: seasonKeys.overview });
    },
  });
  if (!to) return null;
  const verb = to === "open" ? `Open the ${season.name}` : `Close the ${season.name}`;
  const consequence =
    to === "open"
      ? `Volunteers can then record walks dated ${season.startsOn} to ${season.endsOn}, and its dates are fixed.${anotherOpen ? ` The ${anotherOpen.name} is open too; walks go to the season their date falls in.` : ""}`
      : `Walks from the season and their review are still taken for ${graceDays} day${graceDays === 1 ? "" : "s"}; after that its sightings are frozen for analysis. A closed season cannot be reopened.`;
  if (!asking) {
    return <button type="button" className="btn-quiet" onClick={() => setAsking(true)}>{verb}…</button>;
  }
  return (
    <div role="group" aria-label={verb} className="w-full space-y-2 rounded-lg border border-shingle-300 bg-shingle-50 p-3">
      <p>{consequence}</p>
      {move.error && <p role="alert" className="font-bold text-rust-700">{move.error.message}</p>}
      <div className="flex flex-wrap gap-2">
        <button type="button" className="btn-primary" disabled={move.isPending} onClick={() => move.mutate()}>{to === "open" ? "Yes, open it" : "Yes, close it"}</button>
        <button type="button" className="btn-quiet" onClick={() => setAsking(false)}>Not now</button>
      </div>
    </div>
  );
}
