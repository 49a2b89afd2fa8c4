import "server-only";
import { randomUUID } from "node:crypto";
import { and, asc, eq, inArray, isNull, sql } from "drizzle-orm";
import { db, type Transaction } from "@/db/client";
import { networkSettings, seasons, sightings, species, transectAssignments, transectRouteVersions, transects, users, visits } from "@/db/schema";
import type { Actor } from "@/lib/auth/guard";
import { hasRole } from "@/lib/auth/roles";
import { forbidden, invalid } from "@/lib/errors";
import { versionOn } from "@/lib/geo/versions";
import { DEFAULT_SEASON_GRACE_DAYS } from "@/lib/limits/seasons";
import { phaseOf, recordChangeRule } from "@/lib/seasons/rules";
import type { PaperWalkValues } from "@/app/(review)/review/paper-walks/schema";
import { logChange } from "./change-log";

/** What the form offers: active volunteers (with their transects), active transects, the checklist. */
export async function paperWalkChoices() {
  const [volunteers, assignments, transectRows, checklist] = await Promise.all([
    db()
      .select({ id: users.id, name: users.name })
      .from(users)
      .where(and(eq(users.active, true), isNull(users.erasedAt), sql`'volunteer' = any(${users.roles})`))
      .orderBy(asc(users.name)),
    db().select({ userId: transectAssignments.userId, transectId: transectAssignments.transectId }).from(transectAssignments),
    db().select({ id: transects.id, code: transects.code, name: transects.name, sectionCount: transects.sectionCount }).from(transects).where(eq(transects.active, true)).orderBy(asc(transects.code)),
    db().select({ id: species.id, scientificName: species.scientificName, vernacularName: species.vernacularName, taxonRank: species.taxonRank, sensitive: species.sensitive }).from(species).orderBy(asc(species.sortOrder)),
  ]);
  const assigned = new Map<string, string[]>();
  for (const a of assignments) assigned.set(a.userId, [...(assigned.get(a.userId) ?? []), a.transectId]);
  return { volunteers: volunteers.map((v) => ({ ...v, transectIds: assigned.get(v.id) ?? [] })), transects: transectRows, checklist };
}

export type PaperWalkChoices = Awaited<ReturnType<typeof paperWalkChoices>>;

async function seasonForEntry(tx: Transaction, actor: Actor, visitDate: string) {
  const [season] = await tx.select().from(seasons).where(sql`${visitDate}::date between ${seasons.startsOn} and ${seasons.endsOn}`).limit(1);
  if (!season) throw invalid({ visitDate: [`No season covers ${visitDate}. Walks are entered into a season; ask an organiser to add it.`] });
  const [settings] = await tx.select({ graceDays: networkSettings.seasonGraceDays }).from(networkSettings).limit(1);
  // The season rules (lib/seasons/rules.ts): open or in grace, or frozen for an organiser only, logged.
  const phase = phaseOf(season, settings?.graceDays ?? DEFAULT_SEASON_GRACE_DAYS);
  if (phase === "planning") throw invalid({ visitDate: [`The ${season.name} has not opened yet.`] });
  const rule = recordChangeRule(phase, hasRole(actor, "organiser"));
  if (!rule.allowed) throw forbidden(`The ${season.name} is frozen: its grace period is over. Only an organiser can still enter a walk into it, and it is logged.`);
  return { season, logged: rule.logged };
}

/**
 * Enters a walk a volunteer recorded on paper, in one transaction: the walk says who entered it
 * (entered_by_id), its sightings wait for review. A walk into a frozen season needs an organiser
 * and is written to the change log.
 */
export async function createPaperWalk(actor: Actor, input: PaperWalkValues): Promise<{ visitId: string; sightings: number }> {
  return db().transaction(async (tx) => {
    const [volunteer] = await tx
      .select({ id: users.id, name: users.name })
      .from(users)
      .where(and(eq(users.id, input.volunteerId), eq(users.active, true), isNull(users.erasedAt), sql`'volunteer' = any(${users.roles})`));
    if (!volunteer) throw invalid({ volunteerId: ["Choose an active volunteer."] });
    const [transect] = await tx.select({ id: transects.id, code: transects.code }).from(transects).where(and(eq(transects.id, input.transectId), eq(transects.active, true)));
    if (!transect) throw invalid({ transectId: ["Choose an active transect."] });
    const { season, logged } = await seasonForEntry(tx, actor, input.visitDate);

    const versions = await tx.select({ version: transectRouteVersions.version, validFrom: transectRouteVersions.validFrom, sectionCount: transectRouteVersions.sectionCount }).from(transectRouteVersions).where(eq(transectRouteVersions.transectId, transect.id));
    const sectionCount = versionOn(versions, input.visitDate)?.sectionCount ?? 0;
    const speciesIds = [...new Set(input.sightings.map((s) => s.speciesId))];
    const known = new Set(speciesIds.length ? (await tx.select({ id: species.id }).from(species).where(inArray(species.id, speciesIds))).map((s) => s.id) : []);
    const fields: Record<string, string[]> = {};
    input.sightings.forEach((s, i) => {
      if (!known.has(s.speciesId)) fields[`sightings.${i}.speciesId`] = ["That species is no longer on the checklist."];
      if (s.section !== null && s.section > sectionCount) fields[`sightings.${i}.section`] = [`${transect.code} had ${sectionCount} sections on ${input.visitDate}.`];
    });
    if (Object.keys(fields).length) throw invalid(fields);

    const visitId = randomUUID();
    const now = new Date();
    await tx.insert(visits).values({
      id: visitId,
      transectId: transect.id,
      volunteerId: volunteer.id,
      seasonId: season.id,
      visitDate: input.visitDate,
      startTime: input.startTime,
      endTime: input.endTime,
      temperatureC: input.temperatureC,
      windBeaufort: input.windBeaufort,
      cloudCoverPercent: input.cloudCoverPercent,
      sky: input.sky,
      sunshinePercent: input.sunshinePercent,
      rain: input.rain,
      completeList: input.completeList === "yes",
      notes: input.notes,
      enteredById: actor.id,
      submittedAt: now,
    });
    if (input.sightings.length) {
      await tx.insert(sightings).values(input.sightings.map((s) => ({ id: randomUUID(), visitId, speciesId: s.speciesId, count: s.count, section: s.section, status: "pending" as const })));
    }
    if (logged) {
      await logChange(tx, actor, {
        entity: "season",
        entityId: season.id,
        action: "late-entry",
        summary: `Entered a paper walk into the frozen ${season.name}: ${transect.code} on ${input.visitDate}, recorded by ${volunteer.name}, ${input.sightings.length} sightings`,
        after: { visitId, transectId: transect.id, volunteerId: volunteer.id, visitDate: input.visitDate, sightings: input.sightings.length },
      });
    }
    return { visitId, sightings: input.sightings.length };
  });
}
