import { fireEvent, screen, waitFor, within } from "@testing-library/react";
import { afterEach, describe, expect, it, vi } from "vitest";
import { byId, ids, page, posts, renderQueue, rows, serveApi } from "./review-fixtures";

vi.mock("next/navigation", async () => (await import("./review-navigation")).navigation);
vi.mock("@/components/review/queue/lazy-map", () => ({ SightingMap: ({ label }: { label: string }) => <div role="region" aria-label={label} /> }));

afterEach(() => vi.unstubAllGlobals());

const tick = (name: RegExp) => fireEvent.click(screen.getByRole("checkbox", { name }));

describe("bulk actions", () => {
  it("confirms the ticked sightings with their revisions and lists the ones left as they were, with why", async () => {
    const copper = byId("d");
    const white = byId("e");
    const calls = serveApi({ bulk: () => ({ done: 1, skipped: [{ id: copper.id, why: "has_warnings" }] }) });
    await renderQueue();
    tick(/^Select Small Copper/);
    tick(/^Select Marbled White/);
    const bar = screen.getByTestId("bulk-bar");
    expect(within(bar).getByRole("status").textContent).toBe("2 sightings selected.");
    fireEvent.click(within(bar).getByRole("button", { name: "Confirm those without warnings…" }));
    // Nothing goes until the reviewer says yes.
    expect(posts(calls)).toHaveLength(0);
    fireEvent.click(within(bar).getByRole("button", { name: "Yes, confirm them" }));
    await waitFor(() => expect(posts(calls)).toHaveLength(1));
    expect(posts(calls)[0]).toEqual({ url: "/api/review/bulk", method: "POST", body: { action: "accept", selection: { ids: [{ id: copper.id, revision: 4 }, { id: white.id, revision: 7 }] } } });
    const result = await screen.findByTestId("bulk-result");
    expect(result.textContent).toMatch(/^Done: 1 sighting\. 1 sighting left as they were:/);
    expect(within(result).getByRole("list", { name: "Left as they were" }).textContent).toBe("Small Copper, 13 Jun 2026, Ben Carrow: it has warnings: look at it on its own");
    // The selection is cleared and the list read again.
    expect(screen.queryByTestId("bulk-bar")).toBeNull();
    await waitFor(() => expect(calls.filter((c) => c.url === "/api/review/sightings").length).toBeGreaterThanOrEqual(2));
  });

  it("selects all that match the filter and sets them aside with one reason, sending the filter and when it was listed", async () => {
    const calls = serveApi({ queue: () => page(rows, { total: 4_800, listedAt: "2026-06-15T08:00:00.000Z" }), bulk: () => ({ done: 4_790, skipped: [{ id: "50000000-0000-4000-8000-0000000000ff", why: "changed" }] }) });
    await renderQueue(`/review?transect=${ids.transectDown}&warning=outside_months&sort=species`);
    fireEvent.click(screen.getByRole("checkbox", { name: "Select every sighting on this page" }));
    const bar = screen.getByTestId("bulk-bar");
    expect(within(bar).getByRole("status").textContent).toBe("6 sightings selected.");
    fireEvent.click(within(bar).getByRole("button", { name: "Select all 4,800 sightings that match the filter" }));
    expect(within(bar).getByRole("status").textContent).toBe("All 4,800 sightings that match the filter are selected.");
    fireEvent.click(within(bar).getByRole("button", { name: "Set aside with one reason…" }));
    const form = within(bar).getByRole("form", { name: "Set aside with one reason" });
    expect(within(form).getByRole("button", { name: "Set aside 4,800 sightings" })).toBeDisabled();
    fireEvent.change(within(form).getByLabelText("Reason for all 4,800 sightings"), { target: { value: "wrong_place" } });
    fireEvent.click(within(form).getByRole("button", { name: "Set aside 4,800 sightings" }));
    await waitFor(() => expect(posts(calls)).toHaveLength(1));
    expect(posts(calls)[0]!.body).toEqual({ action: "reject", selection: { filter: { status: "waiting", transect: ids.transectDown, warning: "outside_months" }, listedAt: "2026-06-15T08:00:00.000Z" }, reason: "wrong_place" });
    const result = await screen.findByTestId("bulk-result");
    expect(result.textContent).toContain("Done: 4,790 sightings.");
    expect(result.textContent).toContain("A sighting not on this page: someone changed it after the list was shown");
  });

  it("over 5,000 matching, asks to narrow the filter instead of offering them all", async () => {
    const calls = serveApi({ queue: () => page(rows, { total: 6_200 }) });
    await renderQueue();
    fireEvent.click(screen.getByRole("checkbox", { name: "Select every sighting on this page" }));
    const bar = screen.getByTestId("bulk-bar");
    expect(within(bar).queryByRole("button", { name: /that match the filter/ })).toBeNull();
    expect(bar.textContent).toContain("The filter matches 6,200 sightings; one action takes at most 5,000. Narrow the filter");
    // The six ticked can still be acted on.
    fireEvent.click(within(bar).getByRole("button", { name: "Confirm those without warnings…" }));
    fireEvent.click(within(bar).getByRole("button", { name: "Yes, confirm them" }));
    await waitFor(() => expect(posts(calls)).toHaveLength(1));
    expect((posts(calls)[0]!.body as { selection: { ids: unknown[] } }).selection.ids).toHaveLength(6);
  });

  it("shows the server's refusal and changes nothing on screen", async () => {
    serveApi({ bulk: () => Response.json({ error: { code: "invalid", message: "Some fields need attention.", fields: { "selection.ids": ["At most 5,000 sightings at once: narrow the selection."] } } }, { status: 400 }) });
    await renderQueue();
    tick(/^Select Marbled White/);
    const bar = screen.getByTestId("bulk-bar");
    fireEvent.click(within(bar).getByRole("button", { name: "Confirm those without warnings…" }));
    fireEvent.click(within(bar).getByRole("button", { name: "Yes, confirm them" }));
    expect(await within(bar).findByText("At most 5,000 sightings at once: narrow the selection.")).toBeInTheDocument();
    expect(within(bar).getByRole("status").textContent).toBe("1 sighting selected.");
    expect(screen.queryByTestId("bulk-result")).toBeNull();
  });

  it("forgets the selection when the filter changes", async () => {
    serveApi();
    await renderQueue();
    tick(/^Select Marbled White/);
    expect(screen.getByTestId("bulk-bar")).toBeInTheDocument();
    fireEvent.change(screen.getByLabelText("Volunteer"), { target: { value: ids.volunteerBen } });
    await waitFor(() => expect(screen.queryByTestId("bulk-bar")).toBeNull());
  });
});
