import { randomUUID } from "node:crypto";
import { sql } from "drizzle-orm";
import { beforeAll, beforeEach, describe, expect, it, vi } from "vitest";
import { db } from "@/db/client";
import { reviewAction } from "@/lib/queries/review-actions";
import { uuidArray } from "@/lib/sync/sql-arrays";
import { replyToQuestion } from "@/lib/queries/records";
import { actorFor } from "./support/actors";
import { resetToDemo } from "./support/db";
import { call, demo, userId } from "./transects-helpers";

// The review API called as route handlers against the demo network (only Auth.js's cookie
// decoding is replaced): who may use it, the queue's filters, each action with its history row,
// two reviewers on one sighting, bulk actions, and bad input that changes nothing.
const session = vi.hoisted(() => ({ userId: null as string | null }));
vi.mock("@/lib/auth/session", () => ({ sessionUserId: async () => session.userId }));

const queue = await import("@/app/(review)/api/review/sightings/route");
const detail = await import("@/app/(review)/api/review/sightings/[id]/route");
const actions = await import("@/app/(review)/api/review/sightings/[id]/actions/route");
const bulk = await import("@/app/(review)/api/review/bulk/route");
const speciesRoute = await import("@/app/(review)/api/review/species/route");
const options = await import("@/app/(review)/api/review/options/route");

type Handler = Parameters<typeof call>[0];
const get = (handler: Handler, query = "", params: Record<string, string> = {}) =>
  (handler as (r: Request, c: { params: Promise<never> }) => Promise<Response>)(new Request(`http://localhost/api/review/x${query}`), { params: Promise.resolve(params) as Promise<never> })
    .then(async (r) => ({ status: r.status, json: (await r.json()) as Record<string, any> })); // eslint-disable-line @typescript-eslint/no-explicit-any -- answers are read loosely in tests
const act = (id: string, body: unknown) => call(actions.POST as Handler, { body, params: { id } });

/** What the review tables hold: a refused request must leave all of it as it was. */
async function snapshot() {
  const [row] = await db().execute<{ events: number; sightings: string }>(sql`select
    (select count(*)::int from verification_events) as events,
    (select md5(string_agg(id::text || status || species_id::text || count::text || revision::text, ',' order by id)) from sightings) as sightings`);
  return row!;
}

async function pendingIds(where = sql`true`, n = 5): Promise<{ id: string; revision: number }[]> {
  return [...(await db().execute<{ id: string; revision: number }>(sql`
    select s.id, s.revision from sightings s join visits v on v.id = s.visit_id join species sp on sp.id = s.species_id
    join seasons se on se.id = v.season_id
    where s.status = 'pending' and se.status = 'open' and ${where} order by s.id limit ${n}`))];
}

describe("review API", () => {
  let reviewer: string;

  beforeAll(async () => {
    await resetToDemo();
  });

  beforeEach(async () => {
    reviewer = await userId(demo.coordinator);
    session.userId = reviewer;
  });

  it("admits reviewers and organisers; volunteers and partners get 403 on every route, and nothing changes", async () => {
    const [target] = await pendingIds();
    const routes = [
      () => get(queue.GET as Handler),
      () => get(detail.GET as Handler, "", { id: target!.id }),
      () => act(target!.id, { action: "accept", revision: target!.revision }),
      () => call(bulk.POST as Handler, { body: { action: "accept", selection: { ids: [target] } } }),
      () => get(speciesRoute.GET as Handler, "?q=blue"),
      () => get(options.GET as Handler),
    ];
    const before = await snapshot();
    for (const email of [demo.volunteer, demo.partner]) {
      session.userId = await userId(email);
      for (const r of routes) expect((await r()).status, email).toBe(403);
    }
    expect(await snapshot()).toEqual(before);
    for (const email of [demo.coordinator, demo.organiser]) {
      session.userId = await userId(email);
      expect((await get(queue.GET as Handler)).status).toBe(200);
      expect((await get(options.GET as Handler)).status).toBe(200);
    }
  });

  it("pages the waiting sightings by default, with a total, and filters by warning through the stored warnings", async () => {
    const first = await get(queue.GET as Handler, "?pageSize=25");
    expect(first.status).toBe(200);
    const [waiting] = await db().execute<{ n: number }>(sql`select count(*)::int as n from sightings where status in ('pending', 'queried')`);
    expect(first.json.total).toBe(waiting!.n);
    expect(first.json.rows).toHaveLength(25);
    expect(first.json.rows.every((r: { status: string }) => r.status === "pending" || r.status === "queried")).toBe(true);
    const second = await get(queue.GET as Handler, "?pageSize=25&page=2");
    const ids = new Set([...first.json.rows, ...second.json.rows].map((r: { id: string }) => r.id));
    expect(ids.size).toBe(50); // no row on both pages

    const warned = await get(queue.GET as Handler, "?status=any&warning=sensitive_no_photo&pageSize=100");
    const [expected] = await db().execute<{ n: number }>(sql`
      select count(*)::int as n from sightings s join species sp on sp.id = s.species_id
      where sp.sensitive and not exists (select 1 from photos p where p.sighting_id = s.id and p.status <> 'refused')`);
    expect(expected!.n).toBeGreaterThan(0);
    expect(warned.json.total).toBe(expected!.n);
    expect(warned.json.rows.every((r: { warnings: string[] }) => r.warnings.includes("sensitive_no_photo"))).toBe(true);

    const walks = await get(queue.GET as Handler, "?status=any&warning=walk_rules");
    expect(walks.json.total).toBeGreaterThan(0);
    expect(walks.json.rows.every((r: { walk: { breaches: string[] } }) => r.walk.breaches.length > 0)).toBe(true);
  });

  it("answers 400 with the field named for a filter that does not parse", async () => {
    const bad = await get(queue.GET as Handler, "?warning=spooky&from=2026-13-01&pageSize=7");
    expect(bad.status).toBe(400);
    expect(Object.keys(bad.json.error.fields).sort()).toEqual(["from", "pageSize", "warning"]);
  });

  it("confirms a sighting: status, reviewer, revision and one history row, together", async () => {
    const [target] = await pendingIds();
    const done = await act(target!.id, { action: "accept", revision: target!.revision });
    expect(done.status).toBe(200);
    expect(done.json.row).toMatchObject({ id: target!.id, status: "accepted", revision: target!.revision + 1 });
    const history = await get(detail.GET as Handler, "", { id: target!.id });
    expect(history.json.history).toEqual([expect.objectContaining({ action: "accept", fromStatus: "pending", toStatus: "accepted", actor: { id: reviewer, name: "Priya Coldharbour" } })]);
  });

  it("two reviewers on one sighting: the second gets 409 naming the first, and its action is not applied", async () => {
    const [target] = await pendingIds(sql`true`, 1);
    session.userId = await userId(demo.organiser);
    expect((await act(target!.id, { action: "accept", revision: target!.revision })).status).toBe(200);
    session.userId = reviewer;
    const before = await snapshot();
    const late = await act(target!.id, { action: "reject", revision: target!.revision, reason: "entered_twice" });
    expect(late.status).toBe(409);
    expect(late.json.error).toMatchObject({ code: "changed", changedBy: "Morgan Ashdown" });
    expect(late.json.row).toMatchObject({ id: target!.id, status: "accepted", revision: target!.revision + 1 });
    expect(await snapshot()).toEqual(before);
  });

  it("two reviewers at the same moment: exactly one wins", async () => {
    const [target] = await pendingIds(sql`true`, 1);
    const organiser = await actorFor(demo.organiser);
    const coordinator = await actorFor(demo.coordinator);
    const outcomes = await Promise.all([
      reviewAction(organiser, target!.id, { action: "accept", revision: target!.revision }),
      reviewAction(coordinator, target!.id, { action: "reject", revision: target!.revision, reason: "other" }),
    ]);
    expect(outcomes.filter((o) => o.ok)).toHaveLength(1);
    expect(outcomes.filter((o) => !o.ok)).toHaveLength(1);
    const [events] = await db().execute<{ n: number }>(sql`select count(*)::int as n from verification_events where sighting_id = ${target!.id}`);
    expect(events!.n).toBe(1);
  });

  it("a question, the volunteer's answer, a correction to an aggregate, then confirming: four history rows in order", async () => {
    const [target] = await db().execute<{ id: string; revision: number; volunteer: string; count: number }>(sql`
      select s.id, s.revision, u.email as volunteer, s.count from sightings s join visits v on v.id = s.visit_id join users u on u.id = v.volunteer_id
      join species sp on sp.id = s.species_id join seasons se on se.id = v.season_id
      where s.status = 'pending' and se.status = 'open' and sp.scientific_name = 'Thymelicus sylvestris' order by s.id limit 1`);
    expect(target).toBeDefined();
    const asked = await act(target!.id, { action: "query", revision: target!.revision, message: "Did you see the underside of the antenna tips?" });
    expect(asked.status).toBe(200);
    expect(asked.json.row).toMatchObject({ status: "queried", answered: false });

    await replyToQuestion(await actorFor(target!.volunteer), { sightingId: target!.id, message: "Only from above, sorry." });
    const answered = await get(queue.GET as Handler, "?status=answered&pageSize=100");
    const mine = answered.json.rows.find((r: { id: string }) => r.id === target!.id);
    expect(mine).toMatchObject({ status: "queried", answered: true });

    const choices = await get(speciesRoute.GET as Handler, `?q=${encodeURIComponent("Small/Essex")}`);
    const aggregate = choices.json.species.find((s: { aggregate: boolean }) => s.aggregate);
    expect(aggregate).toMatchObject({ scientificName: "Thymelicus sylvestris/lineola", members: ["Small Skipper", "Essex Skipper"] });
    const corrected = await act(target!.id, { action: "edit", revision: mine.revision, speciesId: aggregate.id, message: "Left at the pair." });
    expect(corrected.status).toBe(200);
    expect(corrected.json.row).toMatchObject({ status: "queried", corrected: true, species: { id: aggregate.id, aggregate: true } });
    const accepted = await act(target!.id, { action: "accept", revision: corrected.json.row.revision });
    expect(accepted.status).toBe(200);

    const { json } = await get(detail.GET as Handler, "", { id: target!.id });
    expect(json.history.map((h: { action: string }) => h.action)).toEqual(["query", "reply", "edit", "accept"]);
    expect(json.history[2]).toMatchObject({
      fromSpecies: { name: "Small Skipper (Thymelicus sylvestris)" },
      toSpecies: { id: aggregate.id, name: "Small/Essex Skipper (Thymelicus sylvestris/lineola)" },
      message: "Left at the pair.",
    });
  });

  it("corrects a count, keeping the old one in the history", async () => {
    const [target] = await db().execute<{ id: string; revision: number; count: number }>(sql`
      select s.id, s.revision, s.count from sightings s join visits v on v.id = s.visit_id join seasons se on se.id = v.season_id
      where s.status = 'pending' and se.status = 'open' order by s.id desc limit 1`);
    const fixed = await act(target!.id, { action: "edit", revision: target!.revision, count: target!.count + 40 });
    expect(fixed.json.row.count).toBe(target!.count + 40);
    const { json } = await get(detail.GET as Handler, "", { id: target!.id });
    expect(json.history.at(-1)).toMatchObject({ action: "edit", fromCount: target!.count, toCount: target!.count + 40, fromSpecies: null });
  });

  it("sets aside with a reason from the list, and reopens while the season is open", async () => {
    const [target] = await pendingIds(sql`true`, 1);
    const rejected = await act(target!.id, { action: "reject", revision: target!.revision, reason: "photo_not_conclusive", message: "Too blurred." });
    expect(rejected.json.row.status).toBe("rejected");
    const reopened = await act(target!.id, { action: "reopen", revision: rejected.json.row.revision });
    expect(reopened.status).toBe(200);
    expect(reopened.json.row.status).toBe("pending");
    const { json } = await get(detail.GET as Handler, "", { id: target!.id });
    expect(json.history.map((h: { action: string; reason: string | null }) => [h.action, h.reason])).toEqual([["reject", "photo_not_conclusive"], ["reopen", null]]);
  });

  it("does not reopen a sighting of a season whose grace period is over", async () => {
    const [old] = await db().execute<{ id: string; revision: number }>(sql`
      select s.id, s.revision from sightings s join visits v on v.id = s.visit_id join seasons se on se.id = v.season_id
      where s.status = 'accepted' and se.status = 'closed' order by s.id limit 1`);
    const before = await snapshot();
    const refused = await act(old!.id, { action: "reopen", revision: old!.revision });
    expect(refused.status).toBe(409);
    expect(refused.json.error.message).toMatch(/grace period is over/);
    expect((await get(detail.GET as Handler, "", { id: old!.id })).json.canReopen).toBe(false);
    expect(await snapshot()).toEqual(before);
  });

  it("answers 404 for an unknown sighting and 400 for bad input, changing nothing", async () => {
    const [target] = await pendingIds(sql`true`, 1);
    const before = await snapshot();
    expect((await act(randomUUID(), { action: "accept", revision: 1 })).status).toBe(404);
    expect((await get(detail.GET as Handler, "", { id: randomUUID() })).status).toBe(404);
    expect((await act("not-an-id", { action: "accept", revision: 1 })).status).toBe(400);
    const long = await act(target!.id, { action: "reject", revision: target!.revision, reason: "other", message: "x".repeat(1001) });
    expect(long.status).toBe(400);
    expect(long.json.error.fields.message).toEqual(["At most 1000 characters."]);
    const reason = await act(target!.id, { action: "reject", revision: target!.revision, reason: "because" });
    expect(reason.json.error.fields.reason).toBeDefined();
    const unknownSpecies = await act(target!.id, { action: "edit", revision: target!.revision, speciesId: randomUUID() });
    expect(unknownSpecies.status).toBe(400);
    expect(unknownSpecies.json.error.fields.speciesId).toEqual(["That species is not on the network's checklist."]);
    const emptyQuestion = await act(target!.id, { action: "query", revision: target!.revision, message: "  " });
    expect(emptyQuestion.json.error.fields.message).toEqual(["Write the question for the volunteer."]);
    const tooMany = await call(bulk.POST as Handler, { body: { action: "accept", selection: { ids: Array.from({ length: 5001 }, () => ({ id: randomUUID(), revision: 1 })) } } });
    expect(tooMany.status).toBe(400);
    expect(tooMany.json.error.fields).toEqual({ "selection.ids": ["At most 5,000 sightings at once: narrow the selection."] });
    expect(await snapshot()).toEqual(before);
  });

  it("writes the history row in the action's transaction: when it cannot be written, the sighting stays as it was", async () => {
    const [target] = await pendingIds(sql`true`, 1);
    const before = await snapshot();
    // A reviewer with no user row: the history's foreign key refuses the row after the status was changed.
    const ghost = { id: randomUUID(), roles: ["coordinator" as const], name: "Nobody", email: "nobody@example.invalid" };
    await expect(reviewAction(ghost, target!.id, { action: "accept", revision: target!.revision })).rejects.toThrow();
    expect(await snapshot()).toEqual(before);
  });

  it("keeps the history append-only", async () => {
    await expect(db().execute(sql`update verification_events set message = 'rewritten'`)).rejects.toMatchObject({ cause: { message: "the review history is append-only" } });
    const [event] = await db().execute<{ id: string }>(sql`select id from verification_events limit 1`);
    await expect(db().execute(sql`delete from verification_events where id = ${event!.id}`)).rejects.toMatchObject({ cause: { message: "the review history is append-only" } });
    // An erasure may blank the words, and nothing else, even with its setting on.
    await expect(db().transaction(async (tx) => {
      await tx.execute(sql`select set_config('turnstone.erasing', 'on', true)`);
      await tx.execute(sql`update verification_events set message = null, reason = 'other' where id = ${event!.id}`);
    })).rejects.toMatchObject({ cause: { message: "the review history is append-only" } });
  });

  it("bulk-confirms the selection without warnings and lists what it skipped, in one go", async () => {
    const plain = await pendingIds(sql`cardinality(s.warnings) = 0 and cardinality(v.rule_breaches) = 0`, 4);
    const [warned] = await pendingIds(sql`cardinality(s.warnings) > 0`, 1);
    const stale = plain[3]!;
    const answer = await call(bulk.POST as Handler, {
      body: { action: "accept", selection: { ids: [...plain.slice(0, 3), warned!, { id: stale.id, revision: stale.revision + 5 }] } },
    });
    expect(answer.status).toBe(200);
    expect(answer.json.done).toBe(3);
    expect(answer.json.skipped).toEqual(expect.arrayContaining([{ id: warned!.id, why: "has_warnings" }, { id: stale.id, why: "changed" }]));
    const rows = await db().execute<{ id: string; status: string }>(sql`select id, status from sightings where id = any(${uuidArray([...plain, warned!].map((p) => p.id))})`);
    const status = new Map(rows.map((r) => [r.id, r.status]));
    expect(plain.slice(0, 3).map((p) => status.get(p.id))).toEqual(["accepted", "accepted", "accepted"]);
    expect([status.get(warned!.id), status.get(stale.id)]).toEqual(["pending", "pending"]);
  });

  it("bulk-sets aside everything a filter matches, skipping what changed after the list was read", async () => {
    const [transect] = await db().execute<{ id: string }>(sql`
      select v.transect_id as id from sightings s join visits v on v.id = s.visit_id join seasons se on se.id = v.season_id
      where s.status = 'pending' and se.status = 'open' group by 1 having count(*) >= 3 order by 1 limit 1`);
    const filter = { status: "pending", transect: transect!.id };
    const listed = await get(queue.GET as Handler, `?status=pending&transect=${transect!.id}&pageSize=100`);
    const [changed] = listed.json.rows;
    await new Promise((resolve) => setTimeout(resolve, 5));
    await db().execute(sql`update sightings set count = count + 1 where id = ${changed.id}`);
    const answer = await call(bulk.POST as Handler, { body: { action: "reject", reason: "wrong_place", selection: { filter, listedAt: listed.json.listedAt } } });
    expect(answer.status).toBe(200);
    expect(answer.json.skipped).toEqual([{ id: changed.id, why: "changed" }]);
    expect(answer.json.done).toBe(listed.json.total - 1);
    const [events] = await db().execute<{ n: number }>(sql`select count(*)::int as n from verification_events where reason = 'wrong_place' and action = 'reject'`);
    expect(events!.n).toBe(listed.json.total - 1);
  });

  it("refuses a bulk action on a filter matching more than 5,000, changing nothing", async () => {
    // 5,001 waiting sightings on one new walk, removed again with the walk afterwards.
    const [walk] = await db().execute<{ id: string }>(sql`
      insert into visits (id, transect_id, volunteer_id, season_id, visit_date, start_time)
      select gen_random_uuid(), v.transect_id, v.volunteer_id, v.season_id, v.visit_date, v.start_time from visits v limit 1 returning id`);
    await db().execute(sql`insert into sightings (id, visit_id, species_id, count)
      select gen_random_uuid(), ${walk!.id}, (select id from species order by sort_order limit 1), 1 from generate_series(1, 5001)`);
    try {
      const before = await snapshot();
      const refused = await call(bulk.POST as Handler, { body: { action: "accept", selection: { filter: { status: "pending" }, listedAt: new Date().toISOString() } } });
      expect(refused.status).toBe(400);
      expect(refused.json.error.fields.selection[0]).toMatch(/sightings match: narrow the filter to 5,000 or fewer\.$/);
      expect(await snapshot()).toEqual(before);
    } finally {
      await db().execute(sql`delete from visits where id = ${walk!.id}`);
    }
  });
});
