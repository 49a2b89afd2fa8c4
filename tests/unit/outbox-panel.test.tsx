import "fake-indexeddb/auto";
import { fireEvent, render, screen, waitFor, within } from "@testing-library/react";
import { afterEach, beforeEach, describe, expect, it, vi } from "vitest";
import { PhoneStore, phoneStore, setPhoneStore, setFieldUser, type LocalVisit } from "@/lib/offline/phone-store";

// The panel reads the controller's state; no pass should run against a real network here.
vi.mock("@/lib/offline/sync-controller", () => ({
  startSyncController: () => () => {},
  syncNow: vi.fn(async () => {}),
  onSyncState: (listener: (s: { running: boolean; last: null; nextRetryAt: number | null }) => void) => {
    listener({ running: false, last: null, nextRetryAt: null });
    return () => {};
  },
}));

import { FieldProviders } from "@/components/field/field-providers";
import { keptOnServerNote, OutboxPanel } from "@/components/field/outbox-panel";

const alice = "3d5e7f90-1a2b-4c3d-8e4f-5a6b7c8d9e0f";
const bruno = "9a8b7c6d-5e4f-4a3b-8c2d-1e0f9a8b7c6d";

function visit(id: string, ownerId: string, changes: Partial<LocalVisit>): LocalVisit {
  return {
    id, ownerId, transectId: "6f1c1f7e-2b7a-4c1e-9a55-5d2f0c7b9a10", visitDate: "2026-06-14", startTime: "10:30", endTime: "11:30", temperatureC: null,
    windBeaufort: null, cloudCoverPercent: null, sky: null, coRecorders: null, completeList: true, notes: null, phase: "submitted",
    submittedAt: "2026-06-14T11:30:00.000Z", updatedAt: "2026-06-14T11:30:00.000Z", outbox: "sent", attention: null, attempts: 0, keptOnServer: null, ...changes,
  };
}

const photo = (id: string, visitId: string, reason: string) => ({
  id, visitId, sightingId: null, blob: new Blob([new Uint8Array(8)], { type: "image/heic" }), contentType: "image/heic", bytes: 8,
  createdAt: "2026-06-14T11:00:00.000Z", outbox: "needs-attention" as const, attention: reason, attempts: 1,
});

describe("the outbox panel", () => {
  beforeEach(() => setPhoneStore(new PhoneStore(`ui-test-${crypto.randomUUID()}`)));
  afterEach(() => {
    vi.restoreAllMocks();
    setFieldUser(null);
  });

  it("words a kept-on-server answer as a note, which the volunteer can dismiss", async () => {
    expect(keptOnServerNote({ visit: true, sightings: 0 })).toMatch(/^Sent, but your later changes to the walk details were not applied: a reviewer had already reviewed it/);
    expect(keptOnServerNote({ visit: true, sightings: 2 })).toMatch(/changes to the walk details and 2 sightings were not applied/);
    expect(keptOnServerNote({ visit: true, sightings: 2 })).not.toMatch(/checker|copy|server|visit/i);
    await phoneStore().visits.add(visit("a1", alice, { keptOnServer: { visit: false, sightings: 1 } }));
    render(<FieldProviders userId={alice}><OutboxPanel /></FieldProviders>);
    expect(screen.getByRole("heading", { level: 2 })).toHaveTextContent("Sending from this phone");
    const note = await screen.findByTestId("kept-on-server");
    expect(note).toHaveTextContent("1 sighting");
    expect(note).toHaveTextContent(/^Walk on .*Sent, but your later changes to 1 sighting were not applied/);
    fireEvent.click(within(note).getByRole("button", { name: "Got it" }));
    await waitFor(() => expect(screen.queryByTestId("kept-on-server")).toBeNull());
    expect((await phoneStore().visits.get("a1"))?.keptOnServer).toBeNull();
  });

  it("shows a refused photo with its reason and removes it from the phone on request", async () => {
    await phoneStore().visits.add(visit("a1", alice, {}));
    await phoneStore().photos.add(photo("p1", "a1", "HEIC photos from this phone cannot be read yet."));
    vi.spyOn(window, "confirm").mockReturnValue(true);
    render(<FieldProviders userId={alice}><OutboxPanel /></FieldProviders>);
    const row = await screen.findByTestId("refused-photo");
    expect(row).toHaveTextContent("HEIC photos from this phone cannot be read yet.");
    fireEvent.click(within(row).getByRole("button", { name: "Remove it from this phone" }));
    await waitFor(() => expect(screen.queryByTestId("refused-photo")).toBeNull());
    expect(await phoneStore().photos.get("p1")).toBeUndefined();
  });

  it("counts and lists only the signed-in volunteer's items", async () => {
    await phoneStore().visits.bulkAdd([
      visit("a1", alice, { outbox: "on-phone" }),
      visit("b1", bruno, { outbox: "needs-attention", attention: "Not your transect." }),
      visit("b2", bruno, { outbox: "on-phone" }),
    ]);
    await phoneStore().photos.add(photo("p2", "b1", "Too large."));
    render(<FieldProviders userId={alice}><OutboxPanel /></FieldProviders>);
    await waitFor(() => expect(screen.getByTestId("outbox-on-phone")).toHaveTextContent("1"));
    expect(screen.getByTestId("outbox-needs-attention")).toHaveTextContent("0");
    expect(screen.queryByText(/Not your transect/)).toBeNull();
    expect(screen.queryByTestId("refused-photo")).toBeNull();
  });
});
