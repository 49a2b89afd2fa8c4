import "fake-indexeddb/auto"; // before dexie loads, so it finds an IndexedDB
import { QueryClient, QueryClientProvider } from "@tanstack/react-query";
import { fireEvent, render, screen, waitFor, within } from "@testing-library/react";
import { beforeEach, describe, expect, it, vi } from "vitest";
import { FieldHome } from "@/components/field/field-home";
import { phoneStore, setFieldUser } from "@/lib/offline/phone-store";
import { addPhoto, addSighting, createVisit, submitVisit } from "@/lib/offline/records";
import { unownedWalks } from "@/lib/offline/unowned-walks";
import { fieldReference, fieldVolunteer, freshFieldDb, meadowBrown, otherVolunteer, transectA, transectB } from "./field-fixtures";

// Walks stored before the phone kept owners belong to nobody it knows. Nothing is sent or lost
// silently: the signed-in volunteer says whether they are theirs.
const syncNow = vi.hoisted(() => vi.fn());
vi.mock("@/lib/offline/sync-controller", () => ({ syncNow, onSyncState: () => () => undefined }));

const reference = fieldReference();

/** Two walks as an older phone left them: a submitted one with a sighting and a photo, and a draft. */
async function walksWithoutOwner() {
  const submitted = await createVisit({ transectId: transectA, visitDate: "2026-05-02", startTime: "09:00", temperatureC: null, windBeaufort: null, cloudCoverPercent: null, sky: null, coRecorders: null });
  const sighting = await addSighting(submitted, { speciesId: meadowBrown, count: 2, section: 1, latitude: null, longitude: null, accuracyMetres: null, note: null });
  await addPhoto(submitted, sighting, new Blob([new Uint8Array(16)], { type: "image/jpeg" }));
  await submitVisit(submitted, { endTime: "10:00", completeList: true, notes: null });
  const draft = await createVisit({ transectId: transectB, visitDate: "2026-05-09", startTime: "11:00", temperatureC: null, windBeaufort: null, cloudCoverPercent: null, sky: null, coRecorders: null });
  await phoneStore().visits.where("id").anyOf([submitted, draft]).modify({ ownerId: null });
  return { submitted, draft };
}

function renderHome() {
  const client = new QueryClient({ defaultOptions: { queries: { retry: false } } });
  return render(
    <QueryClientProvider client={client}>
      <FieldHome firstName="Ada" initial={reference} />
    </QueryClientProvider>,
  );
}

describe("walks whose owner the phone does not know", () => {
  beforeEach(() => {
    freshFieldDb();
    syncNow.mockClear();
    vi.stubGlobal("fetch", vi.fn(async () => {
      throw new TypeError("Failed to fetch");
    }));
  });

  it("are listed on the field home in plain words, and are not shown as the volunteer's own", async () => {
    await walksWithoutOwner();
    renderHome();
    const section = await screen.findByTestId("unowned-walks");
    expect(section).toHaveTextContent("recorded on this phone before it knew who was signed in");
    expect(within(section).getAllByRole("listitem")).toHaveLength(2);
    expect(section).toHaveTextContent("2026-05-02 · DUN-01 North dunes");
    expect(section).toHaveTextContent("1 sighting, 1 photo");
    expect(section).not.toHaveTextContent(/outbox|owner|sync/i);
    expect(within(section).getByRole("button", { name: "These are mine" })).toBeInTheDocument();
    expect(within(section).getByRole("button", { name: "Not mine" })).toBeInTheDocument();
    // Not among this volunteer's walks in progress until they say so.
    expect(screen.queryByRole("heading", { name: "Walks in progress" })).toBeNull();
  });

  it("become the volunteer's own with 'These are mine', and are then sent as usual", async () => {
    const { submitted, draft } = await walksWithoutOwner();
    renderHome();
    fireEvent.click(await screen.findByRole("button", { name: "These are mine" }));
    await waitFor(() => expect(screen.queryByTestId("unowned-walks")).toBeNull());
    expect((await phoneStore().visits.get(submitted))?.ownerId).toBe(fieldVolunteer);
    expect((await phoneStore().visits.get(draft))?.ownerId).toBe(fieldVolunteer);
    // Sending starts at once; the draft is now among the volunteer's walks in progress.
    expect(syncNow).toHaveBeenCalled();
    const inProgress = await screen.findByRole("heading", { name: "Walks in progress" });
    expect(inProgress.closest("section")).toHaveTextContent("DUN-02 South slack · 2026-05-09");
  });

  it("stay on the phone with 'Not mine', hidden for this volunteer only", async () => {
    const { submitted, draft } = await walksWithoutOwner();
    const view = renderHome();
    fireEvent.click(await screen.findByRole("button", { name: "Not mine" }));
    await waitFor(() => expect(screen.queryByTestId("unowned-walks")).toBeNull());
    // Nothing is deleted, claimed or sent.
    expect((await phoneStore().visits.get(submitted))).toMatchObject({ ownerId: null, outbox: "on-phone", phase: "submitted" });
    expect((await phoneStore().visits.get(draft))?.ownerId).toBeNull();
    expect(await phoneStore().sightings.count()).toBe(1);
    expect(await phoneStore().photos.count()).toBe(1);
    expect(syncNow).not.toHaveBeenCalled();
    expect(await unownedWalks(fieldVolunteer)).toEqual([]);

    // Remembered for this volunteer (the home lists what unownedWalks gives it), and the next
    // volunteer on this phone is still asked.
    view.unmount();
    expect(await unownedWalks(fieldVolunteer)).toEqual([]);
    setFieldUser(otherVolunteer);
    expect((await unownedWalks(otherVolunteer)).map((w) => w.visit.id).sort()).toEqual([submitted, draft].sort());
    renderHome();
    expect(within(await screen.findByTestId("unowned-walks")).getAllByRole("listitem")).toHaveLength(2);
  });
});
