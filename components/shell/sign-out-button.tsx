"use client";

import { useRef } from "react";
import type { UnsentOnPhone } from "@/lib/offline/outbox";
import { signOutAction } from "./sign-out-action";

const plural = (n: number, one: string) => `${n} ${one}${n === 1 ? "" : "s"}`;

/** The question asked before signing out with items still on the phone, or null when there are none. */
export function unsentWarning(unsent: UnsentOnPhone): string | null {
  const parts = [
    unsent.visits ? plural(unsent.visits, "walk") : null,
    unsent.sightings ? plural(unsent.sightings, "sighting") : null,
    unsent.photos ? plural(unsent.photos, "photo") : null,
    unsent.weatherReports ? plural(unsent.weatherReports, "weather report") : null,
  ].filter((p): p is string => p !== null);
  if (!parts.length) return null;
  const list = parts.length > 1 ? `${parts.slice(0, -1).join(", ")} and ${parts.at(-1)}` : parts[0];
  return `You have ${list} not sent yet. They stay on this phone and will be sent the next time you sign in on it. Sign out now?`;
}

async function readUnsent(userId: string): Promise<UnsentOnPhone | null> {
  try {
    // Loaded on demand: the phone's store is only needed here, not on every page's first load.
    const { unsentOnPhone } = await import("@/lib/offline/outbox");
    return await unsentOnPhone(userId);
  } catch {
    return null; // no store on this browser: nothing of theirs is on it
  }
}

/**
 * Signs out. For a volunteer (`phoneUserId`), asks first when they have items this phone has
 * not sent, so someone handing a shared phone on knows their records wait on it.
 */
export function SignOutButton({ phoneUserId }: { phoneUserId?: string }) {
  const confirmed = useRef(false);
  const onSubmit = (event: React.FormEvent<HTMLFormElement>) => {
    if (!phoneUserId || confirmed.current) return;
    event.preventDefault();
    const form = event.currentTarget;
    void readUnsent(phoneUserId).then((unsent) => {
      const warning = unsent && unsentWarning(unsent);
      if (warning && !window.confirm(warning)) return;
      confirmed.current = true;
      form.requestSubmit();
    });
  };
  return (
    <form action={signOutAction} onSubmit={onSubmit}>
      <button type="submit" className="btn-quiet text-sm">
        Sign out
      </button>
    </form>
  );
}
