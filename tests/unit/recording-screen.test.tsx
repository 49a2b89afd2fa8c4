import "fake-indexeddb/auto"; // before dexie loads, so it finds an IndexedDB
import { fireEvent, render, screen, waitFor, within } from "@testing-library/react";
import { beforeEach, describe, expect, it, vi } from "vitest";
import { RecordingScreen } from "@/components/field/visit/recording-screen";
import { phoneStore, setFieldUser } from "@/lib/offline/phone-store";
import { addSighting, createVisit, submitVisit } from "@/lib/offline/records";
import { fieldReference, freshFieldDb, meadowBrown, otherVolunteer, smallWhite, transectA, transectB } from "./field-fixtures";

// The outbox is another part's job; here it only has to be asked to run.
const syncNow = vi.hoisted(() => vi.fn());
vi.mock("@/lib/offline/sync-controller", () => ({ syncNow }));

const reference = fieldReference();

async function visitWithSightings() {
  const visitId = await createVisit({ transectId: transectA, visitDate: "2026-07-02", startTime: "10:30", temperatureC: 18, windBeaufort: 2, cloudCoverPercent: 40, sky: "broken_cloud", coRecorders: null });
  await addSighting(visitId, { speciesId: meadowBrown, count: 3, section: 1, latitude: null, longitude: null, accuracyMetres: null, note: null });
  await addSighting(visitId, { speciesId: smallWhite, count: 1, section: 6, latitude: null, longitude: null, accuracyMetres: null, note: null });
  return visitId;
}

function renderScreen(visitId: string) {
  return render(
    <RecordingScreen visitId={visitId} transectHint={null} transects={reference.transects} checklist={reference.checklist} seenByTransect={{}} rules={reference.rules} />,
  );
}

describe("recording screen", () => {
  beforeEach(() => {
    freshFieldDb();
    syncNow.mockClear();
  });

  it("asks before deleting a sighting, and keeps it when the volunteer says so", async () => {
    const visitId = await visitWithSightings();
    renderScreen(visitId);
    await screen.findByRole("button", { name: "Delete Meadow Brown" });
    fireEvent.click(screen.getByRole("button", { name: "Delete Meadow Brown" }));
    const question = screen.getByRole("alertdialog");
    expect(question).toHaveTextContent("Delete Meadow Brown × 3 from this walk?");
    // The safe answer has the focus, so pressing Enter keeps the record.
    expect(within(question).getByRole("button", { name: "Keep it" })).toHaveFocus();
    expect(await phoneStore().sightings.count()).toBe(2);
    fireEvent.click(within(question).getByRole("button", { name: "Keep it" }));
    expect(screen.queryByRole("alertdialog")).toBeNull();
    expect(await phoneStore().sightings.count()).toBe(2);

    fireEvent.click(screen.getByRole("button", { name: "Delete Meadow Brown" }));
    fireEvent.click(within(screen.getByRole("alertdialog")).getByRole("button", { name: "Yes, delete it" }));
    await waitFor(() => expect(screen.getAllByTestId("sighting-row")).toHaveLength(1));
    expect((await phoneStore().sightings.toArray()).map((s) => s.speciesId)).toEqual([smallWhite]);
  });

  it("asks before deleting the whole walk", async () => {
    const visitId = await visitWithSightings();
    renderScreen(visitId);
    fireEvent.click(await screen.findByRole("button", { name: "Delete this walk" }));
    expect(screen.getByRole("alertdialog")).toHaveTextContent("Delete this walk with its 2 sightings and 0 photos?");
    expect(await phoneStore().visits.count()).toBe(1);
    fireEvent.click(screen.getByRole("button", { name: "Keep it" }));
    expect(await phoneStore().visits.count()).toBe(1);
    // Confirming deletes it (jsdom cannot follow the page change that comes after; the store is what matters).
    fireEvent.click(screen.getByRole("button", { name: "Delete this walk" }));
    fireEvent.click(screen.getByRole("button", { name: "Yes, delete the walk" }));
    await waitFor(async () => expect(await phoneStore().visits.count()).toBe(0));
    expect(await phoneStore().sightings.count()).toBe(0);
  });

  it("lets a visit the server sent back be corrected in every field and submitted again", async () => {
    const visitId = await visitWithSightings();
    await submitVisit(visitId, { endTime: "11:45", completeList: true, notes: "Breezy on the ridge" });
    await phoneStore().visits.update(visitId, { outbox: "needs-attention", attention: "The visit date is outside the season." });
    renderScreen(visitId);

    fireEvent.click(await screen.findByRole("button", { name: "Correct it" }));
    // The start-of-visit form opens with the visit's own values.
    const form = await screen.findByRole("region", { name: "Walk details" });
    await within(form).findByLabelText("Date", {}, { timeout: 5000 }); // the form is loaded on demand
    expect(within(form).getByLabelText("Date")).toHaveValue("2026-07-02");
    expect(within(form).getByLabelText("Start time")).toHaveValue("10:30");
    expect(within(form).getByLabelText("Temperature (°C)")).toHaveValue(18);
    expect(within(form).getByLabelText("Sun and cloud")).toHaveValue("broken_cloud");
    expect(screen.getByTestId("visit-attention")).toHaveTextContent("outside the season");

    // Only the volunteer's own (assigned) transects are offered.
    const transect = within(form).getByLabelText("Transect");
    expect(within(transect).getAllByRole("option").map((o) => o.getAttribute("value"))).toEqual([transectA, transectB]);
    fireEvent.change(transect, { target: { value: transectB } });
    fireEvent.change(within(form).getByLabelText("Date"), { target: { value: "2026-07-03" } });
    fireEvent.change(within(form).getByLabelText("Start time"), { target: { value: "09:15" } });
    fireEvent.change(within(form).getByLabelText("Temperature (°C)"), { target: { value: "21.5" } });
    fireEvent.change(within(form).getByLabelText("Wind (Beaufort force)"), { target: { value: "3" } });
    fireEvent.change(within(form).getByLabelText("Cloud cover (%)"), { target: { value: "10" } });
    fireEvent.change(within(form).getByLabelText("Sun and cloud"), { target: { value: "mostly_sunny" } });
    fireEvent.change(within(form).getByLabelText("Walking with (optional)"), { target: { value: "R. Okafor" } });
    fireEvent.click(within(form).getByRole("button", { name: "Save details" }));
    await waitFor(() => expect(screen.queryByRole("region", { name: "Walk details" })).toBeNull());

    const corrected = (await phoneStore().visits.get(visitId))!;
    expect(corrected).toMatchObject({
      phase: "draft",
      transectId: transectB,
      visitDate: "2026-07-03",
      startTime: "09:15",
      temperatureC: 21.5,
      windBeaufort: 3,
      cloudCoverPercent: 10,
      sky: "mostly_sunny",
      coRecorders: "R. Okafor",
    });
    expect(window.location.search).toBe(`?id=${visitId}&transect=${transectB}`);

    // Finishing keeps what was entered last time.
    fireEvent.click(screen.getByRole("button", { name: "Finish the walk" }));
    expect(screen.getByLabelText("End time")).toHaveValue("11:45");
    // The complete-list question is asked afresh, with no answer chosen in advance.
    expect(screen.getByRole("radio", { name: "Yes, every species I could identify" })).not.toBeChecked();
    expect(screen.getByRole("radio", { name: "No, only some of them" })).not.toBeChecked();
    expect(screen.getByLabelText("Notes (optional)")).toHaveValue("Breezy on the ridge");

    // DUN-02 has 4 sections: the Small White in section 6 must be changed before it can go.
    fireEvent.click(screen.getByRole("button", { name: "Submit walk" }));
    expect(await screen.findByRole("alert")).toHaveTextContent("DUN-02 has 4 sections: change the section of Small White first.");
    expect((await phoneStore().visits.get(visitId))!.phase).toBe("draft");
    const white = (await phoneStore().sightings.toArray()).find((s) => s.speciesId === smallWhite)!;
    await phoneStore().sightings.update(white.id, { section: 2 });
    await screen.findByText(/^Section 2/);
    fireEvent.click(screen.getByRole("button", { name: "Submit walk" }));
    expect(await screen.findByRole("alert")).toHaveTextContent("Answer whether you recorded every species you saw before submitting.");
    expect((await phoneStore().visits.get(visitId))!.phase).toBe("draft");
    fireEvent.click(screen.getByRole("radio", { name: "No, only some of them" }));
    fireEvent.click(screen.getByRole("button", { name: "Submit walk" }));
    await screen.findByTestId("visit-submitted");
    expect(await phoneStore().visits.get(visitId)).toMatchObject({ phase: "submitted", outbox: "on-phone", attention: null, transectId: transectB, endTime: "11:45", completeList: false });
    expect(syncNow).toHaveBeenCalled();
  });

  it("asks at every finish whether every species was recorded, with no answer chosen in advance, and submits only once answered", async () => {
    const visitId = await createVisit({ transectId: transectA, visitDate: "2026-07-02", startTime: "10:30", temperatureC: null, windBeaufort: null, cloudCoverPercent: null, sky: null, coRecorders: null });
    expect((await phoneStore().visits.get(visitId))!.completeList).toBeNull();
    renderScreen(visitId);
    fireEvent.click(await screen.findByRole("button", { name: "Finish the walk" }));
    const question = screen.getByRole("group", { name: "Did you record every species you saw?" });
    const yes = within(question).getByRole("radio", { name: "Yes, every species I could identify" });
    const no = within(question).getByRole("radio", { name: "No, only some of them" });
    expect(yes).not.toBeChecked();
    expect(no).not.toBeChecked();
    // The review step names each of the three states.
    expect(screen.getByText(/^Review:/)).toHaveTextContent("complete list not answered yet");

    fireEvent.click(screen.getByRole("button", { name: "Submit walk" }));
    expect(await screen.findByRole("alert")).toHaveTextContent("Answer whether you recorded every species you saw before submitting.");
    expect(await phoneStore().visits.get(visitId)).toMatchObject({ phase: "draft", completeList: null });

    fireEvent.click(no);
    expect(screen.getByText(/^Review:/)).toHaveTextContent("not a complete list");
    fireEvent.click(yes);
    expect(screen.getByText(/^Review:/)).toHaveTextContent(/, complete list\.$/);
    // Going back and finishing again asks afresh.
    fireEvent.click(screen.getByRole("button", { name: "Back" }));
    fireEvent.click(screen.getByRole("button", { name: "Finish the walk" }));
    expect(screen.getByRole("radio", { name: "Yes, every species I could identify" })).not.toBeChecked();
    fireEvent.click(screen.getByRole("radio", { name: "Yes, every species I could identify" }));
    fireEvent.change(screen.getByLabelText("End time"), { target: { value: "11:30" } });
    fireEvent.click(screen.getByRole("button", { name: "Submit walk" }));
    await screen.findByTestId("visit-submitted");
    expect(await phoneStore().visits.get(visitId)).toMatchObject({ phase: "submitted", completeList: true });
  });

  it("refuses a corrected start time after the recorded end time", async () => {
    const visitId = await visitWithSightings();
    await submitVisit(visitId, { endTime: "11:45", completeList: false, notes: null });
    await phoneStore().visits.update(visitId, { outbox: "needs-attention", attention: "Check the times." });
    renderScreen(visitId);
    fireEvent.click(await screen.findByRole("button", { name: "Correct it" }));
    const form = await screen.findByRole("region", { name: "Walk details" });
    await within(form).findByLabelText("Start time", {}, { timeout: 5000 });
    fireEvent.change(within(form).getByLabelText("Start time"), { target: { value: "12:00" } });
    fireEvent.click(within(form).getByRole("button", { name: "Save details" }));
    expect(await within(form).findByRole("alert")).toHaveTextContent("The walk ended at 11:45");
    expect((await phoneStore().visits.get(visitId))!.startTime).toBe("10:30");
  });

  it("does not open another volunteer's walk on a shared phone, and offers the way back", async () => {
    const visitId = await visitWithSightings();
    setFieldUser(otherVolunteer);
    renderScreen(visitId);
    expect(await screen.findByText("This walk belongs to someone else on this phone.")).toBeInTheDocument();
    expect(screen.getByRole("link", { name: "Back to my transects" })).toHaveAttribute("href", "/field");
    // Nothing of the walk is shown, and nothing can be changed from here.
    expect(screen.queryByText(/Meadow Brown/)).toBeNull();
    expect(screen.queryByRole("button")).toBeNull();
    expect(await phoneStore().sightings.count()).toBe(2);
  });

  it("does not open a walk whose owner the phone does not know, and says where to claim it", async () => {
    const visitId = await visitWithSightings();
    await phoneStore().visits.update(visitId, { ownerId: null });
    renderScreen(visitId);
    expect(await screen.findByText(/recorded on this phone before it knew who was signed in/)).toBeInTheDocument();
    expect(screen.getByRole("link", { name: "Back to my transects" })).toHaveAttribute("href", "/field");
    expect(screen.queryByText(/Meadow Brown/)).toBeNull();
    expect(screen.queryByRole("button")).toBeNull();
  });
});
