// Extras for the organiser's effort grid, so the demo shows every state of a week: a few weeks
// reported as not walked because of the weather, and one walk where nothing was seen. Called by
// seedDemo inside its transaction after the seasons' walks; it draws from its own generator, so
// every other demo row (and count) stays as it was. Weather reports sit in the open season's
// fieldwork months, long before the seed day, on weeks their transect was not walked.
import { and, asc, eq } from "drizzle-orm";
import { addDays, mondayOf } from "../../lib/effort/weeks";
import type { Transaction } from "../client";
import * as t from "../schema";
import { mulberry32, seededUuid } from "./random";

const EFFORT_SEED = 20260402;

/** Transects given weather reports: one never walked this season and two walked monthly. */
const WEATHER_TRANSECTS = ["WDR-06", "CHK-01", "WET-02"];
const EMPTY_WALK_TRANSECT = "DUN-02";

export async function seedEffortExtras(tx: Transaction, seasonId: string, fieldworkYear: number): Promise<void> {
  const uuid = (() => {
    const rand = mulberry32(EFFORT_SEED);
    return () => seededUuid(rand);
  })();
  const rows = await tx
    .select({ id: t.transects.id, code: t.transects.code, volunteerId: t.transectAssignments.userId })
    .from(t.transects)
    .innerJoin(t.transectAssignments, eq(t.transectAssignments.transectId, t.transects.id))
    .orderBy(asc(t.transects.code));
  const walkWeeks = async (transectId: string) =>
    new Set(
      (await tx.select({ date: t.visits.visitDate }).from(t.visits).where(and(eq(t.visits.transectId, transectId), eq(t.visits.seasonId, seasonId)))).map((v) =>
        mondayOf(v.date),
      ),
    );
  // Mondays of June, July and August of the fieldwork year.
  const summerWeeks: string[] = [];
  for (let monday = mondayOf(`${fieldworkYear}-06-08`); monday < `${fieldworkYear}-09-01`; monday = addDays(monday, 7)) summerWeeks.push(monday);

  const misses: (typeof t.weatherMisses.$inferInsert)[] = [];
  for (const code of WEATHER_TRANSECTS) {
    const row = rows.find((r) => r.code === code);
    if (!row) continue;
    const walked = await walkWeeks(row.id);
    const free = summerWeeks.filter((w) => !walked.has(w) && !walked.has(addDays(w, -7)));
    for (const weekStart of free.filter((_, i) => i % 3 === 0).slice(0, 3)) {
      misses.push({ id: uuid(), transectId: row.id, volunteerId: row.volunteerId, seasonId, weekStart, reportedOn: addDays(weekStart, 4) });
    }
  }
  if (misses.length) await tx.insert(t.weatherMisses).values(misses);

  const empty = rows.find((r) => r.code === EMPTY_WALK_TRANSECT);
  if (!empty) return;
  const walked = await walkWeeks(empty.id);
  const week = summerWeeks.find((w) => !walked.has(w));
  if (!week) return;
  const visitDate = addDays(week, 2);
  // A cool, dull morning on the dunes: the walk was made and nothing was flying.
  await tx.insert(t.visits).values({
    id: uuid(),
    transectId: empty.id,
    volunteerId: empty.volunteerId,
    seasonId,
    visitDate,
    startTime: "10:15:00",
    endTime: "11:05:00",
    temperatureC: 13.5,
    windBeaufort: 3,
    cloudCoverPercent: 90,
    sky: "overcast",
    completeList: true,
    notes: "Nothing flying in the wind off the sea.",
    submittedAt: new Date(`${visitDate}T18:00:00Z`),
  });
}
