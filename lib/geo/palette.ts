// Turnstone's own colours for habitat groups on maps and in lists. Each is dark enough for at
// least 3:1 contrast (WCAG 2.x, non-text contrast) against the map's plain background and the
// white page, so a route line stands out on both (tests/unit/geo-palette.test.ts checks).

/** The map's background where there are no tiles (none configured, offline, or they failed). */
export const MAP_PLAIN_BACKGROUND = "#eef0ea";
export const PAGE_BACKGROUND = "#ffffff";

export const habitatColours = {
  estuary: { label: "Estuary blue", hex: "#1f5fa8" },
  downland: { label: "Downland green", hex: "#3d7a1e" },
  heather: { label: "Heather purple", hex: "#7a3f9e" },
  brick: { label: "Brick red", hex: "#b0401c" },
  oak: { label: "Oak brown", hex: "#7a5522" },
  kingfisher: { label: "Kingfisher teal", hex: "#00708a" },
  foxglove: { label: "Foxglove pink", hex: "#b3246b" },
  gorse: { label: "Gorse ochre", hex: "#8a6a00" },
  slate: { label: "Slate grey", hex: "#4a5560" },
} as const;

export type HabitatColour = keyof typeof habitatColours;
export const habitatColourKeys = Object.keys(habitatColours) as [HabitatColour, ...HabitatColour[]];

/** The hex for a stored colour key; an unknown key (never stored by us) draws in slate. */
export const colourHex = (key: string): string => (habitatColours as Record<string, { hex: string }>)[key]?.hex ?? habitatColours.slate.hex;
