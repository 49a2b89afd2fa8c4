import { fireEvent, screen, waitFor, within } from "@testing-library/react";
import { afterEach, describe, expect, it, vi } from "vitest";
import type { QueueRow } from "@/lib/review/contract";
import { byId, detailOf, openRow, page, posts, renderQueue, rows, serveApi, type Call } from "./review-fixtures";

vi.mock("next/navigation", async () => (await import("./review-navigation")).navigation);
vi.mock("@/components/review/queue/lazy-map", () => ({ SightingMap: ({ label }: { label: string }) => <div role="region" aria-label={label} /> }));

afterEach(() => vi.unstubAllGlobals());

const detail = () => screen.getByTestId("sighting-detail");
const rowOf = (r: QueueRow) => document.querySelector<HTMLTableRowElement>(`[data-row-id="${r.id}"]`)!;
const detailGets = (calls: Call[], r: QueueRow) => calls.filter((c) => c.method === "GET" && c.url === `/api/review/sightings/${r.id}`).length;

describe("deciding one sighting", () => {
  it("confirms with the revision the row was shown at, then moves the focus to the next sighting", async () => {
    const white = byId("e");
    const calls = serveApi({ action: (id) => ({ row: { ...rows.find((r) => r.id === id)!, status: "accepted", revision: 8 } }) });
    await renderQueue();
    await openRow(/^Marbled White/);
    fireEvent.click(within(detail()).getByRole("button", { name: "Confirm" }));
    await waitFor(() => expect(posts(calls)).toHaveLength(1));
    expect(posts(calls)[0]).toEqual({ url: `/api/review/sightings/${white.id}/actions`, method: "POST", body: { action: "accept", revision: 7 } });
    // The next row is open and has the focus; the confirmed one shows its new status.
    const next = byId("f");
    await waitFor(() => expect(document.activeElement).toBe(within(rowOf(next)).getByRole("button", { name: /^Essex Skipper/ })));
    await waitFor(() => expect(detail().dataset.sightingId).toBe(next.id));
    expect(rowOf(white).textContent).toContain("Confirmed");
    expect(screen.getByTestId("review-announcement").textContent).toBe("Confirmed: Marbled White, 12 Jun 2026.");
  });

  it("sends a question with its text, and the next sighting opens", async () => {
    const calls = serveApi({ action: (id) => ({ row: { ...rows.find((r) => r.id === id)!, status: "queried", revision: 5 } }) });
    await renderQueue();
    await openRow(/^Small Copper/);
    fireEvent.click(within(detail()).getByRole("button", { name: "Ask a question" }));
    const form = within(detail()).getByRole("form", { name: "Ask the volunteer a question" });
    const box = within(form).getByLabelText("Your question");
    expect(document.activeElement).toBe(box);
    fireEvent.change(box, { target: { value: "Was it as bright on both wings?" } });
    fireEvent.click(within(form).getByRole("button", { name: "Send the question" }));
    await waitFor(() => expect(posts(calls)).toHaveLength(1));
    expect(posts(calls)[0]!.body).toEqual({ action: "query", revision: 4, message: "Was it as bright on both wings?" });
    await waitFor(() => expect(detail().dataset.sightingId).toBe(byId("e").id));
  });

  it("shows the server's field messages beside the fields, and keeps what was typed", async () => {
    const calls = serveApi({ action: () => Response.json({ error: { code: "invalid", message: "Some fields need attention.", fields: { message: ["At most 1000 characters."], reason: ["Choose a reason from the list"] } } }, { status: 400 }) });
    await renderQueue();
    await openRow(/^Small Copper/);
    fireEvent.click(within(detail()).getByRole("button", { name: "Set aside" }));
    const form = within(detail()).getByRole("form", { name: "Set it aside: not used in counts" });
    const reason = within(form).getByLabelText("Reason") as HTMLSelectElement;
    expect(document.activeElement).toBe(reason);
    // Nothing is sent without a reason.
    fireEvent.click(within(form).getByRole("button", { name: "Set aside" }));
    expect(await within(form).findByText("Choose a reason from the list")).toBeInTheDocument();
    expect(posts(calls)).toHaveLength(0);
    fireEvent.change(reason, { target: { value: "entered_twice" } });
    const note = within(form).getByLabelText(/Note/) as HTMLTextAreaElement;
    fireEvent.change(note, { target: { value: "Same as the one above." } });
    fireEvent.click(within(form).getByRole("button", { name: "Set aside" }));
    await waitFor(() => expect(posts(calls)).toHaveLength(1));
    expect(posts(calls)[0]!.body).toEqual({ action: "reject", revision: 4, reason: "entered_twice", message: "Same as the one above." });
    const message = await within(form).findByText("At most 1000 characters.");
    expect(note.getAttribute("aria-describedby")).toContain(message.closest("[id]")!.id);
    expect(within(form).getByText("Choose a reason from the list")).toBeInTheDocument();
    expect(note.value).toBe("Same as the one above.");
    // Still on the same sighting: nothing was decided.
    expect(detail().dataset.sightingId).toBe(byId("d").id);
  });

  it("on a 409 says who changed it, shows the row as it stands, refetches the sighting and stays on it", async () => {
    const copper = byId("d");
    const now = { ...copper, status: "accepted" as const, revision: 6 };
    const calls = serveApi({
      action: () => Response.json({ error: { code: "changed", message: "Someone else changed this sighting.", changedBy: "Ruth Okafor", changedAt: "2026-06-15T09:12:00.000Z" }, row: now }, { status: 409 }),
      detail: (id, n) => detailOf(n === 1 ? rows.find((r) => r.id === id)! : now),
    });
    await renderQueue();
    await openRow(/^Small Copper/);
    await within(detail()).findByText("Checked sightings of this species here, by season");
    expect(detailGets(calls, copper)).toBe(1);
    fireEvent.click(within(detail()).getByRole("button", { name: "Confirm" }));
    const alert = await within(detail()).findByText(/^Ruth Okafor changed this sighting at .*, after it was shown to you\.$/);
    expect(alert.closest("[role=alert]")!.textContent).toContain("Your action was not saved");
    expect(posts(calls)[0]!.body).toEqual({ action: "accept", revision: 4 });
    await waitFor(() => expect(within(rowOf(copper)).getAllByRole("cell").at(-1)!.textContent).toBe("Confirmed"));
    await waitFor(() => expect(detailGets(calls, copper)).toBe(2));
    expect(detail().dataset.sightingId).toBe(copper.id);
    // Decided by the other reviewer: the decisions give way to a reopen.
    await waitFor(() => expect(within(detail()).queryByRole("button", { name: "Confirm" })).toBeNull());
    expect(within(detail()).getByRole("button", { name: "Reopen" })).toBeInTheDocument();
  });

  it("corrects the species to an aggregate, and stays on the sighting to confirm it next", async () => {
    const skipper = byId("f");
    const calls = serveApi({ action: (_id, body) => ({ row: { ...skipper, revision: 10, corrected: true, species: { id: String(body.speciesId), vernacularName: "Small/Essex Skipper", scientificName: "Thymelicus sylvestris/lineola", aggregate: true } } }) });
    await renderQueue();
    await openRow(/^Essex Skipper/);
    fireEvent.click(within(detail()).getByRole("button", { name: "Correct", expanded: false }));
    const form = within(detail()).getByRole("form", { name: "Correct the species or the count" });
    fireEvent.click(within(form).getByRole("button", { name: "Correct" }));
    expect(await within(form).findByText("Choose another species or change the count.")).toBeInTheDocument();
    fireEvent.change(within(form).getByLabelText("Change the species to"), { target: { value: "skipper" } });
    const choice = await within(form).findByRole("button", { name: /Small\/Essex Skipper/ });
    expect(choice.textContent).toContain("Aggregate of Small Skipper and Essex Skipper");
    fireEvent.click(choice);
    fireEvent.change(within(form).getByLabelText(/^Note/), { target: { value: "The photo shows only the upperside." } });
    fireEvent.click(within(form).getByRole("button", { name: "Correct" }));
    await waitFor(() => expect(posts(calls)).toHaveLength(1));
    expect(posts(calls)[0]!.body).toEqual({ action: "edit", revision: 9, speciesId: "5b000001-0000-4000-8000-000000000099", message: "The photo shows only the upperside." });
    await waitFor(() => expect(within(detail()).getByRole("heading", { level: 2 }).textContent).toContain("Small/Essex Skipper"));
    expect(detail().dataset.sightingId).toBe(skipper.id);
    await waitFor(() => expect(document.activeElement).toBe(within(detail()).getByRole("heading", { level: 2 })));
    // The next action sends the revision the correction returned.
    fireEvent.click(within(detail()).getByRole("button", { name: "Confirm" }));
    await waitFor(() => expect(posts(calls)).toHaveLength(2));
    expect(posts(calls)[1]!.body).toEqual({ action: "accept", revision: 10 });
  });

  it("offers Reopen on a decided sighting only while its season allows it", async () => {
    const decided = { ...byId("e"), status: "accepted" as const };
    let canReopen = true;
    const calls = serveApi({ queue: () => page([decided]), detail: () => detailOf(decided, { canReopen }) });
    const view = await renderQueue("/review?status=accepted");
    await openRow(/^Marbled White/);
    fireEvent.click(await within(detail()).findByRole("button", { name: "Reopen" }));
    const form = within(detail()).getByRole("form", { name: "Reopen: back to waiting for review" });
    fireEvent.click(within(form).getByRole("button", { name: "Reopen" }));
    await waitFor(() => expect(posts(calls)[0]!.body).toEqual({ action: "reopen", revision: 7 }));
    view.unmount();

    canReopen = false;
    serveApi({ queue: () => page([decided]), detail: () => detailOf(decided, { canReopen }) });
    await renderQueue("/review?status=accepted");
    await openRow(/^Marbled White/);
    expect(await within(detail()).findByText(/can no longer be reopened/)).toBeInTheDocument();
    expect(within(detail()).queryByRole("button", { name: "Reopen" })).toBeNull();
  });

  it("at the end of the page, with decided sightings gone from the filter, loads the page again and opens its first", async () => {
    const last = byId("f");
    const fresh = { ...byId("a"), id: "50000000-0000-4000-8000-0000000000aa" };
    const calls = serveApi({
      queue: (_url, n) => (n === 1 ? page(rows, { total: 60 }) : page([fresh], { total: 55 })),
      action: () => ({ row: { ...last, status: "accepted", revision: 10 } }),
      detail: (id) => detailOf(id === fresh.id ? fresh : rows.find((r) => r.id === id)!),
    });
    await renderQueue();
    await openRow(/^Essex Skipper/);
    fireEvent.click(within(detail()).getByRole("button", { name: "Confirm" }));
    await waitFor(() => expect(detail().dataset.sightingId).toBe(fresh.id));
    expect(calls.filter((c) => c.url === "/api/review/sightings")).toHaveLength(2);
    expect(window.location.search).toBe("");
  });

  it("shows the walk's conditions, breaches, earlier seasons, the questions and the whole history", async () => {
    const copper = byId("d");
    serveApi({
      detail: () =>
        detailOf(copper, {
          history: [
            { id: "h1", action: "query", actor: { id: "r", name: "Ruth Okafor" }, at: "2026-06-14T10:00:00.000Z", fromStatus: "pending", toStatus: "queried", reason: null, message: "How many were fresh?", fromSpecies: null, toSpecies: null, fromCount: null, toCount: null },
            { id: "h2", action: "reply", actor: { id: "v", name: "Ben Carrow" }, at: "2026-06-14T12:00:00.000Z", fromStatus: null, toStatus: null, reason: null, message: "About half.", fromSpecies: null, toSpecies: null, fromCount: null, toCount: null },
            { id: "h3", action: "edit", actor: { id: "r", name: "Ruth Okafor" }, at: "2026-06-14T13:00:00.000Z", fromStatus: null, toStatus: null, reason: null, message: null, fromSpecies: null, toSpecies: null, fromCount: 30, toCount: 3 },
            { id: "h4", action: "reject", actor: { id: "r", name: "Ruth Okafor" }, at: "2026-06-14T14:00:00.000Z", fromStatus: "queried", toStatus: "rejected", reason: "entered_twice", message: null, fromSpecies: null, toSpecies: null, fromCount: null, toCount: null },
          ],
        }),
    });
    await renderQueue();
    await openRow(/^Small Copper/);
    const d = detail();
    await within(d).findByText("Wind above force 5");
    expect(d.textContent).toContain("19 °C");
    expect(d.textContent).toContain("Force 2 (Beaufort)");
    expect(d.textContent).toContain("70 % of the walk");
    expect(d.textContent).toContain("Yes: a complete list");
    expect(within(d).getByRole("region", { name: "Map of MSH-01 Reed Marsh with the sighting" })).toBeInTheDocument();
    const earlier = within(d).getByRole("table", { name: /Checked sightings of Small Copper/ });
    expect(within(earlier).getAllByRole("row")[1]!.textContent).toBe("2025 season493");
    const thread = within(d).getByRole("list", { name: "Questions and answers, oldest first" });
    expect(within(thread).getAllByRole("listitem").map((li) => li.textContent)).toEqual([expect.stringMatching(/^Question from Ruth Okafor.*How many were fresh\?$/), expect.stringMatching(/^Answer from Ben Carrow.*About half\.$/)]);
    const steps = within(screen.getByTestId("review-history")).getAllByRole("listitem").map((li) => li.textContent);
    expect(steps).toHaveLength(4);
    expect(steps[0]).toMatch(/^Asked a question by Ruth Okafor.*Status:Waiting for review → Question asked.*Question:How many were fresh\?/);
    expect(steps[2]).toMatch(/^Corrected by Ruth Okafor.*Count:30 → 3/);
    expect(steps[3]).toMatch(/^Set aside by Ruth Okafor.*Not used in counts.*Reason:Entered twice/);
  });
});
