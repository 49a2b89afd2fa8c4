import { describe, expect, it } from "vitest";
import { colourHex, habitatColours, MAP_PLAIN_BACKGROUND, PAGE_BACKGROUND } from "@/lib/geo/palette";

// WCAG 2.2 §1.4.11 (non-text contrast) asks 3:1 for graphical objects such as a route line.
// Relative luminance and contrast ratio as WCAG 2.x defines them (Understanding SC 1.4.3,
// "relative luminance"): each sRGB channel c = C/255 becomes c/12.92 when c <= 0.04045, else
// ((c + 0.055)/1.055)^2.4; L = 0.2126 R + 0.7152 G + 0.0722 B; ratio = (L1 + 0.05)/(L2 + 0.05).
function luminance(hex: string): number {
  const [r, g, b] = [1, 3, 5].map((i) => parseInt(hex.slice(i, i + 2), 16) / 255).map((c) => (c <= 0.04045 ? c / 12.92 : ((c + 0.055) / 1.055) ** 2.4));
  return 0.2126 * r! + 0.7152 * g! + 0.0722 * b!;
}
function contrast(a: string, b: string): number {
  const [hi, lo] = [luminance(a), luminance(b)].sort((x, y) => y - x);
  return (hi! + 0.05) / (lo! + 0.05);
}

describe("habitat colours", () => {
  it("computes contrast as WCAG defines it (black on white is 21:1, white on white 1:1)", () => {
    expect(contrast("#000000", "#ffffff")).toBeCloseTo(21, 6);
    expect(contrast("#ffffff", "#ffffff")).toBe(1);
  });

  it.each(Object.entries(habitatColours))("%s has at least 3:1 against the map's plain background and the page", (_, colour) => {
    expect(colour.hex).toMatch(/^#[0-9a-f]{6}$/);
    expect(contrast(colour.hex, MAP_PLAIN_BACKGROUND)).toBeGreaterThanOrEqual(3);
    expect(contrast(colour.hex, PAGE_BACKGROUND)).toBeGreaterThanOrEqual(3);
  });

  it("names every colour ourselves, each name and hex once", () => {
    const colours = Object.values(habitatColours);
    expect(new Set(colours.map((c) => c.label)).size).toBe(colours.length);
    expect(new Set(colours.map((c) => c.hex)).size).toBe(colours.length);
  });

  it("draws an unknown key in slate", () => {
    expect(colourHex("kingfisher")).toBe(habitatColours.kingfisher.hex);
    expect(colourHex("no-such-colour")).toBe(habitatColours.slate.hex);
  });
});
