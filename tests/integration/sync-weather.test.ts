import { randomUUID } from "node:crypto";
import { asc, eq, ne } from "drizzle-orm";
import { beforeEach, describe, expect, it } from "vitest";
import { db } from "@/db/client";
import { seasons, transectAssignments, visits, weatherMisses } from "@/db/schema";
import type { Actor } from "@/lib/auth/guard";
import { applySyncBatch } from "@/lib/sync/apply-batch";
import { actorFor } from "./support/actors";
import { resetToDemo } from "./support/db";

// "Not walked this week because of the weather" through the sync, and protocol 2's rule that a
// submitted walk carries its complete-list answer, on the demo network (its open season holds
// the seed day; last year's is closed and frozen).

const DAY = 86_400_000;
const today = () => new Date().toISOString().slice(0, 10);
const addDays = (day: string, n: number) => new Date(Date.parse(`${day}T00:00:00Z`) + n * DAY).toISOString().slice(0, 10);
const report = (transectId: string, reportedOn: string, over: Record<string, unknown> = {}) => ({ id: randomUUID(), transectId, reportedOn, clientUpdatedAt: new Date().toISOString(), ...over });

describe("weather reports and complete lists through the sync", () => {
  let actor: Actor;
  let transectId: string;
  let otherTransect: string;

  beforeEach(async () => {
    await resetToDemo();
    actor = await actorFor("volunteer01@harrowmere.example");
    const [mine] = await db().select().from(transectAssignments).where(eq(transectAssignments.userId, actor.id)).orderBy(asc(transectAssignments.transectId)).limit(1);
    transectId = mine!.transectId;
    const mineAll = (await db().select().from(transectAssignments).where(eq(transectAssignments.userId, actor.id))).map((a) => a.transectId);
    const [theirs] = (await db().select().from(transectAssignments).where(ne(transectAssignments.userId, actor.id))).filter((a) => !mineAll.includes(a.transectId));
    otherTransect = theirs!.transectId;
  });

  it("files a report under the Monday of its week (ISO 8601 weeks), and a resend or a second report of that week is unchanged", async () => {
    const day = today();
    const first = report(transectId, day);
    const sent = await applySyncBatch(actor, { protocol: 2, weatherMisses: [first] });
    expect(sent.status).toBe(200);
    expect(sent.response.results).toEqual([expect.objectContaining({ kind: "weather", id: first.id, status: "created" })]);
    const [row] = await db().select().from(weatherMisses).where(eq(weatherMisses.id, first.id));
    // ISO 8601: weeks start on Monday; getUTCDay() is 1 for a Monday.
    expect(new Date(`${row!.weekStart}T00:00:00Z`).getUTCDay()).toBe(1);
    expect(row!.weekStart <= day && addDays(row!.weekStart, 6) >= day).toBe(true);
    const [open] = await db().select().from(seasons).where(eq(seasons.status, "open"));
    expect(row!.seasonId).toBe(open!.id);

    const again = await applySyncBatch(actor, { protocol: 2, weatherMisses: [first, report(transectId, row!.weekStart)] });
    expect(again.response.results.map((r) => r.status)).toEqual(["unchanged", "unchanged"]);
    expect(await db().select().from(weatherMisses).where(eq(weatherMisses.transectId, transectId)).then((r) => r.filter((m) => m.weekStart === row!.weekStart))).toHaveLength(1);
  });

  it("refuses a report for a transect the volunteer does not walk, another volunteer's id, a future date and a frozen season's date, writing none", async () => {
    const before = (await db().select().from(weatherMisses)).length;
    const [closed] = await db().select().from(seasons).where(eq(seasons.status, "closed"));
    const { response, status } = await applySyncBatch(actor, {
      protocol: 2,
      weatherMisses: [report(otherTransect, today()), report(transectId, addDays(today(), 5)), report(transectId, closed!.startsOn), { id: "not-a-uuid", transectId, reportedOn: today() }],
    });
    expect(status).toBe(403);
    expect(response.results.map((r) => r.status)).toEqual(["forbidden", "invalid", "invalid", "invalid"]);
    // recordDate (lib/validation/fields.ts) refuses dates after tomorrow before the sync looks at seasons.
    expect(response.results[1]!.errors?.reportedOn?.[0]).toMatch(/between 1900-01-01 and/);
    expect(response.results[2]!.errors?.reportedOn?.[0]).toMatch(/not open/);
    expect(response.results[3]!.errors?.id).toBeTruthy();
    expect((await db().select().from(weatherMisses)).length).toBe(before);

    const mine = report(transectId, today());
    await applySyncBatch(actor, { protocol: 2, weatherMisses: [mine] });
    const other = await actorFor("volunteer02@harrowmere.example");
    const [theirTransect] = await db().select().from(transectAssignments).where(eq(transectAssignments.userId, other.id)).limit(1);
    const stolen = await applySyncBatch(other, { protocol: 2, weatherMisses: [{ ...mine, transectId: theirTransect!.transectId }] });
    expect(stolen.response.results[0]).toMatchObject({ status: "forbidden" });
  });

  it("lands good reports beside bad ones in one batch with walks, each bad one with its field's message", async () => {
    const good = report(transectId, today());
    const walk = { id: randomUUID(), transectId, visitDate: today(), startTime: "10:00", endTime: "11:00", completeList: true, submittedAt: new Date().toISOString(), clientUpdatedAt: new Date().toISOString() };
    const { status, response } = await applySyncBatch(actor, {
      protocol: 2,
      visits: [walk],
      weatherMisses: [report(transectId, "14/05/2026"), good, { id: randomUUID(), transectId: "nope", reportedOn: today(), clientUpdatedAt: new Date().toISOString() }],
    });
    expect(status).toBe(400);
    expect(response.results.map((r) => [r.kind, r.index, r.status])).toEqual([["visit", 0, "created"], ["weather", 0, "invalid"], ["weather", 1, "created"], ["weather", 2, "invalid"]]);
    expect(response.results[1]!.errors?.reportedOn?.[0]).toBe("Use a date like 2026-05-14.");
    expect(response.results[3]!.errors?.transectId?.[0]).toBe("Choose a transect.");
    expect(await db().select().from(weatherMisses).where(eq(weatherMisses.id, good.id))).toHaveLength(1);
    expect(await db().select().from(visits).where(eq(visits.id, walk.id))).toHaveLength(1);
  });

  it("from protocol 2 a submitted walk must say whether its list is complete; an older phone's walk keeps the old default (no)", async () => {
    const walk = (over: Record<string, unknown>) => ({ id: randomUUID(), transectId, visitDate: today(), startTime: "10:00", endTime: "11:00", submittedAt: new Date().toISOString(), clientUpdatedAt: new Date().toISOString(), ...over });
    const unanswered = walk({});
    const refused = await applySyncBatch(actor, { protocol: 2, visits: [unanswered] });
    expect(refused.response.results[0]).toMatchObject({ status: "invalid" });
    expect(refused.response.results[0]!.errors?.completeList?.[0]).toMatch(/every species/);
    expect(await db().select().from(visits).where(eq(visits.id, unanswered.id))).toHaveLength(0);

    const answered = walk({ completeList: true });
    expect((await applySyncBatch(actor, { protocol: 2, visits: [answered] })).response.results[0]!.status).toBe("created");
    const old = walk({});
    expect((await applySyncBatch(actor, { visits: [old] })).response.results[0]!.status).toBe("created");
    const [stored] = await db().select().from(visits).where(eq(visits.id, old.id));
    expect(stored!.completeList).toBe(false);
    // A walk still in progress (not submitted) need not answer yet.
    expect((await applySyncBatch(actor, { protocol: 2, visits: [walk({ submittedAt: null })] })).response.results[0]!.status).toBe("created");
  });
});
