import "fake-indexeddb/auto"; // before dexie loads, so it finds an IndexedDB
import { fireEvent, render, screen, waitFor, within } from "@testing-library/react";
import { beforeEach, describe, expect, it, vi } from "vitest";
import { StartVisitForm } from "@/components/field/visit/start-visit-form";
import { addDays } from "@/lib/effort/weeks";
import { todayLocal } from "@/lib/field/clock";
import type { FieldSeason } from "@/lib/field/season-dates";
import { phoneStore, type LocalVisit } from "@/lib/offline/phone-store";
import { createVisit } from "@/lib/offline/records";
import { DEFAULT_WALK_RULES } from "@/lib/review/walk-rules";
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

// Sunshine and rain: optional fields of the walk, handed to the walk rules' warnings as typed
// (DEFAULT_WALK_RULES: from memory, see lib/review/walk-rules.ts) and kept on the phone's walk.
describe("the start form's sunshine and rain", () => {
  const summer: FieldSeason[] = [{ name: "Test season", startsOn: addDays(today, -20), endsOn: addDays(today, 40), phase: "open" }];
  const sunshine = () => screen.getByLabelText("Sunshine (% of the walk)") as HTMLInputElement;
  const rain = () => screen.getByLabelText("Rain") as HTMLSelectElement;
  const set = (label: string, value: string) => fireEvent.change(screen.getByLabelText(label), { target: { value } });
  const warnings = () => screen.queryByRole("status")?.textContent ?? "";

  function renderWithRules(onSaved = vi.fn(), visit?: LocalVisit) {
    render(<StartVisitForm transects={reference.transects} transectId={transectA} rules={DEFAULT_WALK_RULES} seasons={summer} visit={visit} onSaved={onSaved} />);
    return onSaved;
  }

  beforeEach(() => {
    freshFieldDb();
  });

  it("offers both as optional: left blank, the walk is stored with neither", async () => {
    const onSaved = renderWithRules();
    expect(sunshine()).toHaveValue(null);
    expect(rain()).toHaveValue("");
    expect(within(rain()).getAllByRole("option").map((o) => o.textContent)).toEqual(["Not recorded", "No rain", "Light rain", "Heavy rain"]);
    start();
    await waitFor(() => expect(onSaved).toHaveBeenCalled());
    expect((await phoneStore().visits.toArray())[0]).toMatchObject({ sunshinePercent: null, rain: null });
  });

  it("stores what was entered on the phone's walk", async () => {
    const onSaved = renderWithRules();
    set("Sunshine (% of the walk)", "40");
    fireEvent.change(rain(), { target: { value: "light" } });
    start();
    await waitFor(() => expect(onSaved).toHaveBeenCalled());
    expect((await phoneStore().visits.toArray())[0]).toMatchObject({ sunshinePercent: 40, rain: "light" });
  });

  it("refuses a share of sunshine outside 0-100 or not whole, and stores nothing", async () => {
    const onSaved = renderWithRules();
    for (const value of ["101", "-1", "12.5"]) {
      set("Sunshine (% of the walk)", value);
      start();
      expect(await screen.findByText("Sunshine is a whole number from 0 to 100% of the walk.")).toBeInTheDocument();
    }
    expect(await phoneStore().visits.count()).toBe(0);
    expect(onSaved).not.toHaveBeenCalled();
    set("Sunshine (% of the walk)", "100");
    start();
    await waitFor(() => expect(onSaved).toHaveBeenCalled());
  });

  it("warns, without blocking, when 13 °C comes with less than 60 % sunshine, and not at 60 %", async () => {
    renderWithRules();
    set("Start time", "11:00");
    set("Temperature (°C)", "13");
    expect(warnings()).toBe(""); // sunshine not recorded: judged on temperature alone
    set("Sunshine (% of the walk)", "59");
    expect(warnings()).toMatch(/Cooler than the walk rules \(at least 13 °C with 60 % sunshine, or 17 °C\)/);
    set("Sunshine (% of the walk)", "60");
    expect(warnings()).toBe("");
    set("Temperature (°C)", "17");
    set("Sunshine (% of the walk)", "0");
    expect(warnings()).toBe("");
  });

  it("warns of light and heavy rain, not of none", () => {
    renderWithRules();
    set("Start time", "11:00");
    for (const [value, warned] of [["light", true], ["heavy", true], ["none", false], ["", false]] as const) {
      fireEvent.change(rain(), { target: { value } });
      expect(warnings().includes("The network's walks are made without rain."), value).toBe(warned);
    }
  });

  it("corrects a walk stored before sunshine and rain were asked: both start blank and can be added", async () => {
    const id = await createVisit({ transectId: transectA, visitDate: today, startTime: "11:00", temperatureC: 18, windBeaufort: 2, cloudCoverPercent: null, sky: null, coRecorders: null });
    // As an older version of the app stored it: no sunshine or rain keys at all.
    await phoneStore().visits.update(id, { sunshinePercent: undefined, rain: undefined });
    const stored = (await phoneStore().visits.get(id))!;
    expect("sunshinePercent" in stored).toBe(false);
    const onSaved = renderWithRules(vi.fn(), stored);
    expect(screen.getByRole("heading", { name: "Correct the walk details" })).toBeInTheDocument();
    expect(sunshine()).toHaveValue(null);
    expect(rain()).toHaveValue("");
    set("Sunshine (% of the walk)", "80");
    fireEvent.change(rain(), { target: { value: "none" } });
    fireEvent.click(screen.getByRole("button", { name: "Save details" }));
    await waitFor(() => expect(onSaved).toHaveBeenCalled());
    expect(await phoneStore().visits.get(id)).toMatchObject({ sunshinePercent: 80, rain: "none", temperatureC: 18 });
  });
});
