import { act, render, screen } from "@testing-library/react";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { MapFrame } from "@/components/map/map-frame";
import { TileCreditProvider } from "@/components/map/tile-credit";

// jsdom lays nothing out, so the map's container is given a size for Leaflet to fill with tiles
// (on HTMLElement, shadowing Element's own getters until the suite ends).
const sized = ["clientWidth", "clientHeight"] as const;

beforeAll(() => {
  for (const p of sized) Object.defineProperty(HTMLElement.prototype, p, { configurable: true, get: () => 256 });
});
afterAll(() => {
  for (const p of sized) delete (HTMLElement.prototype as unknown as Record<string, unknown>)[p];
});

const bounds: [[number, number], [number, number]] = [[51.0, -1.31], [51.01, -1.3]];
const tiles = (container: HTMLElement) => container.querySelectorAll("img.leaflet-tile");

describe("the map's background", () => {
  it("asks for no tiles at all when none are configured, and says routes are drawn on a plain background", () => {
    const { container } = render(<MapFrame tileUrl={null} bounds={bounds} fitKey={1} label="Test map">{null}</MapFrame>);
    expect(tiles(container)).toHaveLength(0);
    expect(container.querySelector(".leaflet-container")).not.toBeNull();
    expect(screen.getByText(/routes are drawn on a plain background/)).toBeTruthy();
    expect(screen.getByRole("region", { name: "Test map" }).dataset.tiles).toBe("off");
  });

  it("shows tiles from the configured template, and removes them all at the first tile that fails (no broken-image grid)", async () => {
    const { container } = render(<MapFrame tileUrl="https://tiles.example.invalid/{z}/{x}/{y}.png" bounds={bounds} fitKey={1} label="Test map">{null}</MapFrame>);
    const before = tiles(container);
    expect(before.length).toBeGreaterThan(0);
    expect((before[0] as HTMLImageElement).src).toMatch(/^https:\/\/tiles\.example\.invalid\/\d+\/\d+\/\d+\.png$/);
    expect(screen.getByRole("region", { name: "Test map" }).dataset.tiles).toBe("on");
    // What the browser does when a tile cannot load (offline, blocked): the image fires "error".
    await act(async () => {
      before[0]!.dispatchEvent(new Event("error"));
    });
    expect(tiles(container)).toHaveLength(0);
    expect(screen.getByRole("status").textContent).toMatch(/Map tiles could not load, so routes are drawn on a plain background/);
    expect(screen.getByRole("region", { name: "Test map" }).dataset.tiles).toBe("off");
  });

  it("credits the tile provider beside its tiles, as plain text (markup in the setting is not run)", () => {
    const { container } = render(
      <TileCreditProvider value={'Tiles © Example Maps <img src=x onerror="alert(1)">'}>
        <MapFrame tileUrl="https://tiles.example.invalid/{z}/{x}/{y}.png" bounds={bounds} fitKey={1} label="Test map">{null}</MapFrame>
      </TileCreditProvider>,
    );
    const credit = container.querySelector(".leaflet-control-attribution");
    expect(credit?.textContent).toContain('Tiles © Example Maps <img src=x onerror="alert(1)">');
    expect(credit?.querySelector("img")).toBeNull();
  });
});
