import { phoneStore } from "./phone-store";
import { isPassingFault } from "./server-answers";

// The safety acknowledgement is the volunteer's, kept on the server (users.accepted_safety_at,
// through POST /api/field/safety). The phone keeps it under the volunteer's own key: at once, so
// the first walk can start with no signal, and until the server has it (a sync pass sends it).
// The server keeps the first time it is told, so sending again is harmless.

export type SafetyOnPhone = { acceptedAt: string; sent: boolean };

const keyFor = (userId: string) => `safety-accepted:${userId}`;

export async function safetyAcceptedOnPhone(userId: string): Promise<SafetyOnPhone | null> {
  return ((await phoneStore().meta.get(keyFor(userId)))?.value as SafetyOnPhone | undefined) ?? null;
}

/** How sending it went: nothing to send, sent, try later, sign in first, or refused for good. */
export type SafetySend = "nothing" | "sent" | "retry" | "signed-out" | "refused";

export async function sendSafetyAcceptance(userId: string, fetcher: typeof fetch = fetch): Promise<SafetySend> {
  const waiting = await safetyAcceptedOnPhone(userId);
  if (!waiting || waiting.sent) return "nothing";
  let res: Response;
  try {
    res = await fetcher("/api/field/safety", {
      method: "POST",
      credentials: "same-origin",
      headers: { "Content-Type": "application/json" },
      body: JSON.stringify({ acceptedAt: waiting.acceptedAt }),
    });
  } catch {
    return "retry";
  }
  if (res.ok) {
    await phoneStore().meta.put({ key: keyFor(userId), value: { ...waiting, sent: true } });
    return "sent";
  }
  if (res.status === 401) return "signed-out";
  if (isPassingFault(res.status)) return "retry";
  // The server will never take this one: forget it, so the notice is asked again and sent afresh.
  await phoneStore().meta.delete(keyFor(userId));
  return "refused";
}

/** "I have read this and will take care": kept on the phone now, sent now if there is a signal. */
export async function acceptSafety(userId: string, fetcher: typeof fetch = fetch): Promise<void> {
  if (!(await safetyAcceptedOnPhone(userId))) {
    await phoneStore().meta.put({ key: keyFor(userId), value: { acceptedAt: new Date().toISOString(), sent: false } satisfies SafetyOnPhone });
  }
  await sendSafetyAcceptance(userId, fetcher);
}
