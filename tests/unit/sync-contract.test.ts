import { randomUUID } from "node:crypto";
import { afterEach, beforeEach, describe, expect, it, vi } from "vitest";
import { sightingPayload, visitPayload, visitPayloadFor } from "@/lib/sync/contract";
import { INSTANT_RANGE_MESSAGE, latestRecordDate } from "@/lib/validation/fields";
import { TEXT_PROBLEMS } from "@/lib/validation/text";

// The sync contract must refuse, per field, every value PostgreSQL would reject inside the
// batch's write; whatever it accepts must fit the columns in db/schema/field.ts.

const visit = (over: Record<string, unknown> = {}) => ({
  id: randomUUID(),
  transectId: randomUUID(),
  visitDate: "2026-05-14",
  startTime: "10:30",
  clientUpdatedAt: "2026-05-14T11:50:00.000Z",
  ...over,
});

const sighting = (over: Record<string, unknown> = {}) => ({
  id: randomUUID(),
  visitId: randomUUID(),
  speciesId: randomUUID(),
  count: 3,
  clientUpdatedAt: "2026-05-14T11:00:00.000Z",
  ...over,
});

function errorsOf(result: { success: boolean; error?: { issues: { path: PropertyKey[]; message: string }[] } }) {
  const out: Record<string, string[]> = {};
  for (const issue of result.error?.issues ?? []) (out[issue.path.join(".")] ??= []).push(issue.message);
  return out;
}

describe("sync contract: values PostgreSQL would refuse are refused per field", () => {
  beforeEach(() => {
    vi.useFakeTimers();
    vi.setSystemTime(new Date("2026-06-10T22:30:00Z"));
  });
  afterEach(() => vi.useRealTimers());

  it("free text: NUL and unpaired surrogates in notes, co-recorders and sighting notes", () => {
    expect(errorsOf(visitPayload.safeParse(visit({ notes: "Gate locked\u0000" })))).toEqual({ notes: [TEXT_PROBLEMS.control] });
    expect(errorsOf(visitPayload.safeParse(visit({ coRecorders: "A. Smith \uD83E" })))).toEqual({ coRecorders: [TEXT_PROBLEMS.brokenCharacter] });
    expect(errorsOf(sightingPayload.safeParse(sighting({ note: "\uDD8B on thistle" })))).toEqual({ note: [TEXT_PROBLEMS.brokenCharacter] });
    const fine = visitPayload.parse(visit({ notes: "Two lines\n\twith a tab and \u{1F98B}" }));
    expect(fine.notes).toBe("Two lines\n\twith a tab and \u{1F98B}");
  });

  it("visit date: from 1900-01-01 to tomorrow by the server's UTC clock; year 0000 is refused", () => {
    expect(latestRecordDate()).toBe("2026-06-11");
    for (const visitDate of ["1900-01-01", "2026-06-10", "2026-06-11"]) expect(visitPayload.safeParse(visit({ visitDate })).success, visitDate).toBe(true);
    for (const visitDate of ["0000-01-01", "0000-02-29", "1899-12-31", "2026-06-12", "9999-12-31"]) {
      expect(errorsOf(visitPayload.safeParse(visit({ visitDate }))), visitDate).toEqual({ visitDate: ["Must be a date between 1900-01-01 and 2026-06-11."] });
    }
    // A date that does not exist stays a format error, not a range error.
    expect(errorsOf(visitPayload.safeParse(visit({ visitDate: "2026-02-30" })))).toEqual({ visitDate: ["Use a date like 2026-05-14."] });
  });

  it("timestamps: 1900-01-01 to 2100-12-31 in UTC, whatever the offset", () => {
    for (const clientUpdatedAt of ["0000-01-01T00:00:00Z", "1899-12-31T23:59:59Z", "1900-01-01T00:30:00+01:00", "2101-01-01T00:00:00Z", "2100-12-31T23:00:00-01:00"]) {
      expect(errorsOf(visitPayload.safeParse(visit({ clientUpdatedAt }))), clientUpdatedAt).toEqual({ clientUpdatedAt: [INSTANT_RANGE_MESSAGE] });
      expect(errorsOf(sightingPayload.safeParse(sighting({ clientUpdatedAt }))), clientUpdatedAt).toEqual({ clientUpdatedAt: [INSTANT_RANGE_MESSAGE] });
    }
    expect(errorsOf(visitPayload.safeParse(visit({ submittedAt: "0000-06-01T10:00:00Z" })))).toEqual({ submittedAt: [INSTANT_RANGE_MESSAGE] });
    for (const clientUpdatedAt of ["1900-01-01T00:00:00Z", "2100-12-31T23:59:59.999Z", "2026-05-14T12:00:00.123456+14:00"]) {
      expect(visitPayload.safeParse(visit({ clientUpdatedAt })).success, clientUpdatedAt).toBe(true);
    }
  });

  it("clock times stop at 23:59:59 (PostgreSQL's time would take 24:00:00)", () => {
    for (const startTime of ["24:00", "24:00:01", "23:60", "23:59:60", "9:45"]) {
      expect(errorsOf(visitPayload.safeParse(visit({ startTime }))), startTime).toEqual({ startTime: ["Use a time like 09:45."] });
    }
    expect(visitPayload.safeParse(visit({ startTime: "00:00", endTime: "23:59:59" })).success).toBe(true);
  });

  it("numbers stay inside their columns: JSON's 1e400 (Infinity) and huge values are refused", () => {
    const infinity = JSON.parse("1e400") as number;
    expect(infinity).toBe(Infinity);
    expect(errorsOf(visitPayload.safeParse(visit({ temperatureC: infinity })))).toEqual({ temperatureC: ["Temperature must be a number from -40 to 60 °C."] });
    expect(Object.keys(errorsOf(sightingPayload.safeParse(sighting({ latitude: infinity, longitude: -infinity }))))).toEqual(["latitude", "longitude"]);
    // PostgreSQL manual, 8.1 Numeric Types: smallint holds -32768..32767, integer -2147483648..2147483647.
    expect(errorsOf(sightingPayload.safeParse(sighting({ count: 2 ** 31 })))).toEqual({ count: ["Count is at most 100000."] });
    expect(errorsOf(sightingPayload.safeParse(sighting({ section: 32768 })))).toEqual({ section: ["A transect has at most 50 sections."] });
    expect(errorsOf(sightingPayload.safeParse(sighting({ count: 1e300 })))).toEqual({ count: ["Count must be a whole number.", "Count is at most 100000."] });
    expect(errorsOf(visitPayload.safeParse(visit({ windBeaufort: 40000, cloudCoverPercent: 40000 })))).toEqual({
      windBeaufort: ["Beaufort force runs from 0 to 12."],
      cloudCoverPercent: ["Cloud cover is 0-100%."],
    });
    expect(errorsOf(sightingPayload.safeParse(sighting({ accuracyMetres: 1e308 })))).toEqual({ accuracyMetres: ["Accuracy is 0 to 100000 metres."] });
  });
});

describe("sync contract: sunshine and rain are optional in every protocol", () => {
  beforeEach(() => {
    vi.useFakeTimers();
    vi.setSystemTime(new Date("2026-06-10T22:30:00Z"));
  });
  afterEach(() => vi.useRealTimers());

  it.each([1, 2])("protocol %i takes a walk without them, with null, and with values inside their ranges", (protocol) => {
    const schema = visitPayloadFor(protocol);
    const parsed = schema.parse(visit({ completeList: true }));
    expect(parsed.sunshinePercent ?? null).toBeNull();
    expect(parsed.rain ?? null).toBeNull();
    expect(schema.safeParse(visit({ completeList: true, sunshinePercent: null, rain: null })).success).toBe(true);
    for (const sunshinePercent of [0, 60, 100]) {
      for (const rain of ["none", "light", "heavy"]) {
        expect(schema.parse(visit({ completeList: true, sunshinePercent, rain }))).toMatchObject({ sunshinePercent, rain });
      }
    }
  });

  it.each([1, 2])("protocol %i refuses, per field, a share outside 0-100 or not whole and a rain it does not know", (protocol) => {
    const schema = visitPayloadFor(protocol);
    const message = "Sunshine is 0-100% of the walk.";
    for (const sunshinePercent of [-1, 101, 50.5, "60"]) {
      expect(errorsOf(schema.safeParse(visit({ completeList: true, sunshinePercent }))), String(sunshinePercent)).toEqual({ sunshinePercent: [message] });
    }
    for (const rain of ["drizzle", "", "LIGHT", true]) {
      expect(errorsOf(schema.safeParse(visit({ completeList: true, rain }))), String(rain)).toEqual({ rain: ["Rain is none, light or heavy."] });
    }
  });
});
