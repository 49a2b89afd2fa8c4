import { fireEvent, screen, waitFor, within } from "@testing-library/react";
import { afterEach, describe, expect, it, vi } from "vitest";
import { ids, page, queueCalls, renderQueue, rows, serveApi } from "./review-fixtures";

vi.mock("next/navigation", async () => (await import("./review-navigation")).navigation);
vi.mock("@/components/review/queue/lazy-map", () => ({ SightingMap: ({ label }: { label: string }) => <div role="region" aria-label={label} /> }));

afterEach(() => vi.unstubAllGlobals());

const lastQueueUrl = (calls: ReturnType<typeof serveApi>) => queueCalls(calls).at(-1)!.url;

describe("the queue's filters in the address", () => {
  it("reads every filter, the sort and the page from the address and asks the API for that same view", async () => {
    const calls = serveApi({ queue: () => page(rows, { total: 130, page: 2 }) });
    const address = `status=any&season=${ids.seasonNow}&transect=${ids.transectDown}&habitat=${ids.habitat}&volunteer=${ids.volunteerAsha}&from=2026-06-01&to=2026-06-30&warning=first_on_transect&sort=species&dir=asc&page=2`;
    await renderQueue(`/review?${address}`);
    expect(lastQueueUrl(calls)).toBe(`/api/review/sightings?${address}`);
    const form = screen.getByRole("search", { name: "Filter the sightings" });
    expect((within(form).getByLabelText("Status") as HTMLSelectElement).value).toBe("any");
    await waitFor(() => expect((within(form).getByLabelText("Transect") as HTMLSelectElement).selectedOptions[0]!.textContent).toBe("DWN-02 Hollow Down"));
    expect((within(form).getByLabelText("Season") as HTMLSelectElement).selectedOptions[0]!.textContent).toBe("2026 season");
    expect((within(form).getByLabelText("Warning") as HTMLSelectElement).selectedOptions[0]!.textContent).toBe("First on this transect");
    expect((within(form).getByLabelText("Walked from") as HTMLInputElement).value).toBe("2026-06-01");
    expect(screen.getByRole("columnheader", { name: /Species/ })).toHaveAttribute("aria-sort", "ascending");
    expect(screen.getByText(/Page 2 of 3/)).toBeInTheDocument();
  });

  it("writes a changed filter into the address (back to the first page) and shows that view without reloading the page", async () => {
    const calls = serveApi();
    await renderQueue("/review?page=3");
    fireEvent.change(screen.getByLabelText("Season"), { target: { value: ids.seasonBefore } });
    await waitFor(() => expect(window.location.search).toBe(`?season=${ids.seasonBefore}`));
    await waitFor(() => expect(lastQueueUrl(calls)).toBe(`/api/review/sightings?season=${ids.seasonBefore}`));
    fireEvent.change(screen.getByLabelText("Warning"), { target: { value: "walk_rules" } });
    await waitFor(() => expect(window.location.search).toBe(`?season=${ids.seasonBefore}&warning=walk_rules`));
    fireEvent.change(screen.getByLabelText("Status"), { target: { value: "answered" } });
    await waitFor(() => expect(lastQueueUrl(calls)).toBe(`/api/review/sightings?status=answered&season=${ids.seasonBefore}&warning=walk_rules`));
    // Clearing puts the default view back, which the address leaves out altogether.
    fireEvent.click(screen.getByRole("button", { name: "Clear the filters" }));
    await waitFor(() => expect(window.location.search).toBe(""));
    expect(window.location.pathname).toBe("/review");
  });

  it("sorts by a column header and pages through the server's pages, both kept in the address", async () => {
    const calls = serveApi({ queue: (url) => page(rows, { total: 120, page: Number(url.searchParams.get("page") ?? 1) }) });
    await renderQueue();
    expect(screen.getByRole("columnheader", { name: /Date/ })).toHaveAttribute("aria-sort", "descending");
    fireEvent.click(within(screen.getByRole("columnheader", { name: /Volunteer/ })).getByRole("button"));
    await waitFor(() => expect(window.location.search).toBe("?sort=volunteer&dir=asc"));
    fireEvent.click(screen.getByRole("button", { name: "Next page" }));
    await waitFor(() => expect(window.location.search).toBe("?sort=volunteer&dir=asc&page=2"));
    await waitFor(() => expect(lastQueueUrl(calls)).toBe("/api/review/sightings?sort=volunteer&dir=asc&page=2"));
    fireEvent.change(screen.getByLabelText("Per page"), { target: { value: "100" } });
    await waitFor(() => expect(window.location.search).toBe("?sort=volunteer&dir=asc&pageSize=100"));
  });

  it("leaves out, and names, a part of the address that does not parse, and keeps the rest", async () => {
    const calls = serveApi();
    await renderQueue("/review?season=not-an-id&status=accepted&warning=nonsense");
    expect(lastQueueUrl(calls)).toBe("/api/review/sightings?status=accepted");
    expect(screen.getByText(/not understood and is left out: .*season/)).toBeInTheDocument();
  });

  it("refuses an end date before the start date, and leaves the address as it was", async () => {
    serveApi();
    await renderQueue("/review?from=2026-06-10");
    fireEvent.change(screen.getByLabelText("Walked until"), { target: { value: "2026-06-01" } });
    expect(await screen.findByText("The end date is before the start date")).toBeInTheDocument();
    expect(window.location.search).toBe("?from=2026-06-10");
  });

  it("says so when the sightings cannot be loaded, and offers to try again", async () => {
    let fail = true;
    serveApi({ queue: () => (fail ? Response.json({ error: { code: "invalid", message: "Use a date such as 2026-06-14" } }, { status: 400 }) : page(rows)) });
    window.history.replaceState(null, "", "/review");
    const { render } = await import("@testing-library/react");
    const { QueryClient, QueryClientProvider } = await import("@tanstack/react-query");
    const { ReviewQueue } = await import("@/components/review/queue/review-queue");
    render(<QueryClientProvider client={new QueryClient({ defaultOptions: { queries: { retry: false } } })}><ReviewQueue tileUrl={null} /></QueryClientProvider>);
    expect(await screen.findByText(/could not be loaded: Use a date such as 2026-06-14/)).toBeInTheDocument();
    fail = false;
    fireEvent.click(screen.getByRole("button", { name: "Try again" }));
    expect(await screen.findByTestId("review-queue")).toBeInTheDocument();
  });
});
