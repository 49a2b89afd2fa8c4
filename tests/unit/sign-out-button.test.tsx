import "fake-indexeddb/auto";
import { fireEvent, render, screen, waitFor } from "@testing-library/react";
import { afterEach, beforeEach, describe, expect, it, vi } from "vitest";
import { PhoneStore, setPhoneStore, setFieldUser } from "@/lib/offline/phone-store";
import { addSighting, createVisit } from "@/lib/offline/records";

const signOutAction = vi.hoisted(() => vi.fn(async () => {}));
vi.mock("@/components/shell/sign-out-action", () => ({ signOutAction }));

import { SignOutButton, unsentWarning } from "@/components/shell/sign-out-button";

const alice = "3d5e7f90-1a2b-4c3d-8e4f-5a6b7c8d9e0f";
const bruno = "9a8b7c6d-5e4f-4a3b-8c2d-1e0f9a8b7c6d";

async function draftBy(userId: string, sightings: number) {
  setFieldUser(userId);
  const visitId = await createVisit({ transectId: "6f1c1f7e-2b7a-4c1e-9a55-5d2f0c7b9a10", visitDate: "2026-06-14", startTime: "10:30", temperatureC: null, windBeaufort: null, cloudCoverPercent: null, sky: null, coRecorders: null });
  for (let i = 0; i < sightings; i++) await addSighting(visitId, { speciesId: "0b6f7a3c-8a35-4f3e-b6a4-1f2a3b4c5d6e", count: 1, section: null, latitude: null, longitude: null, accuracyMetres: null, note: null });
}

describe("signing out", () => {
  beforeEach(() => {
    setPhoneStore(new PhoneStore(`ui-test-${crypto.randomUUID()}`));
    signOutAction.mockClear();
  });
  afterEach(() => vi.restoreAllMocks());

  it("words the question with what is waiting", () => {
    expect(unsentWarning({ visits: 0, sightings: 0, photos: 0 })).toBeNull();
    expect(unsentWarning({ visits: 1, sightings: 0, photos: 0 })).toMatch(/^You have 1 walk not sent yet\. They stay on this phone and will be sent the next time you sign in on it\./);
    expect(unsentWarning({ visits: 2, sightings: 5, photos: 1 })).toMatch(/^You have 2 walks, 5 sightings and 1 photo not sent yet\./);
    expect(unsentWarning({ visits: 0, sightings: 0, photos: 0, weatherReports: 1 })).toMatch(/^You have 1 weather report not sent yet\./);
  });

  it("asks first when the volunteer has unsent items, and stays signed in if they say no", async () => {
    await draftBy(alice, 2);
    const confirm = vi.spyOn(window, "confirm").mockReturnValue(false);
    render(<SignOutButton phoneUserId={alice} />);
    fireEvent.click(screen.getByRole("button", { name: "Sign out" }));
    await waitFor(() => expect(confirm).toHaveBeenCalledTimes(1));
    expect(confirm.mock.calls[0]![0]).toMatch(/1 walk and 2 sightings not sent yet.*stay on this phone.*next time you sign in on it/);
    await new Promise((r) => setTimeout(r, 20));
    expect(signOutAction).not.toHaveBeenCalled();
  });

  it("signs out once the volunteer confirms", async () => {
    await draftBy(alice, 1);
    vi.spyOn(window, "confirm").mockReturnValue(true);
    render(<SignOutButton phoneUserId={alice} />);
    fireEvent.click(screen.getByRole("button", { name: "Sign out" }));
    await waitFor(() => expect(signOutAction).toHaveBeenCalledTimes(1));
  });

  it("does not ask about someone else's items, nor when nothing is waiting", async () => {
    await draftBy(bruno, 3);
    const confirm = vi.spyOn(window, "confirm").mockReturnValue(false);
    render(<SignOutButton phoneUserId={alice} />);
    fireEvent.click(screen.getByRole("button", { name: "Sign out" }));
    await waitFor(() => expect(signOutAction).toHaveBeenCalledTimes(1));
    expect(confirm).not.toHaveBeenCalled();
  });

  it("signs people without a phone outbox out at once", async () => {
    const confirm = vi.spyOn(window, "confirm");
    render(<SignOutButton />);
    fireEvent.click(screen.getByRole("button", { name: "Sign out" }));
    await waitFor(() => expect(signOutAction).toHaveBeenCalledTimes(1));
    expect(confirm).not.toHaveBeenCalled();
  });
});
