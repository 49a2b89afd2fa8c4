import { act, fireEvent, render, screen, waitFor, within } from "@testing-library/react";
import { afterAll, afterEach, beforeAll, describe, expect, it, vi } from "vitest";
import SightingMap from "@/components/review/queue/sighting-map";
import { byId, detailOf, openRow, posts, renderQueue, rows, serveApi } from "./review-fixtures";

vi.mock("next/navigation", async () => (await import("./review-navigation")).navigation);
vi.mock("@/components/review/queue/lazy-map", () => ({ SightingMap: ({ label }: { label: string }) => <div role="region" aria-label={label} /> }));

afterEach(() => {
  vi.unstubAllGlobals();
  delete (window as { matchMedia?: unknown }).matchMedia;
});

/** A phone-sized screen: narrower than the 64rem where list and sighting sit side by side. */
function phoneScreen() {
  window.matchMedia = ((query: string) => ({ matches: false, media: query, addEventListener: () => {}, removeEventListener: () => {} })) as unknown as typeof window.matchMedia;
}

describe("on a phone-sized screen", () => {
  it("the open sighting takes the whole page, with a way back to the list, and after a decision the next one opens with the focus on its heading", async () => {
    phoneScreen();
    const calls = serveApi({ action: (id) => ({ row: { ...rows.find((r) => r.id === id)!, status: "accepted", revision: 20 } }) });
    await renderQueue();
    const list = screen.getByRole("region", { name: "Sightings" });
    expect(list.className).not.toMatch(/(^| )hidden /);
    await openRow(/^Small Copper/);
    // The list and the filters give way (hidden below the lg breakpoint) to the sighting.
    expect(list.className).toMatch(/(^| )hidden lg:block/);
    expect(screen.getByRole("search", { name: "Filter the sightings" }).parentElement!.className).toMatch(/hidden lg:block/);
    fireEvent.click(within(screen.getByTestId("sighting-detail")).getByRole("button", { name: "Confirm" }));
    await waitFor(() => expect(screen.getByTestId("sighting-detail").dataset.sightingId).toBe(byId("e").id));
    await waitFor(() => expect(document.activeElement).toBe(within(screen.getByTestId("sighting-detail")).getByRole("heading", { level: 2 })));
    expect(posts(calls)).toHaveLength(1);
    fireEvent.click(screen.getByRole("button", { name: /Back to the list/ }));
    await waitFor(() => expect(screen.queryByTestId("sighting-detail")).toBeNull());
    expect(list.className).not.toMatch(/(^| )hidden /);
  });
});

// jsdom lays nothing out: the map's container is given a size for Leaflet (as in geo-map-tiles.test.tsx).
const sized = ["clientWidth", "clientHeight"] as const;
describe("the sighting's map", () => {
  beforeAll(() => {
    for (const p of sized) Object.defineProperty(HTMLElement.prototype, p, { configurable: true, get: () => 256 });
  });
  afterAll(() => {
    for (const p of sized) delete (HTMLElement.prototype as unknown as Record<string, unknown>)[p];
  });

  it("draws the route and the sighting's position on the plain background when there are no tiles", () => {
    const d = detailOf(byId("d"));
    const { container } = render(<SightingMap route={d.route} position={d.position} tileUrl={null} label="Map of MSH-01" />);
    expect(container.querySelectorAll("img.leaflet-tile")).toHaveLength(0);
    expect(screen.getByRole("region", { name: "Map of MSH-01" }).dataset.tiles).toBe("off");
    // The route line, the accuracy circle and the position's marker.
    expect(container.querySelectorAll(".leaflet-overlay-pane path")).toHaveLength(3);
    expect(screen.getByText(/routes are drawn on a plain background/)).toBeInTheDocument();
  });

  it("keeps drawing the route when the tiles fail to load", async () => {
    const d = detailOf(byId("d"), { position: null });
    const { container } = render(<SightingMap route={d.route} position={d.position} tileUrl="https://tiles.example.invalid/{z}/{x}/{y}.png" label="Map of MSH-01" />);
    const tile = container.querySelector("img.leaflet-tile");
    expect(tile).not.toBeNull();
    await act(async () => {
      tile!.dispatchEvent(new Event("error"));
    });
    expect(container.querySelectorAll("img.leaflet-tile")).toHaveLength(0);
    expect(container.querySelectorAll(".leaflet-overlay-pane path")).toHaveLength(1);
  });
});
