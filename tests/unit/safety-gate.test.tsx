import "fake-indexeddb/auto"; // before dexie loads, so it finds an IndexedDB
import { fireEvent, render, screen, waitFor } from "@testing-library/react";
import { beforeEach, describe, expect, it, vi } from "vitest";
import { SafetyGate } from "@/components/field/safety-gate";
import { setFieldUser } from "@/lib/offline/phone-store";
import { fieldVolunteer, freshFieldDb, otherVolunteer } from "./field-fixtures";

// Before a volunteer's first walk the safety notice must be read and acknowledged: by each
// volunteer, not once per phone (the acknowledgement is kept on the server, users.accepted_safety_at).
const ACK = "I have read this and will take care";

function gate(acceptedAt: string | null) {
  return render(<SafetyGate acceptedAt={acceptedAt}><p>Start form</p></SafetyGate>);
}

describe("the safety gate before a walk", () => {
  let posted: { url: string; body: unknown }[];
  beforeEach(() => {
    freshFieldDb();
    posted = [];
    vi.stubGlobal("fetch", vi.fn(async (url: string, init: RequestInit) => {
      posted.push({ url, body: JSON.parse(String(init.body)) });
      return new Response(JSON.stringify({ safetyAcceptedAt: "2026-06-01T08:00:00.000Z" }), { status: 200 });
    }));
  });

  it("asks, then lets the volunteer on and tells the server", async () => {
    gate(null);
    expect(await screen.findByTestId("safety-notice")).toBeInTheDocument();
    expect(screen.queryByText("Start form")).toBeNull();
    fireEvent.click(screen.getByRole("button", { name: ACK }));
    expect(await screen.findByText("Start form")).toBeInTheDocument();
    await waitFor(() => expect(posted).toHaveLength(1));
    expect(posted[0]).toMatchObject({ url: "/api/field/safety", body: { acceptedAt: expect.stringMatching(/^\d{4}-\d\d-\d\dT/) } });
  });

  it("asks the second volunteer on the same phone too", async () => {
    const first = gate(null);
    fireEvent.click(await screen.findByRole("button", { name: ACK }));
    await screen.findByText("Start form");
    first.unmount();

    setFieldUser(otherVolunteer);
    gate(null);
    expect(await screen.findByRole("button", { name: ACK })).toBeInTheDocument();
    expect(screen.queryByText("Start form")).toBeNull();

    // And the first volunteer is not asked again.
    setFieldUser(fieldVolunteer);
    gate(null);
    expect(await screen.findAllByText("Start form")).toHaveLength(1);
  });

  it("does not ask a volunteer the server knows has acknowledged it (on another phone, say)", async () => {
    gate("2026-05-01T08:00:00.000Z");
    expect(await screen.findByText("Start form")).toBeInTheDocument();
    expect(screen.queryByTestId("safety-notice")).toBeNull();
    expect(posted).toHaveLength(0);
  });
});
