import "fake-indexeddb/auto"; // before dexie loads, so it finds an IndexedDB
import { fireEvent, render, screen, waitFor, within } from "@testing-library/react";
import { beforeEach, describe, expect, it, vi } from "vitest";
import { SightingForm } from "@/components/field/visit/sighting-form";
import { phoneStore } from "@/lib/offline/phone-store";
import { addPhoto, addSighting, createVisit } from "@/lib/offline/records";
import { fieldReference, freshFieldDb, jpeg, meadowBrown, stubObjectUrls, transectA } from "./field-fixtures";

const { checklist } = fieldReference();

async function draftVisit() {
  return createVisit({ transectId: transectA, visitDate: "2026-07-02", startTime: "10:30", temperatureC: 18, windBeaufort: 2, cloudCoverPercent: null, sky: null, coRecorders: null });
}

function renderForm(visitId: string, extra: Partial<Parameters<typeof SightingForm>[0]> = {}) {
  const onDone = vi.fn();
  const view = render(<SightingForm visitId={visitId} checklist={checklist} seenHere={[]} sectionCount={8} onDone={onDone} {...extra} />);
  return { onDone, ...view };
}

function chooseSpecies(name: string) {
  fireEvent.change(screen.getByRole("searchbox", { name: "Species" }), { target: { value: name } });
  fireEvent.click(within(screen.getByRole("list", { name: "Matching species" })).getAllByRole("button")[0]!);
}

function attach(...files: File[]) {
  fireEvent.change(screen.getByLabelText("Photos (optional)"), { target: { files } });
}

describe("sighting form", () => {
  let urls: ReturnType<typeof stubObjectUrls>;
  beforeEach(() => {
    freshFieldDb();
    urls = stubObjectUrls();
  });

  it("stores one sighting and one copy of its photo when Save is tapped twice quickly", async () => {
    const visitId = await draftVisit();
    const { onDone } = renderForm(visitId);
    chooseSpecies("Meadow");
    attach(jpeg("brown.jpg"));
    const save = screen.getByRole("button", { name: "Save sighting" });
    fireEvent.click(save);
    fireEvent.click(save);
    expect(save).toBeDisabled();
    await waitFor(() => expect(onDone).toHaveBeenCalledTimes(1));
    expect(await phoneStore().sightings.count()).toBe(1);
    expect(await phoneStore().photos.count()).toBe(1);
  });

  it("shows a chosen photo as a thumbnail that can be removed before saving", async () => {
    const visitId = await draftVisit();
    const { onDone } = renderForm(visitId);
    chooseSpecies("Meadow");
    attach(jpeg("first.jpg"), jpeg("second-one.jpg"));
    const thumbs = screen.getAllByRole("img");
    expect(thumbs.map((i) => i.getAttribute("src"))).toEqual(["blob:test/1", "blob:test/2"]);
    fireEvent.click(screen.getByRole("button", { name: "Remove Photo 1 (new)" }));
    expect(screen.getAllByRole("img")).toHaveLength(1);
    // The removed thumbnail's object URL is let go as soon as it leaves the screen.
    expect(urls.revoked).toEqual(["blob:test/1"]);
    fireEvent.click(screen.getByRole("button", { name: "Save sighting" }));
    await waitFor(() => expect(onDone).toHaveBeenCalled());
    const stored = await phoneStore().photos.toArray();
    expect(stored).toHaveLength(1);
    expect(stored[0]!.bytes).toBe(jpeg("second-one.jpg").size); // the one not removed
  });

  it("shows a stored photo when changing a record, removes it only on Save, and lets go of object URLs on unmount", async () => {
    const visitId = await draftVisit();
    const sightingId = await addSighting(visitId, { speciesId: meadowBrown, count: 2, section: 1, latitude: null, longitude: null, accuracyMetres: null, note: null });
    await addPhoto(visitId, sightingId, jpeg("kept.jpg"));
    const editing = (await phoneStore().sightings.get(sightingId))!;

    // Removing then cancelling keeps the photo.
    const first = renderForm(visitId, { editing });
    await screen.findByRole("img", { name: "Photo 1" });
    fireEvent.click(screen.getByRole("button", { name: "Remove Photo 1" }));
    expect(screen.queryByRole("img")).toBeNull();
    fireEvent.click(screen.getByRole("button", { name: "Cancel" }));
    first.unmount();
    expect(await phoneStore().photos.count()).toBe(1);

    // Removing then saving deletes it from the phone.
    const second = renderForm(visitId, { editing });
    await screen.findByRole("img", { name: "Photo 1" });
    fireEvent.click(screen.getByRole("button", { name: "Remove Photo 1" }));
    fireEvent.click(screen.getByRole("button", { name: "Save sighting" }));
    await waitFor(() => expect(second.onDone).toHaveBeenCalled());
    expect(await phoneStore().photos.count()).toBe(0);
    second.unmount();
    expect(urls.made.length).toBeGreaterThan(0);
    expect([...urls.revoked].sort()).toEqual([...urls.made].sort());
  });

  it("keeps the record and says so when a photo cannot be stored, without a half-saved sighting", async () => {
    const visitId = await draftVisit();
    const { onDone } = renderForm(visitId);
    chooseSpecies("Meadow");
    attach(jpeg("brown.jpg"));
    const add = vi.spyOn(phoneStore().photos, "add").mockRejectedValueOnce(new Error("The phone's storage is full."));
    fireEvent.click(screen.getByRole("button", { name: "Save sighting" }));
    expect(await screen.findByRole("alert")).toHaveTextContent("storage is full");
    expect(onDone).not.toHaveBeenCalled();
    expect(await phoneStore().sightings.count()).toBe(0);
    // The form is usable again: a second try stores it once.
    add.mockRestore();
    fireEvent.click(screen.getByRole("button", { name: "Save sighting" }));
    await waitFor(() => expect(onDone).toHaveBeenCalledTimes(1));
    expect(await phoneStore().sightings.count()).toBe(1);
    expect(await phoneStore().photos.count()).toBe(1);
  });
});
