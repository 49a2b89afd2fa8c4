import { describe, expect, it } from "vitest";
import { canMove, fieldDateVerdict, firstOverlap, graceEndsAt, latestFieldDate, overlaps, phaseOf, recordChangeRule } from "@/lib/seasons/rules";

const closedAt = new Date("2026-10-01T12:00:00Z");
const closed = { status: "closed" as const, closedAt };
const at = (iso: string) => new Date(iso);

describe("a season's phase", () => {
  it("is planning or open by status alone", () => {
    expect(phaseOf({ status: "planning", closedAt: null }, 30, at("2030-01-01T00:00:00Z"))).toBe("planning");
    expect(phaseOf({ status: "open", closedAt: null }, 30, at("2030-01-01T00:00:00Z"))).toBe("open");
  });

  it("is grace from closing until exactly graceDays × 24 h later, then frozen", () => {
    expect(phaseOf(closed, 30, closedAt)).toBe("grace");
    expect(graceEndsAt(closed, 30)?.toISOString()).toBe("2026-10-31T12:00:00.000Z");
    expect(phaseOf(closed, 30, at("2026-10-31T11:59:59.999Z"))).toBe("grace");
    expect(phaseOf(closed, 30, at("2026-10-31T12:00:00.000Z"))).toBe("frozen");
    expect(phaseOf(closed, 30, at("2027-06-01T00:00:00Z"))).toBe("frozen");
  });

  it("is frozen at once with no grace days, and reads closed_at given as text", () => {
    expect(phaseOf(closed, 0, closedAt)).toBe("frozen");
    expect(phaseOf({ status: "closed", closedAt: "2026-10-01T12:00:00Z" }, 1, at("2026-10-02T11:00:00Z"))).toBe("grace");
  });
});

describe("field walk dates", () => {
  const seasons = [
    { id: "a", name: "2025 season", startsOn: "2025-04-01", endsOn: "2025-09-30", status: "closed" as const, closedAt: at("2025-10-01T00:00:00Z") },
    { id: "b", name: "2026 season", startsOn: "2026-04-01", endsOn: "2026-09-30", status: "closed" as const, closedAt },
    { id: "c", name: "2027 season", startsOn: "2027-04-01", endsOn: "2027-09-30", status: "planning" as const, closedAt: null },
  ];
  const now = at("2026-10-20T09:00:00Z");

  it("takes a date in a season in its grace period, first and last days included", () => {
    expect(fieldDateVerdict("2026-04-01", seasons, 30, now)).toMatchObject({ ok: true, season: { id: "b" } });
    expect(fieldDateVerdict("2026-09-30", seasons, 30, now)).toMatchObject({ ok: true, season: { id: "b" } });
  });

  it("refuses a date between seasons, in a frozen one, in one still planning, or after tomorrow", () => {
    expect(fieldDateVerdict("2026-10-01", seasons, 30, now)).toMatchObject({ ok: false, reason: expect.stringMatching(/No season covers/) });
    expect(fieldDateVerdict("2025-06-01", seasons, 30, now)).toMatchObject({ ok: false, reason: expect.stringMatching(/2025 season is closed/) });
    expect(fieldDateVerdict("2026-06-01", seasons, 30, at("2026-11-01T00:00:00Z"))).toMatchObject({ ok: false });
    expect(fieldDateVerdict("2027-05-01", seasons, 30, at("2027-04-30T00:00:00Z"))).toMatchObject({ ok: false, reason: expect.stringMatching(/not opened/) });
    const open = [{ ...seasons[1]!, status: "open" as const, closedAt: null }];
    expect(fieldDateVerdict("2026-06-02", open, 30, at("2026-06-01T23:00:00Z"))).toMatchObject({ ok: true });
    expect(fieldDateVerdict("2026-06-03", open, 30, at("2026-06-01T23:00:00Z"))).toMatchObject({ ok: false, reason: "This date is in the future." });
    expect(latestFieldDate(at("2026-06-01T23:00:00Z"))).toBe("2026-06-02");
  });
});

describe("changing a season's records", () => {
  it("lets reviewers change them while open or in grace; once frozen only an organiser, logged", () => {
    expect(recordChangeRule("open", false)).toEqual({ allowed: true, logged: false });
    expect(recordChangeRule("grace", false)).toEqual({ allowed: true, logged: false });
    expect(recordChangeRule("frozen", false)).toMatchObject({ allowed: false });
    expect(recordChangeRule("frozen", true)).toEqual({ allowed: true, logged: true });
  });
});

describe("moves and overlaps", () => {
  it("moves planning → open → closed and never back", () => {
    expect(canMove("planning", "open")).toBe(true);
    expect(canMove("open", "closed")).toBe(true);
    expect(canMove("planning", "closed")).toBe(false);
    expect(canMove("closed", "open")).toBe(false);
    expect(canMove("open", "planning")).toBe(false);
  });

  it("counts a shared end and start day as overlap (both ends included, like daterange '[]')", () => {
    const a = { startsOn: "2026-04-01", endsOn: "2026-09-30" };
    expect(overlaps(a, { startsOn: "2026-09-30", endsOn: "2027-03-31" })).toBe(true);
    expect(overlaps(a, { startsOn: "2026-10-01", endsOn: "2027-03-31" })).toBe(false);
    expect(overlaps(a, { startsOn: "2025-10-01", endsOn: "2026-04-01" })).toBe(true);
    expect(overlaps(a, { startsOn: "2025-10-01", endsOn: "2026-03-31" })).toBe(false);
    expect(overlaps(a, { startsOn: "2026-05-01", endsOn: "2026-05-02" })).toBe(true);
  });

  it("names the first overlapping season other than the one being edited", () => {
    const others = [{ id: "x", startsOn: "2026-01-01", endsOn: "2026-06-30" }];
    expect(firstOverlap({ startsOn: "2026-06-30", endsOn: "2026-12-31" }, others)?.id).toBe("x");
    expect(firstOverlap({ startsOn: "2026-06-30", endsOn: "2026-12-31" }, others, "x")).toBeNull();
  });
});
