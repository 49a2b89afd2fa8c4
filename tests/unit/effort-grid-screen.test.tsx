import { render, screen, within } from "@testing-library/react";
import { describe, expect, it, vi } from "vitest";
import { EffortAlerts, EffortGrid, EffortLegend } from "@/components/network/effort/effort-grid";
import { buildGrid, progressOf } from "@/lib/effort/grid";
import type { SeasonEffort } from "@/lib/queries/effort";

vi.mock("next/navigation", () => ({ useRouter: () => ({ push: vi.fn() }) }));
vi.mock("@/components/map/lazy", () => ({ RoutesMap: ({ label }: { label: string }) => <div role="region" aria-label={label} /> }));
const { ProgressMap } = await import("@/components/network/effort/progress-map");

// A four-week season seen on Wednesday of its third week: transect A shows every state.
const season = { id: "s1", name: "2026 season", status: "open" as const, phase: "open" as const, startsOn: "2026-04-06", endsOn: "2026-05-03", targetVisits: 6 };
const today = "2026-04-22";
const grid = buildGrid(
  season,
  ["a", "b"],
  [
    { transectId: "a", date: "2026-04-07", sightings: 5, pending: 2 },
    { transectId: "a", date: "2026-04-14", sightings: 0, pending: 0 },
  ],
  [{ transectId: "b", weekStart: "2026-04-06" }],
  today,
);
const names = { a: ["CHK-01", "Windover Down"], b: ["WET-02", "Mill Leat"] } as const;
const rows = grid.rows.map((r) => ({ ...r, id: r.transectId, code: names[r.transectId as "a" | "b"][0], name: names[r.transectId as "a" | "b"][1], active: true, progress: progressOf(r.walks, 6) }));
const effort: SeasonEffort = { season, today, weeks: grid.weeks, rows, alerts: rows.filter((r) => r.weeksWithoutWalk >= 3), routes: [] };

describe("the effort grid", () => {
  it("is a table with a caption, a header for each week and for each transect", () => {
    render(<EffortGrid effort={effort} />);
    const table = screen.getByRole("table", { name: /Walks week by week in the 2026 season/ });
    const columns = within(table).getAllByRole("columnheader").map((h) => h.textContent);
    expect(columns.slice(0, 4)).toEqual(["Transect", "Walks (target 6)", "Waiting for review", "Last walk"]);
    expect(within(table).getByRole("columnheader", { name: /^Week of Monday,? 6 April 2026$/ })).toBeInTheDocument();
    expect(within(table).getAllByRole("columnheader")).toHaveLength(4 + 4);
    const rowHeaders = within(table).getAllByRole("rowheader");
    expect(rowHeaders.map((h) => h.textContent)).toEqual(["CHK-01 Windover Down", "WET-02 Mill Leat"]);
  });

  it("tells the states apart in words and symbols, not by colour alone", () => {
    render(<EffortGrid effort={effort} />);
    const [, first, second] = screen.getAllByRole("row");
    const cells = within(first!).getAllByRole("cell").slice(3);
    // Each week's state is in the cell's text (read out by screen readers), with its walks.
    expect(cells.map((c) => c.textContent)).toEqual([
      "●Walked, with sightings (1 walk, 5 sightings)",
      "○Walked, nothing seen (1 walk, 0 sightings)",
      "–Not walked",
      "·Week still to come",
    ]);
    expect(within(second!).getAllByRole("cell")[3]!.textContent).toBe("WNot walked: weather");
    // Totals beside the transect: walks against the target, waiting for review, last walk.
    expect(within(first!).getAllByRole("cell").slice(0, 3).map((c) => c.textContent)).toEqual(["2 of 6", "2", "14 Apr 2026"]);
    expect(within(second!).getAllByRole("cell")[2]!.textContent).toBe("None yet");
    // The symbols are decoration for sighted readers: hidden from assistive technology, one per state.
    const symbols = [...first!.querySelectorAll("td [aria-hidden='true']"), ...second!.querySelectorAll("td [aria-hidden='true']")].map((s) => s.textContent);
    expect(new Set(symbols)).toEqual(new Set(["●", "○", "–", "·", "W"]));
  });

  it("has a key naming every state", () => {
    render(<EffortLegend />);
    const key = screen.getByRole("list", { name: "Key to the grid" });
    expect(within(key).getAllByRole("listitem").map((li) => li.textContent)).toEqual([
      "●Walked, with sightings",
      "○Walked, nothing seen",
      "WNot walked: weather",
      "–Not walked",
      "·Week still to come",
    ]);
  });
});

describe("the alerts and the map's key", () => {
  it("list transects unwalked three ended weeks or more, and say that only ended weeks count", () => {
    const late = { ...effort, alerts: [{ ...rows[1]!, weeksWithoutWalk: 3 }] };
    render(<EffortAlerts effort={late} />);
    expect(screen.getByText(/Only weeks that have ended count/)).toBeInTheDocument();
    expect(screen.getByRole("listitem").textContent).toBe("WET-02 Mill Leat: 3 weeks without a walk (not walked this season)");
  });

  it("list nothing for a season that is not open", () => {
    render(<EffortAlerts effort={{ ...effort, season: { ...season, status: "closed", phase: "grace" } }} />);
    expect(screen.getByText("The 2026 season is not open, so nothing is listed here.")).toBeInTheDocument();
    expect(screen.queryByRole("listitem")).toBeNull();
  });

  it("the map's progress colours have a key in words", () => {
    render(<ProgressMap routes={[]} target={6} tileUrl={null} />);
    const key = screen.getByRole("list", { name: "Map key: walks against the target" });
    expect(within(key).getAllByRole("listitem").map((li) => li.textContent)).toEqual(["No walks yet (dashed)", "Under half the target", "Half the target or more", "Target reached"]);
  });
});
