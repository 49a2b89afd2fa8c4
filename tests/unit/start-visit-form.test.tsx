import "fake-indexeddb/auto"; // before dexie loads, so it finds an IndexedDB
import { fireEvent, render, screen, waitFor } from "@testing-library/react";
import { beforeEach, describe, expect, it, vi } from "vitest";
import { StartVisitForm } from "@/components/field/visit/start-visit-form";
import { addDays } from "@/lib/effort/weeks";
import { todayLocal } from "@/lib/field/clock";
import type { FieldSeason } from "@/lib/field/season-dates";
import { phoneStore } from "@/lib/offline/phone-store";
import { fieldReference, freshFieldDb, transectA } from "./field-fixtures";

// The start form offers only dates inside the seasons taking walks that the phone knows (the
// server refuses any other: lib/seasons/rules.ts fieldDateVerdict) and says why a date is refused.
const reference = fieldReference();
const today = todayLocal();

function renderForm(seasons: FieldSeason[] | undefined, onSaved = vi.fn()) {
  render(<StartVisitForm transects={reference.transects} transectId={transectA} rules={reference.rules} seasons={seasons} onSaved={onSaved} />);
  return onSaved;
}

const dateInput = () => screen.getByLabelText("Date") as HTMLInputElement;
const start = () => fireEvent.click(screen.getByRole("button", { name: "Start recording" }));

describe("the start form's date", () => {
  beforeEach(() => {
    freshFieldDb();
  });

  it("runs from the season's first day to today, and refuses a date before the season with its dates named", async () => {
    const season: FieldSeason = { name: "Test season", startsOn: addDays(today, -20), endsOn: addDays(today, 40), phase: "open" };
    const onSaved = renderForm([season]);
    expect(dateInput()).toHaveAttribute("min", season.startsOn);
    expect(dateInput()).toHaveAttribute("max", today);
    expect(screen.getByText(`${season.startsOn} to ${today}`)).toBeInTheDocument();

    fireEvent.change(dateInput(), { target: { value: addDays(today, -21) } });
    start();
    expect(await screen.findByText(`Choose a date inside the Test season (${season.startsOn} to ${season.endsOn}): walks can only be dated in a season that takes them.`)).toBeInTheDocument();
    expect(await phoneStore().visits.count()).toBe(0);
    expect(onSaved).not.toHaveBeenCalled();

    fireEvent.change(dateInput(), { target: { value: addDays(today, -1) } });
    start();
    await waitFor(() => expect(onSaved).toHaveBeenCalled());
    expect((await phoneStore().visits.toArray())[0]).toMatchObject({ visitDate: addDays(today, -1), completeList: null });
  });

  it("ends at the last day of a season in its grace period, and refuses today when it lies after it", async () => {
    const grace: FieldSeason = { name: "Last season", startsOn: addDays(today, -120), endsOn: addDays(today, -10), phase: "grace" };
    renderForm([grace]);
    expect(dateInput()).toHaveAttribute("min", grace.startsOn);
    expect(dateInput()).toHaveAttribute("max", grace.endsOn);
    // Today lies after the season: refused.
    start();
    expect(await screen.findByText(/^Choose a date inside the Last season/)).toBeInTheDocument();
  });

  it("says so when the phone knows no season taking walks", async () => {
    renderForm([]);
    expect(screen.getByRole("alert")).toHaveTextContent("No season is open for walks just now");
    start();
    // And on the date itself once the volunteer tries.
    await waitFor(() => expect(screen.getAllByText(/No season is open for walks just now/)).toHaveLength(2));
    expect(await phoneStore().visits.count()).toBe(0);
  });

  it("leaves the check to the server when the phone's copy predates seasons", async () => {
    const onSaved = renderForm(undefined);
    expect(dateInput()).not.toHaveAttribute("min");
    start();
    await waitFor(() => expect(onSaved).toHaveBeenCalled());
  });
});
