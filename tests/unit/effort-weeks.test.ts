import { describe, expect, it } from "vitest";
import { addDays, daysBetween, isoWeek, isoWeekday, localToday, mondayOf, weekStartsBetween } from "@/lib/effort/weeks";

// Checked against ISO 8601 (weeks start on Monday; week 1 is the week holding the year's first
// Thursday, so a year has 52 or 53 weeks) and calendar facts anyone can look up.

describe("week arithmetic (ISO 8601 weeks)", () => {
  it("names weekdays as ISO 8601 does: Monday 1 … Sunday 7", () => {
    expect(isoWeekday("2026-01-01")).toBe(4); // a Thursday
    expect(isoWeekday("2024-02-29")).toBe(4); // leap day, a Thursday
    expect(isoWeekday("2026-12-07")).toBe(1); // a Monday
    expect(isoWeekday("2026-12-06")).toBe(7); // a Sunday
  });

  it("finds the Monday that starts a day's week, across months, years and a leap day", () => {
    expect(mondayOf("2026-12-07")).toBe("2026-12-07");
    expect(mondayOf("2026-12-13")).toBe("2026-12-07");
    expect(mondayOf("2026-01-01")).toBe("2025-12-29");
    expect(mondayOf("2024-03-02")).toBe("2024-02-26");
  });

  it("puts the first and last days of a year in the ISO week of the year that holds their Thursday", () => {
    expect(isoWeek("2026-01-01")).toEqual({ year: 2026, week: 1 });
    expect(isoWeek("2021-01-03")).toEqual({ year: 2020, week: 53 });
    expect(isoWeek("2021-01-04")).toEqual({ year: 2021, week: 1 });
    expect(isoWeek("2024-12-30")).toEqual({ year: 2025, week: 1 });
    expect(isoWeek("2015-12-31")).toEqual({ year: 2015, week: 53 });
    expect(isoWeek("2026-12-31")).toEqual({ year: 2026, week: 53 });
    expect(isoWeek("2027-01-03")).toEqual({ year: 2026, week: 53 });
  });

  it("adds and counts days without a time zone or daylight-saving change moving them", () => {
    expect(addDays("2026-03-28", 2)).toBe("2026-03-30"); // across the EU's spring change
    expect(addDays("2026-10-24", 2)).toBe("2026-10-26"); // and its autumn change
    expect(addDays("2024-02-28", 1)).toBe("2024-02-29");
    expect(addDays("2025-02-28", 1)).toBe("2025-03-01");
    expect(addDays("2026-01-01", -1)).toBe("2025-12-31");
    expect(daysBetween("2026-01-01", "2027-01-01")).toBe(365);
    expect(daysBetween("2024-01-01", "2025-01-01")).toBe(366);
    expect(daysBetween("2026-03-30", "2026-03-28")).toBe(-2);
  });

  it("lists the Monday of every week that holds a day of a range, a mid-week start included", () => {
    expect(weekStartsBetween("2026-04-01", "2026-04-20")).toEqual(["2026-03-30", "2026-04-06", "2026-04-13", "2026-04-20"]);
    expect(weekStartsBetween("2026-04-06", "2026-04-06")).toEqual(["2026-04-06"]);
  });

  it("reads today from the phone's own calendar, not UTC's", () => {
    expect(localToday(new Date(2026, 0, 1, 0, 30))).toBe("2026-01-01");
    expect(localToday(new Date(2026, 11, 31, 23, 59))).toBe("2026-12-31");
  });
});
