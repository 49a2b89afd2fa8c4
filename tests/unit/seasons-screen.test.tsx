import { QueryClient, QueryClientProvider } from "@tanstack/react-query";
import { fireEvent, render, screen, waitFor, within } from "@testing-library/react";
import { afterEach, describe, expect, it, vi } from "vitest";
import { SeasonsManager } from "@/app/(network)/network/seasons/seasons-manager";

const open = { id: "11111111-1111-4111-8111-111111111111", name: "2026 season", startsOn: "2026-04-01", endsOn: "2026-09-30", status: "open", targetVisits: 8, minVisits: 4, phase: "open", graceEndsAt: null, walks: 12 };
const frozen = { id: "22222222-2222-4222-8222-222222222222", name: "2025 season", startsOn: "2025-04-01", endsOn: "2025-09-30", status: "closed", targetVisits: 8, minVisits: 4, phase: "frozen", graceEndsAt: "2025-10-31T18:00:00.000Z", walks: 40 };

type Call = { url: string; method: string; body: unknown };

function serve(answer: (call: Call) => Response) {
  const calls: Call[] = [];
  vi.stubGlobal("fetch", vi.fn(async (url: string, init?: RequestInit) => {
    const call = { url, method: init?.method ?? "GET", body: init?.body ? JSON.parse(String(init.body)) : undefined };
    calls.push(call);
    return call.method === "GET" ? Response.json({ seasons: [open, frozen], graceDays: 30 }) : answer(call);
  }));
  render(<QueryClientProvider client={new QueryClient()}><SeasonsManager /></QueryClientProvider>);
  return calls;
}

afterEach(() => vi.unstubAllGlobals());

describe("the seasons page", () => {
  it("shows each season's phase in words and what it means for volunteers", async () => {
    serve(() => Response.json({}));
    const list = await screen.findByRole("list", { name: "Seasons, newest first" });
    const items = within(list).getAllByRole("listitem");
    expect(items).toHaveLength(2);
    expect(items[0]!.textContent).toContain("Open for walks");
    expect(items[1]!.textContent).toContain("Closed and frozen");
    // A closed season offers no move: seasons never reopen.
    expect(within(items[1]!).queryByRole("button", { name: /Open the|Close the/ })).toBeNull();
    expect((screen.getByLabelText("Days after closing") as HTMLInputElement).value).toBe("30");
  });

  it("creates a season with the values typed, as numbers", async () => {
    const calls = serve(() => Response.json({ season: {} }, { status: 201 }));
    await screen.findByRole("list", { name: "Seasons, newest first" });
    const form = screen.getByRole("heading", { name: "New season" }).closest("section")!;
    fireEvent.change(within(form).getByLabelText("Name"), { target: { value: "2027 season" } });
    fireEvent.change(within(form).getByLabelText("First day"), { target: { value: "2027-04-01" } });
    fireEvent.change(within(form).getByLabelText("Last day"), { target: { value: "2027-09-30" } });
    fireEvent.change(within(form).getByLabelText("Target walks per transect"), { target: { value: "10" } });
    fireEvent.click(within(form).getByRole("button", { name: "Create season" }));
    await waitFor(() => expect(calls.filter((c) => c.method === "POST")).toHaveLength(1));
    expect(calls.find((c) => c.method === "POST")).toEqual({
      url: "/api/network/seasons",
      method: "POST",
      body: { name: "2027 season", startsOn: "2027-04-01", endsOn: "2027-09-30", targetVisits: 10, minVisits: 4 },
    });
  });

  it("refuses an end before the start in the form, and shows the server's overlap message on its field", async () => {
    const calls = serve(() => Response.json({ error: { code: "invalid", message: "Check the fields.", fields: { startsOn: ["These dates overlap the 2026 season (2026-04-01 to 2026-09-30). Seasons never share a day."] } } }, { status: 400 }));
    await screen.findByRole("list", { name: "Seasons, newest first" });
    const form = screen.getByRole("heading", { name: "New season" }).closest("section")!;
    fireEvent.change(within(form).getByLabelText("Name"), { target: { value: "Overlapping" } });
    fireEvent.change(within(form).getByLabelText("First day"), { target: { value: "2026-09-01" } });
    fireEvent.change(within(form).getByLabelText("Last day"), { target: { value: "2026-08-01" } });
    fireEvent.click(within(form).getByRole("button", { name: "Create season" }));
    expect(await within(form).findByText("The season cannot end before it starts.")).toBeTruthy();
    expect(calls.filter((c) => c.method === "POST")).toHaveLength(0);
    fireEvent.change(within(form).getByLabelText("Last day"), { target: { value: "2026-12-01" } });
    fireEvent.click(within(form).getByRole("button", { name: "Create season" }));
    expect(await within(form).findByText(/overlap the 2026 season/)).toBeTruthy();
  });

  it("asks before closing, says what closing means, then posts the move", async () => {
    const calls = serve(() => Response.json({ season: { ...open, status: "closed" } }));
    await screen.findByRole("list", { name: "Seasons, newest first" });
    fireEvent.click(screen.getByRole("button", { name: "Close the 2026 season…" }));
    const ask = screen.getByRole("group", { name: "Close the 2026 season" });
    expect(ask.textContent).toContain("still taken for 30 days");
    expect(ask.textContent).toContain("cannot be reopened");
    expect(calls.filter((c) => c.method === "POST")).toHaveLength(0);
    fireEvent.click(within(ask).getByRole("button", { name: "Yes, close it" }));
    await waitFor(() => expect(calls.some((c) => c.method === "POST" && c.url === `/api/network/seasons/${open.id}/close`)).toBe(true));
  });

  it("sends only the fields changed when editing", async () => {
    const calls = serve(() => Response.json({ season: open }));
    await screen.findByRole("list", { name: "Seasons, newest first" });
    fireEvent.click(screen.getByRole("button", { name: "Edit 2026 season" }));
    const dates = screen.getAllByLabelText("First day")[0] as HTMLInputElement;
    expect(dates.readOnly).toBe(true);
    fireEvent.change(screen.getAllByLabelText("Target walks per transect")[0]!, { target: { value: "9" } });
    fireEvent.click(screen.getByRole("button", { name: "Save season" }));
    await waitFor(() => expect(calls.some((c) => c.method === "PATCH")).toBe(true));
    expect(calls.find((c) => c.method === "PATCH")).toEqual({ url: `/api/network/seasons/${open.id}`, method: "PATCH", body: { targetVisits: 9 } });
  });
});
