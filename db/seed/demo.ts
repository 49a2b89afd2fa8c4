import { sql } from "drizzle-orm";
import type { Database } from "../client";
import * as t from "../schema";
import { demoHabitats, demoNetwork, demoPassword, demoPeople, demoTransects, type HabitatCode } from "./network";
import { mulberry32, seededUuid } from "./random";
import { checklist, speciesTags } from "./species";
import { seedEffortExtras } from "./effort";
import { residents } from "./story";

export const DEMO_SEED = 20260401;

/** How long the demo's open season runs on after the seed day, so a walk can be recorded today and for weeks after. */
const OPEN_SEASON_RUNS_ON_DAYS = 60;

type DemoSeason = { name: string; startsOn: string; endsOn: string; status: "open" | "closed"; year: number; latest: boolean };

/**
 * The demo's two seasons, placed by the day it is seeded so the demo works whatever today is: the
 * open season's fieldwork (April to September, one walk a month) is the latest that is wholly
 * past, and the season stays open from 1 April of that year until some weeks after the seed day;
 * the closed season is the year before, long past its grace period (frozen). Only the dates move
 * with the seed day: every count, species and walk stays the same.
 */
export function demoSeasons(seedDay: Date = new Date()): DemoSeason[] {
  const today = seedDay.toISOString().slice(0, 10);
  const year = today > `${seedDay.getUTCFullYear()}-09-30` ? seedDay.getUTCFullYear() : seedDay.getUTCFullYear() - 1;
  const runsOn = new Date(Date.parse(`${today}T00:00:00Z`) + OPEN_SEASON_RUNS_ON_DAYS * 86_400_000).toISOString().slice(0, 10);
  return [
    { name: `${year - 1} season`, startsOn: `${year - 1}-04-01`, endsOn: `${year - 1}-09-30`, status: "closed", year: year - 1, latest: false },
    { name: `${year} season`, startsOn: `${year}-04-01`, endsOn: runsOn, status: "open", year, latest: true },
  ];
}

// Transects that show the comparison's exclusions and its exceptional case (in the open season).
const notWalkedThisSeason = "WDR-06";
const oneVisitThisSeason = "DUN-06";
const wipedOut = "WET-05";

const pad = (n: number) => String(n).padStart(2, "0");

/**
 * Fills an empty database with the demo network, deterministically. Everything is written in
 * one transaction so a failed seed leaves nothing half-made.
 */
export async function seedDemo(database: Database, passwordHash: string, seedDay: Date = new Date()): Promise<{ sightings: number }> {
  const seasonsDef = demoSeasons(seedDay);
  const rand = mulberry32(DEMO_SEED);
  const uuid = () => seededUuid(rand);
  let sightingTotal = 0;

  await database.transaction(async (tx) => {
    await tx.insert(t.networkSettings).values({ id: 1, ...demoNetwork });

    const organiserId = uuid();
    const coordinatorId = uuid();
    const partnerId = uuid();
    const volunteerIds = demoPeople.volunteers.map(() => uuid());
    await tx.insert(t.users).values([
      { id: organiserId, ...demoPeople.organiser, roles: ["organiser"], passwordHash },
      { id: coordinatorId, ...demoPeople.coordinator, roles: ["coordinator"], passwordHash, invitedById: organiserId },
      { id: partnerId, ...demoPeople.partner, roles: ["partner"], passwordHash, invitedById: organiserId },
      ...demoPeople.volunteers.map((v, i) => ({ id: volunteerIds[i]!, ...v, roles: ["volunteer" as const], passwordHash, invitedById: organiserId })),
    ]);

    const tagRows = await tx.insert(t.speciesTags).values(speciesTags).returning();
    const tagId = new Map(tagRows.map((r) => [r.slug, r.id]));
    const speciesRows = await tx
      .insert(t.species)
      .values(
        checklist.map((s, i) => ({
          id: uuid(),
          scientificName: s.scientific,
          vernacularName: s.vernacular,
          taxonRank: s.rank ?? "species",
          taxonGroup: demoNetwork.taxonGroup,
          sensitive: s.sensitive ?? false,
          activeMonths: s.months,
          sortOrder: i,
        })),
      )
      .returning();
    const speciesId = new Map(speciesRows.map((r) => [r.scientificName, r.id]));
    await tx.insert(t.speciesTagLinks).values(
      checklist.flatMap((s) => s.tags.map((tag) => ({ speciesId: speciesId.get(s.scientific)!, tagId: tagId.get(tag)! }))),
    );
    await tx.insert(t.speciesAggregateMembers).values(
      checklist.flatMap((s) => (s.members ?? []).map((member) => ({ aggregateId: speciesId.get(s.scientific)!, memberId: speciesId.get(member)! }))),
    );

    const habitatRows = await tx.insert(t.habitatGroups).values(demoHabitats.map((h) => ({ ...h }))).returning();
    const habitatId = new Map(habitatRows.map((r) => [r.code, r.id]));
    const transectDefs = demoTransects(rand).map((d) => ({ ...d, id: uuid() }));
    await tx.insert(t.transects).values(
      transectDefs.map((d) => ({
        id: d.id,
        code: d.code,
        name: d.name,
        habitatGroupId: habitatId.get(d.habitat)!,
        route: d.route,
        sectionCount: d.sectionCount,
        lengthMetres: d.lengthMetres,
        coastal: d.coastal,
        accessNotes: d.accessNotes,
      })),
    );
    // One route version per transect, in force from the first season on; section n is the
    // stretch between route points n − 1 and n.
    const versionRows = await tx
      .insert(t.transectRouteVersions)
      .values(
        transectDefs.map((d) => ({
          transectId: d.id,
          version: 1,
          validFrom: seasonsDef[0]!.startsOn,
          route: d.route,
          sectionCount: d.sectionCount,
          lengthMetres: d.lengthMetres,
          createdById: organiserId,
        })),
      )
      .returning({ id: t.transectRouteVersions.id, transectId: t.transectRouteVersions.transectId });
    const versionOf = new Map(versionRows.map((v) => [v.transectId, v.id]));
    await tx.insert(t.transectSections).values(
      transectDefs.flatMap((d) =>
        d.sectionLengths.map((lengthMetres, s) => ({ versionId: versionOf.get(d.id)!, number: s + 1, fromPoint: s, toPoint: s + 1, lengthMetres })),
      ),
    );
    // Two transects per volunteer; the organiser assigns them.
    await tx.insert(t.transectAssignments).values(
      transectDefs.map((d, i) => ({ transectId: d.id, userId: volunteerIds[Math.floor(i / 2) % volunteerIds.length]!, assignedById: organiserId })),
    );

    const seasonRows = await tx
      .insert(t.seasons)
      .values(
        seasonsDef.map((s) => ({
          name: s.name,
          startsOn: s.startsOn,
          endsOn: s.endsOn,
          status: s.status,
          openedAt: new Date(`${s.startsOn}T00:00:00Z`),
          closedAt: s.status === "closed" ? new Date(`${s.endsOn}T18:00:00Z`) : null,
          minVisits: 3,
          targetVisits: 6,
        })),
      )
      .returning();

    const visitRows: (typeof t.visits.$inferInsert)[] = [];
    const sightingRows: (typeof t.sightings.$inferInsert)[] = [];
    const eventRows: (typeof t.verificationEvents.$inferInsert)[] = [];

    transectDefs.forEach((d, ti) => {
      const volunteerId = volunteerIds[Math.floor(ti / 2) % volunteerIds.length]!;
      const { before, after } = residents(d.habitat as HabitatCode, checklist, rand, d.code === wipedOut);
      seasonsDef.forEach((s, si) => {
        const season = seasonRows[si]!;
        const present = si === 0 ? before : after;
        let visitCount = 6;
        if (s.latest && d.code === notWalkedThisSeason) visitCount = 0;
        if (s.latest && d.code === oneVisitThisSeason) visitCount = 1;
        for (let v = 0; v < visitCount; v++) {
          const month = 4 + v; // one visit a month, April to September
          const day = 3 + Math.floor(rand() * 24);
          const visitDate = `${s.year}-${pad(month)}-${pad(day)}`;
          const startHour = 10 + Math.floor(rand() * 5);
          const visitId = uuid();
          const wind = rand() < 0.08 ? 6 : Math.floor(rand() * 5);
          visitRows.push({
            id: visitId,
            transectId: d.id,
            volunteerId,
            seasonId: season.id,
            visitDate,
            startTime: `${pad(startHour)}:${pad(Math.floor(rand() * 4) * 15)}:00`,
            endTime: `${pad(startHour + 1)}:${pad(Math.floor(rand() * 4) * 15)}:00`,
            temperatureC: Math.round((14 + rand() * 11 + (month >= 6 && month <= 8 ? 3 : 0)) * 10) / 10,
            windBeaufort: wind,
            cloudCoverPercent: Math.floor(rand() * 9) * 10,
            sky: (["clear", "mostly_sunny", "broken_cloud", "mostly_cloudy"] as const)[Math.floor(rand() * 4)],
            completeList: rand() > 0.05,
            submittedAt: new Date(`${visitDate}T18:00:00Z`),
          });
          // An open-season visit from July on is still waiting for the checker.
          const reviewed = !s.latest || month < 7;
          for (const sp of checklist) {
            if (!present.has(sp.scientific) || !sp.months.includes(month)) continue;
            if (rand() > 0.7) continue; // not every resident is seen on every walk
            const id = uuid();
            let status: t.SightingStatus = reviewed ? "accepted" : "pending";
            if (reviewed && rand() < 0.02) status = "rejected";
            if (!reviewed && sp.sensitive && rand() < 0.6) status = "queried";
            sightingRows.push({
              id,
              visitId,
              speciesId: speciesId.get(sp.scientific)!,
              count: 1 + Math.floor(-Math.log(1 - rand()) * (sp.tags.includes("wider-countryside") ? 6 : 3)),
              section: 1 + Math.floor(rand() * d.sectionCount),
              status,
              reviewedById: status === "pending" ? null : coordinatorId,
              reviewedAt: status === "pending" ? null : new Date(`${visitDate}T20:00:00Z`),
            });
            if (status !== "pending") {
              eventRows.push({
                sightingId: id,
                actorId: coordinatorId,
                action: status === "accepted" ? "accept" : status === "rejected" ? "reject" : "query",
                fromStatus: "pending",
                toStatus: status,
                message:
                  status === "queried"
                    ? `${sp.vernacular} would be notable here: do you have a photo, or notes on how you told it apart?`
                    : status === "rejected"
                      ? "Outside the species' known range in the valley; recorded as unconfirmed."
                      : null,
                createdAt: new Date(`${visitDate}T20:00:00Z`),
              });
            }
          }
          // Small skippers are often left at the pair: a record above species level.
          if (d.habitat === "CHK" && month === 7 && rand() < 0.5) {
            sightingRows.push({
              id: uuid(),
              visitId,
              speciesId: speciesId.get("Thymelicus sylvestris/lineola")!,
              count: 2 + Math.floor(rand() * 5),
              section: 1 + Math.floor(rand() * d.sectionCount),
              status: reviewed ? "accepted" : "pending",
            });
          }
        }
      });
    });

    for (let i = 0; i < visitRows.length; i += 500) await tx.insert(t.visits).values(visitRows.slice(i, i + 500));
    for (let i = 0; i < sightingRows.length; i += 500) await tx.insert(t.sightings).values(sightingRows.slice(i, i + 500));
    for (let i = 0; i < eventRows.length; i += 500) await tx.insert(t.verificationEvents).values(eventRows.slice(i, i + 500));
    sightingTotal = sightingRows.length;
    const latest = seasonsDef.findIndex((s) => s.latest);
    await seedEffortExtras(tx, seasonRows[latest]!.id, seasonsDef[latest]!.year);
  });
  return { sightings: sightingTotal };
}

export async function isDatabaseEmpty(database: Database): Promise<boolean> {
  const rows = await database.execute<{ n: number }>(sql`select count(*)::int as n from users`);
  return (rows[0]?.n ?? 0) === 0;
}

export { demoPassword };
