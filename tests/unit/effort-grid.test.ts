import { describe, expect, it } from "vitest";
import { homeSeason } from "@/lib/effort/home-season";
import { ALERT_WEEKS, buildGrid, cellState, needsAlert, progressOf, seasonWeeks, weekEnded, weeksWithoutWalk } from "@/lib/effort/grid";

// 2026-04-01 is a Wednesday; 2026-03-30 the Monday of its week.
const season = { startsOn: "2026-04-01", endsOn: "2026-05-03" };

describe("the grid's weeks", () => {
  it("are the Mondays of every week holding a day of the season, a mid-week start included", () => {
    expect(seasonWeeks(season)).toEqual(["2026-03-30", "2026-04-06", "2026-04-13", "2026-04-20", "2026-04-27"]);
    // A season ending on a Monday gets that last week too.
    expect(seasonWeeks({ startsOn: "2026-04-06", endsOn: "2026-04-13" })).toEqual(["2026-04-06", "2026-04-13"]);
    // Across a year's end (ISO week 53 of 2026 starts on 28 December).
    expect(seasonWeeks({ startsOn: "2026-12-24", endsOn: "2027-01-05" })).toEqual(["2026-12-21", "2026-12-28", "2027-01-04"]);
  });

  it("end once their Sunday is over", () => {
    expect(weekEnded("2026-04-06", "2026-04-12")).toBe(false); // Sunday
    expect(weekEnded("2026-04-06", "2026-04-13")).toBe(true); // next Monday
  });
});

describe("a cell's state", () => {
  const week = "2026-04-06";
  it("is walked with sightings when any walk that week saw something", () => {
    expect(cellState([{ sightings: 0 }, { sightings: 2 }], false, week, "2026-05-01")).toBe("sightings");
  });
  it("is walked, nothing seen, for walks without sightings: still effort, whatever the weather report says", () => {
    expect(cellState([{ sightings: 0 }], false, week, "2026-05-01")).toBe("nothing_seen");
    expect(cellState([{ sightings: 0 }], true, week, "2026-05-01")).toBe("nothing_seen");
  });
  it("is not walked because of the weather only with a report and no walk", () => {
    expect(cellState([], true, week, "2026-05-01")).toBe("weather");
    expect(cellState([{ sightings: 1 }], true, week, "2026-05-01")).toBe("sightings");
  });
  it("is not walked otherwise, the week under way included; a week not begun is upcoming", () => {
    expect(cellState([], false, week, "2026-05-01")).toBe("not_walked");
    expect(cellState([], false, week, "2026-04-08")).toBe("not_walked");
    expect(cellState([], false, week, "2026-04-06")).toBe("not_walked");
    expect(cellState([], false, week, "2026-04-05")).toBe("upcoming");
  });
});

describe("weeks without a walk and the alert", () => {
  const weeks = seasonWeeks({ startsOn: "2026-04-06", endsOn: "2026-06-28" }); // 12 weeks from 6 April
  const walked = (...mondays: string[]) => new Set(mondays);

  it("counts ended weeks after the last walked week", () => {
    // Walked in the week of 6 April; today is Monday 27 April: weeks of 13 and 20 April have ended.
    expect(weeksWithoutWalk(weeks, walked("2026-04-06"), "2026-04-27")).toBe(2);
    // Sunday 3 May: the week of 27 April is still under way and does not count.
    expect(weeksWithoutWalk(weeks, walked("2026-04-06"), "2026-05-03")).toBe(2);
    // Monday 4 May: it has ended, so three.
    expect(weeksWithoutWalk(weeks, walked("2026-04-06"), "2026-05-04")).toBe(3);
  });

  it("is cleared by a walk in the week under way", () => {
    expect(weeksWithoutWalk(weeks, walked("2026-04-06", "2026-04-27"), "2026-04-29")).toBe(0);
  });

  it("counts from the season's first week when never walked, and is zero before the season", () => {
    expect(weeksWithoutWalk(weeks, walked(), "2026-04-27")).toBe(3);
    expect(weeksWithoutWalk(weeks, walked(), "2026-03-01")).toBe(0);
  });

  it("alerts at three weeks or more, in an open season only", () => {
    expect(ALERT_WEEKS).toBe(3);
    expect(needsAlert(2, true)).toBe(false);
    expect(needsAlert(3, true)).toBe(true);
    expect(needsAlert(7, true)).toBe(true);
    expect(needsAlert(7, false)).toBe(false);
  });
});

describe("the whole grid", () => {
  it("files walks and weather reports under their week and totals each transect", () => {
    const { weeks, rows } = buildGrid(
      season,
      ["A", "B"],
      [
        { transectId: "A", date: "2026-04-01", sightings: 4, pending: 1 },
        { transectId: "A", date: "2026-04-12", sightings: 0, pending: 0 }, // Sunday of the week of 6 April
        { transectId: "B", date: "2026-04-14", sightings: 3, pending: 3 },
      ],
      [{ transectId: "A", weekStart: "2026-04-13" }, { transectId: "B", weekStart: "2026-04-13" }],
      "2026-04-22",
    );
    expect(weeks).toHaveLength(5);
    const [a, b] = rows;
    expect(a!.cells.map((c) => c.state)).toEqual(["sightings", "nothing_seen", "weather", "not_walked", "upcoming"]);
    expect(b!.cells.map((c) => c.state)).toEqual(["not_walked", "not_walked", "sightings", "not_walked", "upcoming"]);
    expect(a).toMatchObject({ walks: 2, pending: 1, lastWalk: "2026-04-12", weeksWithoutWalk: 1 });
    expect(b).toMatchObject({ walks: 1, pending: 3, lastWalk: "2026-04-14", weeksWithoutWalk: 0 });
    expect(a!.cells[0]).toMatchObject({ walks: 1, sightings: 4 });
  });
});

describe("progress against the target", () => {
  it("has four bands", () => {
    expect(progressOf(0, 6)).toBe("none");
    expect(progressOf(2, 6)).toBe("under_half");
    expect(progressOf(3, 6)).toBe("half_or_more");
    expect(progressOf(5, 6)).toBe("half_or_more");
    expect(progressOf(6, 6)).toBe("target_reached");
    expect(progressOf(9, 6)).toBe("target_reached");
  });
});

describe("the season the home shows", () => {
  const s = (name: string, status: "planning" | "open" | "closed", startsOn: string) => ({ name, status, startsOn });
  it("is the open one, else the latest closed, else the latest planned", () => {
    expect(homeSeason([s("a", "closed", "2025-04-01"), s("b", "open", "2026-04-01"), s("c", "planning", "2027-04-01")])?.name).toBe("b");
    expect(homeSeason([s("a", "closed", "2024-04-01"), s("b", "closed", "2025-04-01"), s("c", "planning", "2027-04-01")])?.name).toBe("b");
    expect(homeSeason([s("c", "planning", "2027-04-01"), s("d", "planning", "2028-04-01")])?.name).toBe("d");
    expect(homeSeason([])).toBeNull();
  });
});
