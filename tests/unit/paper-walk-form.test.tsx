import { fireEvent, render, screen, waitFor } from "@testing-library/react";
import { afterEach, describe, expect, it, vi } from "vitest";
import { PaperWalkForm } from "@/components/review/paper-walk-form";
import type { PaperWalkChoices } from "@/lib/queries/paper-walks";

const ids = { sam: "11111111-1111-4111-8111-111111111111", ruth: "22222222-2222-4222-8222-222222222222", t1: "33333333-3333-4333-8333-333333333333", t2: "44444444-4444-4444-8444-444444444444", peacock: "55555555-5555-4555-8555-555555555555" };
const choices: PaperWalkChoices = {
  volunteers: [{ id: ids.sam, name: "Sam Okonjo", transectIds: [ids.t1] }, { id: ids.ruth, name: "Ruth Penhallow", transectIds: [] }],
  transects: [{ id: ids.t1, code: "CHK-01", name: "Beacon Down", sectionCount: 6 }, { id: ids.t2, code: "WDR-01", name: "Hazelhurst Ride", sectionCount: 5 }],
  checklist: [{ id: ids.peacock, scientificName: "Aglais io", vernacularName: "Peacock", taxonRank: "species", sensitive: false }],
};

afterEach(() => vi.unstubAllGlobals());

describe("the paper walk form", () => {
  it("asks for the volunteer, transect, date, start time and the complete-list answer before sending anything", async () => {
    const fetchMock = vi.fn();
    vi.stubGlobal("fetch", fetchMock);
    render(<PaperWalkForm choices={choices} />);
    fireEvent.click(screen.getByRole("button", { name: "Save the walk" }));
    expect(await screen.findByText("Choose the volunteer who walked it.")).toBeTruthy();
    expect(screen.getByText("Say whether every species seen was written down.")).toBeTruthy();
    expect(screen.getByText("Choose the transect.")).toBeTruthy();
    expect(fetchMock).not.toHaveBeenCalled();
  });

  it("finds the volunteer by name, lists their transects first, adds a species from the checklist search and sends the walk", async () => {
    const fetchMock = vi.fn(async () => Response.json({ created: { visitId: "66666666-6666-4666-8666-666666666666", sightings: 1 } }));
    vi.stubGlobal("fetch", fetchMock);
    render(<PaperWalkForm choices={choices} />);
    fireEvent.change(screen.getByLabelText("Find the volunteer by name"), { target: { value: "ruth" } });
    expect(screen.queryByRole("option", { name: "Sam Okonjo" })).toBeNull();
    fireEvent.change(screen.getByLabelText("Find the volunteer by name"), { target: { value: "" } });
    fireEvent.change(screen.getByLabelText("Volunteer"), { target: { value: ids.sam } });
    await waitFor(() => expect(screen.getByRole("group", { name: "Their transects" })).toBeTruthy());
    fireEvent.change(screen.getByLabelText("Transect"), { target: { value: ids.t1 } });
    fireEvent.change(screen.getByLabelText("Date"), { target: { value: "2026-06-20" } });
    fireEvent.change(screen.getByLabelText("Start time"), { target: { value: "10:30" } });
    fireEvent.click(screen.getByLabelText("No, only some"));
    fireEvent.change(screen.getByLabelText("Sunshine, % of the walk (optional)"), { target: { value: "70" } });
    fireEvent.change(screen.getByLabelText("Rain (optional)"), { target: { value: "light" } });
    fireEvent.change(screen.getByLabelText(/Add a species/), { target: { value: "peac" } });
    fireEvent.click(screen.getByRole("button", { name: /Peacock/ }));
    fireEvent.change(screen.getByLabelText("Count"), { target: { value: "3" } });
    fireEvent.click(screen.getByRole("button", { name: "Save the walk" }));
    expect(await screen.findByText(/Saved the walk of Sam Okonjo on 2026-06-20 with 1 sightings/)).toBeTruthy();
    const [url, init] = fetchMock.mock.calls[0] as unknown as [string, RequestInit];
    expect(url).toBe("/api/review/paper-walks");
    expect(JSON.parse(init.body as string)).toMatchObject({ volunteerId: ids.sam, transectId: ids.t1, completeList: "no", sunshinePercent: 70, rain: "light", sightings: [{ speciesId: ids.peacock, count: 3, section: null }] });
  });

  it("shows the server's refusal, and nothing is lost from the form", async () => {
    vi.stubGlobal("fetch", vi.fn(async () => Response.json({ error: { code: "forbidden", message: "The 2025 season is frozen: its grace period is over. Only an organiser can still enter a walk into it." } }, { status: 403 })));
    render(<PaperWalkForm choices={choices} />);
    fireEvent.change(screen.getByLabelText("Volunteer"), { target: { value: ids.ruth } });
    fireEvent.change(screen.getByLabelText("Transect"), { target: { value: ids.t2 } });
    fireEvent.change(screen.getByLabelText("Date"), { target: { value: "2025-07-10" } });
    fireEvent.change(screen.getByLabelText("Start time"), { target: { value: "10:30" } });
    fireEvent.click(screen.getByLabelText("Yes, a complete list"));
    fireEvent.click(screen.getByRole("button", { name: "Save the walk" }));
    expect((await screen.findByRole("alert")).textContent).toContain("frozen");
    expect((screen.getByLabelText("Date") as HTMLInputElement).value).toBe("2025-07-10");
  });
});
