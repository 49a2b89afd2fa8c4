import { randomUUID } from "node:crypto";
import { asc, eq } from "drizzle-orm";
import { beforeAll, beforeEach, describe, expect, it, vi } from "vitest";
import { db } from "@/db/client";
import { seasons, species, transectAssignments, users, visits } from "@/db/schema";
import { resetToDemo } from "./support/db";

// Sunshine and rain on a walk: optional in every sync protocol (phones still running protocol 1
// never send them), stored in visits.sunshine_percent and visits.rain, and judged by the walk
// rules into visits.rule_breaches (the demo network keeps the default rules, which are from
// memory: lib/review/walk-rules.ts). Through the real route handlers; only Auth.js's cookie
// decoding is replaced.
const session = vi.hoisted(() => ({ userId: null as string | null }));
vi.mock("@/lib/auth/session", () => ({ sessionUserId: async () => session.userId }));

const { POST: sync } = await import("@/app/(field)/api/field/sync/route");
const { POST: paperWalk } = await import("@/app/(review)/api/review/paper-walks/route");
const noParams = { params: Promise.resolve({}) };

type SyncAnswer = { results: { kind: string; status: string; errors?: Record<string, string[]> }[] };

async function post(handler: typeof sync, url: string, body: unknown) {
  const request = new Request(url, { method: "POST", body: JSON.stringify(body), headers: { "content-type": "application/json" } });
  const response = await handler(request, noParams);
  return { status: response.status, json: (await response.json()) as SyncAnswer & { created?: { visitId: string }; error?: { fields?: Record<string, string[]> } } };
}
const sendBatch = (body: unknown) => post(sync, "http://localhost/api/field/sync", body);

async function idOf(email: string) {
  const [u] = await db().select({ id: users.id }).from(users).where(eq(users.email, email));
  return u!.id;
}

async function stored(id: string) {
  const [row] = await db().select({ sunshinePercent: visits.sunshinePercent, rain: visits.rain, ruleBreaches: visits.ruleBreaches }).from(visits).where(eq(visits.id, id));
  return row;
}

describe("a walk's sunshine and rain through the sync", () => {
  let volunteer: string;
  let transectId: string;
  let speciesId: string;
  let walkDay: string;

  beforeAll(async () => {
    await resetToDemo();
    const [open] = await db().select({ startsOn: seasons.startsOn }).from(seasons).where(eq(seasons.status, "open"));
    walkDay = open!.startsOn; // in the open season, and already past
    volunteer = await idOf("volunteer01@harrowmere.example");
    const [a] = await db().select().from(transectAssignments).where(eq(transectAssignments.userId, volunteer)).limit(1);
    transectId = a!.transectId;
    const [sp] = await db().select({ id: species.id }).from(species).orderBy(asc(species.sortOrder)).limit(1);
    speciesId = sp!.id;
  });

  beforeEach(() => {
    session.userId = volunteer;
  });

  const walk = (over: Record<string, unknown> = {}) => ({
    id: randomUUID(), transectId, visitDate: walkDay, startTime: "11:00", endTime: "11:45", temperatureC: 14, windBeaufort: 2,
    submittedAt: `${walkDay}T11:50:00.000Z`, clientUpdatedAt: `${walkDay}T11:50:00.000Z`, ...over,
  });

  it("takes a protocol 1 body without them (an older phone): stored as null, the walk judged on the rest", async () => {
    const older = walk({ completeList: true });
    const sighting = { id: randomUUID(), visitId: older.id, speciesId, count: 1, section: 1, clientUpdatedAt: older.clientUpdatedAt };
    const { status, json } = await sendBatch({ visits: [older], sightings: [sighting] });
    expect(status).toBe(200);
    expect(json.results.map((r) => r.status)).toEqual(["created", "created"]);
    // 14 °C with sunshine unknown is not "too cool": only below 13 °C is, without sunshine.
    expect(await stored(older.id)).toEqual({ sunshinePercent: null, rain: null, ruleBreaches: [] });

    const cold = walk({ temperatureC: 12.5, windBeaufort: 6, startTime: "10:40" });
    expect((await sendBatch({ protocol: 1, visits: [cold] })).json.results[0]!.status).toBe("created");
    expect(await stored(cold.id)).toMatchObject({ sunshinePercent: null, rain: null, ruleBreaches: ["outside_hours", "too_cool", "too_windy"] });
  });

  it("takes a protocol 2 body with them: the values land and the walk's breaches follow the rules", async () => {
    const light = walk({ completeList: true, sunshinePercent: 40, rain: "light" });
    const clean = walk({ completeList: true, sunshinePercent: 60, rain: "none" });
    const warm = walk({ completeList: false, temperatureC: 17, sunshinePercent: 0, rain: "heavy" });
    const { status, json } = await sendBatch({ protocol: 2, visits: [light, clean, warm] });
    expect(status).toBe(200);
    expect(json.results.map((r) => r.status)).toEqual(["created", "created", "created"]);
    expect(await stored(light.id)).toEqual({ sunshinePercent: 40, rain: "light", ruleBreaches: ["too_cool", "rain"] });
    expect(await stored(clean.id)).toEqual({ sunshinePercent: 60, rain: "none", ruleBreaches: [] });
    expect(await stored(warm.id)).toEqual({ sunshinePercent: 0, rain: "heavy", ruleBreaches: ["rain"] });
  });

  it("compares them for 'unchanged': a resend differing only in rain or sunshine is written, breaches recomputed", async () => {
    const first = walk({ completeList: true, sunshinePercent: 40, rain: "light" });
    expect((await sendBatch({ protocol: 2, visits: [first] })).json.results[0]!.status).toBe("created");
    expect((await sendBatch({ protocol: 2, visits: [first] })).json.results[0]!.status).toBe("unchanged");

    // The same edit time, only the rain differs: not a resend.
    expect((await sendBatch({ protocol: 2, visits: [{ ...first, rain: "none" }] })).json.results[0]!.status).toBe("updated");
    expect(await stored(first.id)).toEqual({ sunshinePercent: 40, rain: "none", ruleBreaches: ["too_cool"] });
    expect((await sendBatch({ protocol: 2, visits: [{ ...first, rain: "none", sunshinePercent: 60 }] })).json.results[0]!.status).toBe("updated");
    expect(await stored(first.id)).toEqual({ sunshinePercent: 60, rain: "none", ruleBreaches: [] });
  });

  it("refuses a share outside 0-100 and an unknown rain with field messages, storing the good walk beside them", async () => {
    const good = walk({ completeList: true, sunshinePercent: 100, rain: "none" });
    const tooSunny = walk({ completeList: true, sunshinePercent: 101 });
    const drizzle = walk({ completeList: true, rain: "drizzle" });
    const { status, json } = await sendBatch({ protocol: 2, visits: [tooSunny, good, drizzle] });
    expect(status).toBe(400);
    expect(json.results.map((r) => r.status)).toEqual(["invalid", "created", "invalid"]);
    expect(json.results[0]!.errors).toEqual({ sunshinePercent: ["Sunshine is 0-100% of the walk."] });
    expect(json.results[2]!.errors).toEqual({ rain: ["Rain is none, light or heavy."] });
    expect(await stored(tooSunny.id)).toBeUndefined();
    expect(await stored(drizzle.id)).toBeUndefined();
    expect(await stored(good.id)).toEqual({ sunshinePercent: 100, rain: "none", ruleBreaches: [] });
  });
});

describe("a paper walk's sunshine and rain", () => {
  let body: Record<string, unknown>;

  beforeAll(async () => {
    await resetToDemo();
    const volunteerId = await idOf("volunteer01@harrowmere.example");
    const [a] = await db().select().from(transectAssignments).where(eq(transectAssignments.userId, volunteerId)).limit(1);
    const [open] = await db().select({ startsOn: seasons.startsOn }).from(seasons).where(eq(seasons.status, "open"));
    body = { volunteerId, transectId: a!.transectId, visitDate: open!.startsOn, startTime: "11:00", endTime: "12:00", temperatureC: "15", windBeaufort: "3", completeList: "yes", sightings: [] };
    session.userId = await idOf("checker@harrowmere.example");
  });

  it("are optional: a sheet without them is stored with neither", async () => {
    const { status, json } = await post(paperWalk, "http://localhost/api/review/paper-walks", body);
    expect(status).toBe(200);
    expect(await stored(json.created!.visitId)).toEqual({ sunshinePercent: null, rain: null, ruleBreaches: [] });
  });

  it("are stored when given (blank counts as not recorded) and judged by the walk rules", async () => {
    const given = await post(paperWalk, "http://localhost/api/review/paper-walks", { ...body, sunshinePercent: "30", rain: "heavy" });
    expect(given.status).toBe(200);
    expect(await stored(given.json.created!.visitId)).toEqual({ sunshinePercent: 30, rain: "heavy", ruleBreaches: ["too_cool", "rain"] });
    const blank = await post(paperWalk, "http://localhost/api/review/paper-walks", { ...body, sunshinePercent: "", rain: "" });
    expect(await stored(blank.json.created!.visitId)).toEqual({ sunshinePercent: null, rain: null, ruleBreaches: [] });
  });

  it("refuses a share over 100 and an unknown rain with field messages", async () => {
    const { status, json } = await post(paperWalk, "http://localhost/api/review/paper-walks", { ...body, sunshinePercent: "120", rain: "drizzle" });
    expect(status).toBe(400);
    expect(json.error!.fields).toEqual({
      sunshinePercent: ["Sunshine is a whole number from 0 to 100% of the walk."],
      rain: ["Choose no rain, light or heavy."],
    });
  });
});
