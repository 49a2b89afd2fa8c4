"use client";

import { createContext, useContext } from "react";

// The map tile provider's credit (MAP_TILE_ATTRIBUTION), given once by the area's layout rather
// than through every page down to each map: tile services require it beside their tiles.
const TileCredit = createContext<string | null>(null);

export const TileCreditProvider = TileCredit.Provider;

/** The credit as Leaflet's attribution control expects it: HTML, so the plain text is escaped. */
export function useTileCreditHtml(): string | undefined {
  const text = useContext(TileCredit);
  return text ? text.replace(/[&<>"']/g, (c) => `&#${c.charCodeAt(0)};`) : undefined;
}
