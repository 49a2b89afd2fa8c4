import { randomUUID } from "node:crypto";
import { and, asc, eq, inArray, sql } from "drizzle-orm";
import { beforeEach, describe, expect, it } from "vitest";
import { db } from "@/db/client";
import { seasons, sightings, species, transectAssignments, transects, visitSummaries, visits } from "@/db/schema";
import type { Actor } from "@/lib/auth/guard";
import { mergeEntries } from "@/lib/queries/checklist-merge";
import { importSeason, previewSeasonImport } from "@/lib/queries/season-import";
import { applySyncBatch } from "@/lib/sync/apply-batch";
import { actorFor } from "./support/actors";
import { resetToDemo } from "./support/db";

// visit_summaries (drizzle/0007) must always equal counting each walk's sightings by status. Each
// test changes sightings through a real writer and then compares the table with a fresh count.

/** Walks whose summary differs from a fresh count of their sightings (a missing row counts as zeros). */
async function drift() {
  return db().execute<{ visit_id: string }>(sql`
    with fresh as (
      select visit_id,
        count(*) filter (where status = 'pending')::int as pending, count(*) filter (where status = 'queried')::int as queried,
        count(*) filter (where status = 'accepted')::int as accepted, count(*) filter (where status = 'rejected')::int as rejected
      from sightings group by visit_id
    )
    select coalesce(f.visit_id, s.visit_id) as visit_id from fresh f full join visit_summaries s using (visit_id)
    where (coalesce(f.pending, 0), coalesce(f.queried, 0), coalesce(f.accepted, 0), coalesce(f.rejected, 0))
       <> (coalesce(s.pending, 0), coalesce(s.queried, 0), coalesce(s.accepted, 0), coalesce(s.rejected, 0))`);
}

async function summaryOf(visitId: string) {
  const [row] = await db().select().from(visitSummaries).where(eq(visitSummaries.visitId, visitId));
  return row ? { pending: row.pending, queried: row.queried, accepted: row.accepted, rejected: row.rejected } : null;
}

describe("each walk's sightings summary", () => {
  let volunteer: Actor;
  let transectId: string;
  let walkDay: string;
  let speciesIds: string[];

  beforeEach(async () => {
    await resetToDemo();
    volunteer = await actorFor("volunteer01@harrowmere.example");
    const [mine] = await db()
      .select({ id: transects.id })
      .from(transectAssignments)
      .innerJoin(transects, eq(transects.id, transectAssignments.transectId))
      .where(eq(transectAssignments.userId, volunteer.id))
      .orderBy(asc(transects.code))
      .limit(1);
    transectId = mine!.id;
    const [open] = await db().select({ startsOn: seasons.startsOn }).from(seasons).where(eq(seasons.status, "open"));
    walkDay = open!.startsOn;
    speciesIds = (await db().select({ id: species.id }).from(species).orderBy(asc(species.sortOrder)).limit(4)).map((s) => s.id);
  });

  it("matches the demo's sightings as seeded (the migration's backfill and the insert trigger)", async () => {
    expect(await drift()).toEqual([]);
    const [{ n }] = (await db().execute<{ n: number }>(sql`select count(*)::int as n from visit_summaries`)) as unknown as [{ n: number }];
    expect(n).toBeGreaterThan(200);
  });

  it("follows sync writes: new sightings, an upsert that updates, a deletion, a resend", async () => {
    const visit = { id: randomUUID(), transectId, visitDate: walkDay, startTime: "10:30", endTime: "11:30", temperatureC: 17, windBeaufort: 2, cloudCoverPercent: 40, sky: "clear", completeList: true, clientUpdatedAt: "2026-05-14T11:50:00.000Z" };
    const sighting = (speciesId: string, over: Record<string, unknown> = {}) => ({ id: randomUUID(), visitId: visit.id, speciesId, count: 2, section: 1, clientUpdatedAt: "2026-05-14T11:00:00.000Z", ...over });
    const three = speciesIds.slice(0, 3).map((s) => sighting(s));
    const first = await applySyncBatch(volunteer, { visits: [visit], sightings: three });
    expect(first.status).toBe(200);
    expect(await summaryOf(visit.id)).toEqual({ pending: 3, queried: 0, accepted: 0, rejected: 0 });

    // A later edit of one (an upsert that updates) and one more new sighting in the same batch.
    const edited = { ...three[0]!, count: 5, clientUpdatedAt: "2026-05-14T12:00:00.000Z" };
    const fourth = sighting(speciesIds[3]!);
    const second = await applySyncBatch(volunteer, { sightings: [edited, fourth] });
    expect(second.response.results.map((r) => r.status)).toEqual(["updated", "created"]);
    expect(await summaryOf(visit.id)).toEqual({ pending: 4, queried: 0, accepted: 0, rejected: 0 });

    const third = await applySyncBatch(volunteer, { sightings: [{ ...three[1]!, deleted: true, clientUpdatedAt: "2026-05-14T12:30:00.000Z" }] });
    expect(third.response.results.map((r) => r.status)).toEqual(["deleted"]);
    expect(await summaryOf(visit.id)).toEqual({ pending: 3, queried: 0, accepted: 0, rejected: 0 });

    await applySyncBatch(volunteer, { visits: [visit], sightings: [edited, fourth] });
    expect(await summaryOf(visit.id)).toEqual({ pending: 3, queried: 0, accepted: 0, rejected: 0 });
    expect(await drift()).toEqual([]);
  });

  it("follows review decisions: accepted, queried, rejected, and back", async () => {
    const [walk] = await db().select({ visitId: visitSummaries.visitId }).from(visitSummaries).where(sql`${visitSummaries.pending} >= 3`).limit(1);
    const visitId = walk!.visitId;
    const before = (await summaryOf(visitId))!;
    const pending = await db().select({ id: sightings.id }).from(sightings).where(and(eq(sightings.visitId, visitId), eq(sightings.status, "pending"))).orderBy(asc(sightings.id)).limit(3);
    const checker = await actorFor("checker@harrowmere.example");
    const decide = (id: string, status: "accepted" | "queried" | "rejected" | "pending") =>
      db().transaction((tx) => tx.update(sightings).set({ status, reviewedAt: status === "pending" ? null : new Date(), reviewedById: status === "pending" ? null : checker.id }).where(eq(sightings.id, id)));
    await decide(pending[0]!.id, "accepted");
    await decide(pending[1]!.id, "queried");
    await decide(pending[2]!.id, "rejected");
    expect(await summaryOf(visitId)).toEqual({ pending: before.pending - 3, queried: before.queried + 1, accepted: before.accepted + 1, rejected: before.rejected + 1 });
    await decide(pending[1]!.id, "accepted");
    expect(await summaryOf(visitId)).toEqual({ pending: before.pending - 3, queried: before.queried, accepted: before.accepted + 2, rejected: before.rejected + 1 });
    // Many at once, in one statement: every waiting record of the season accepted.
    await db().update(sightings).set({ status: "accepted", reviewedAt: new Date() }).where(eq(sightings.status, "pending"));
    expect(await drift()).toEqual([]);
  });

  it("follows deletes: of sightings, of a whole walk (its row goes with it), and a sighting moved to another walk", async () => {
    const walks = await db().select({ visitId: visitSummaries.visitId }).from(visitSummaries).orderBy(asc(visitSummaries.visitId)).limit(3);
    const [a, b, c] = walks.map((w) => w.visitId) as [string, string, string];
    const [one] = await db().select({ id: sightings.id }).from(sightings).where(eq(sightings.visitId, a)).limit(1);
    await db().delete(sightings).where(eq(sightings.id, one!.id));
    expect(await drift()).toEqual([]);

    await db().delete(visits).where(eq(visits.id, b));
    expect(await summaryOf(b)).toBeNull();
    expect(await drift()).toEqual([]);

    const [moved] = await db().select({ id: sightings.id }).from(sightings).where(eq(sightings.visitId, a)).limit(1);
    await db().update(sightings).set({ visitId: c }).where(eq(sightings.id, moved!.id));
    expect(await drift()).toEqual([]);
  });

  it("follows a checklist merge and an earlier season's import", async () => {
    const organiser = await actorFor("organiser@harrowmere.example");
    const [keep, fold] = await db().select({ id: species.id }).from(species).where(inArray(species.scientificName, ["Pieris rapae", "Pieris napi"])).orderBy(asc(species.scientificName));
    await mergeEntries(organiser, { keepId: keep!.id, foldId: fold!.id });
    expect(await drift()).toEqual([]);

    const [season] = await db()
      .insert(seasons)
      .values({ name: "2024 season", startsOn: "2024-04-01", endsOn: "2024-09-30", status: "closed", openedAt: new Date("2024-04-01T00:00:00Z"), closedAt: new Date("2024-10-01T00:00:00Z") })
      .returning();
    const text = (s: string) => new TextEncoder().encode(s);
    const input = {
      seasonId: season!.id,
      recordStatus: "pending" as const,
      walks: {
        fileName: "walks-2024.csv",
        bytes: text(["walk_ref,transect_code,date,start_time,complete_list,recorder", "A1,CHK-01,2024-05-14,10:30,yes,volunteer01@harrowmere.example", "A2,CHK-01,2024-06-11,11:00,yes,volunteer01@harrowmere.example"].join("\n")),
      },
      sightings: { fileName: "sightings-2024.csv", bytes: text(["walk_ref,species,count", "A1,Maniola jurtina,12", "A1,Lysandra bellargus,3", "A2,Aglais io,1"].join("\n")) },
    };
    const preview = await previewSeasonImport(input);
    expect(preview.problems).toEqual([]);
    const { importId } = await importSeason(organiser, { ...input, previewHash: preview.previewHash! });
    const imported = await db().select({ id: visits.id, date: visits.visitDate }).from(visits).where(eq(visits.importId, importId)).orderBy(asc(visits.visitDate));
    expect(await Promise.all(imported.map((w) => summaryOf(w.id)))).toEqual([
      { pending: 2, queried: 0, accepted: 0, rejected: 0 },
      { pending: 1, queried: 0, accepted: 0, rejected: 0 },
    ]);
    expect(await drift()).toEqual([]);
  });

  it("is emptied when the sightings table is truncated", async () => {
    await db().execute(sql`truncate sightings cascade`);
    expect(await db().select().from(visitSummaries)).toEqual([]);
  });
});
