"use client";

import { SafetyNotice } from "@/components/safety/safety-notice";
import { phoneStore } from "@/lib/offline/phone-store";
import { useLive } from "./use-live";

const KEY = "safety-acknowledged-at";

/** Before a volunteer's first visit on this phone, the safety notice must be read and acknowledged. */
export function SafetyGate({ children }: { children: React.ReactNode }) {
  const acknowledged = useLive(async () => (await phoneStore().meta.get(KEY)) ?? null, []);
  if (acknowledged === undefined) return <p>Loading…</p>;
  if (acknowledged) return <>{children}</>;
  return (
    <div className="space-y-4">
      <h1 className="text-2xl font-bold text-tideline-800">Before your first walk</h1>
      <SafetyNotice />
      <button type="button" className="btn-primary w-full" onClick={() => void phoneStore().meta.put({ key: KEY, value: new Date().toISOString() })}>
        I have read this and will take care
      </button>
    </div>
  );
}
