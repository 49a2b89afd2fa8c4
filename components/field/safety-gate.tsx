"use client";

import { SafetyNotice } from "@/components/safety/safety-notice";
import { acceptSafety, safetyAcceptedOnPhone } from "@/lib/offline/safety";
import { useFieldUserId } from "./field-providers";
import { useLive } from "./use-live";

/**
 * Before a volunteer's first walk the safety notice must be read and acknowledged, by each
 * volunteer: `acceptedAt` is the server's record of this volunteer's acknowledgement (from the
 * field reference), and one made on this phone and not yet sent counts too.
 */
export function SafetyGate({ acceptedAt, children }: { acceptedAt?: string | null; children: React.ReactNode }) {
  const userId = useFieldUserId();
  const onPhone = useLive(async () => (userId ? safetyAcceptedOnPhone(userId) : null), [userId]);
  if (acceptedAt) return <>{children}</>;
  if (onPhone === undefined) return <p>Loading…</p>;
  if (onPhone) return <>{children}</>;
  return (
    <div className="space-y-4">
      <h1 className="text-2xl font-bold text-tideline-800">Before your first walk</h1>
      <SafetyNotice />
      <button type="button" className="btn-primary w-full" disabled={!userId} onClick={() => userId && void acceptSafety(userId).catch(() => undefined)}>
        I have read this and will take care
      </button>
    </div>
  );
}
