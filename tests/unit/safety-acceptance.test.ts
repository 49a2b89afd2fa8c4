import "fake-indexeddb/auto";
import { beforeEach, describe, expect, it } from "vitest";
import { PhoneStore, setPhoneStore } from "@/lib/offline/phone-store";
import { acceptSafety, safetyAcceptedOnPhone, sendSafetyAcceptance } from "@/lib/offline/safety";
import { fieldPass } from "@/lib/offline/sync-controller";

// The safety acknowledgement is the volunteer's, kept on the server (POST /api/field/safety);
// made with no signal it waits on the phone under the volunteer's own key and goes with the next pass.
const alice = "3d5e7f90-1a2b-4c3d-8e4f-5a6b7c8d9e0f";
const bruno = "9a8b7c6d-5e4f-4a3b-8c2d-1e0f9a8b7c6d";

/** A stand-in for the safety route: records each body; `down` fails like no signal. */
function safetyServer(answer: () => Response = () => new Response(JSON.stringify({ safetyAcceptedAt: "x" }), { status: 200 })) {
  const bodies: unknown[] = [];
  let down = false;
  const fetcher = (async (url: string, init?: RequestInit) => {
    if (down) throw new TypeError("Failed to fetch");
    if (url !== "/api/field/safety" || init?.method !== "POST") throw new Error(`unexpected request ${url}`);
    expect(new Headers(init.headers).get("content-type")).toBe("application/json");
    bodies.push(JSON.parse(String(init.body)));
    return answer();
  }) as typeof fetch;
  return { fetcher, bodies, setDown: (d: boolean) => void (down = d) };
}

describe("the safety acknowledgement on the phone", () => {
  beforeEach(() => setPhoneStore(new PhoneStore(`test-${crypto.randomUUID()}`)));

  it("is kept under the volunteer's own key, so it does not count for the next volunteer", async () => {
    const server = safetyServer();
    await acceptSafety(alice, server.fetcher);
    expect(await safetyAcceptedOnPhone(alice)).not.toBeNull();
    expect(await safetyAcceptedOnPhone(bruno)).toBeNull();
  });

  it("is sent at once with a signal, with the time it was made, and only once", async () => {
    const server = safetyServer();
    const before = new Date().toISOString();
    await acceptSafety(alice, server.fetcher);
    expect(server.bodies).toHaveLength(1);
    const { acceptedAt } = server.bodies[0] as { acceptedAt: string };
    expect(acceptedAt >= before && acceptedAt <= new Date().toISOString()).toBe(true);
    expect(await sendSafetyAcceptance(alice, server.fetcher)).toBe("nothing");
    expect(server.bodies).toHaveLength(1);
  });

  it("waits on the phone with no signal or a server fault, and goes with the next pass", async () => {
    const server = safetyServer();
    server.setDown(true);
    await acceptSafety(alice, server.fetcher);
    expect(await safetyAcceptedOnPhone(alice)).toMatchObject({ sent: false });
    // A pass with nothing else to send still sends it, and asks to be retried while it cannot.
    expect((await fieldPass(alice, server.fetcher)).retryLater).toBe(true);
    server.setDown(false);
    const run = await fieldPass(alice, server.fetcher);
    expect(run.retryLater).toBe(false);
    expect(server.bodies).toHaveLength(1);
    expect(await safetyAcceptedOnPhone(alice)).toMatchObject({ sent: true });
    await fieldPass(alice, server.fetcher);
    expect(server.bodies).toHaveLength(1);
    // Another volunteer's pass never sends it for them.
    await fieldPass(bruno, server.fetcher);
    expect(server.bodies).toHaveLength(1);
  });

  it("keeps it after a 503 and a 401, and lets it go after a refusal so the notice is asked again", async () => {
    let status = 503;
    const server = safetyServer(() => new Response(JSON.stringify({ error: { code: "x", message: "x" } }), { status }));
    await acceptSafety(alice, server.fetcher);
    expect(await sendSafetyAcceptance(alice, server.fetcher)).toBe("retry");
    status = 401;
    expect(await sendSafetyAcceptance(alice, server.fetcher)).toBe("signed-out");
    expect(await safetyAcceptedOnPhone(alice)).toMatchObject({ sent: false });
    status = 400;
    expect(await sendSafetyAcceptance(alice, server.fetcher)).toBe("refused");
    expect(await safetyAcceptedOnPhone(alice)).toBeNull();
  });
});
