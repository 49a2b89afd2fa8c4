"use client";

import { useMutation, useQueryClient } from "@tanstack/react-query";
import { useState } from "react";
import type { TransectDetail } from "@/lib/queries/transects";
import { api, queryKeys } from "../api";

/** Retiring asks once more; bringing a transect back does not. */
export function RetirePanel({ transect }: { transect: TransectDetail }) {
  const queryClient = useQueryClient();
  const [confirming, setConfirming] = useState(false);
  const toggle = useMutation({
    mutationFn: () => api(`/api/network/transects/${transect.id}/retire`, { method: transect.active ? "POST" : "DELETE" }),
    onSuccess: async () => {
      setConfirming(false);
      await queryClient.invalidateQueries({ queryKey: queryKeys.transect(transect.id) });
      await queryClient.invalidateQueries({ queryKey: queryKeys.transects });
    },
  });
  if (!transect.active) {
    return (
      <div className="space-y-2">
        <p>Volunteers assigned to it will see it again on their next sync.</p>
        <button type="button" className="btn-quiet" disabled={toggle.isPending} onClick={() => toggle.mutate()}>Bring {transect.code} back into use</button>
        {toggle.error && <p role="alert" className="font-bold text-rust-700">{toggle.error.message}</p>}
      </div>
    );
  }
  return (
    <div className="space-y-2">
      <p>No one records on a retired transect: it leaves volunteers&apos; phones at their next sync. Its walks, its history and its past seasons stay, and past seasons still compare.</p>
      {confirming ? (
        <div className="flex flex-wrap gap-2">
          <button type="button" className="btn-primary bg-rust-700 hover:bg-rust-700" disabled={toggle.isPending} onClick={() => toggle.mutate()}>Yes, retire {transect.code}</button>
          <button type="button" className="btn-quiet" onClick={() => setConfirming(false)}>Keep it in use</button>
        </div>
      ) : (
        <button type="button" className="btn-quiet" onClick={() => setConfirming(true)}>Retire {transect.code}…</button>
      )}
      {toggle.error && <p role="alert" className="font-bold text-rust-700">{toggle.error.message}</p>}
    </div>
  );
}
