import "server-only";
import { and, asc, eq, inArray, ne, or, sql } from "drizzle-orm";
import { db } from "@/db/client";
import { sightings, species, visits } from "@/db/schema";
import type { Actor } from "@/lib/auth/guard";
import { phaseOf, takesFieldWalks } from "@/lib/seasons/rules";
import { assignedTransects } from "./field";
import { networkSettingsRow } from "./network";
import { DEFAULT_WALK_RULES } from "@/lib/review/walk-rules";
import { safetyAcceptedAt } from "./safety";
import { listSeasons, seasonGraceDays } from "./seasons";

/**
 * Everything the field screens need to work with no signal, in one answer the phone caches:
 * the volunteer's transects, the checklist, what was seen on each transect before, the
 * network's conditions rules, the seasons that take walks now (so the phone offers only their
 * dates), and whether this volunteer has acknowledged the safety notice.
 */
export async function fieldReference(actor: Actor) {
  const [{ season, transects }, checklist, settings, acceptedAt, allSeasons, graceDays] = await Promise.all([
    assignedTransects(actor),
    db()
      .select({
        id: species.id,
        scientificName: species.scientificName,
        vernacularName: species.vernacularName,
        taxonRank: species.taxonRank,
        sensitive: species.sensitive,
        activeMonths: species.activeMonths,
      })
      .from(species)
      .orderBy(asc(species.sortOrder), asc(species.vernacularName)),
    networkSettingsRow(),
    safetyAcceptedAt(actor),
    listSeasons(),
    seasonGraceDays(),
  ]);
  const now = new Date();
  const ids = transects.map((t) => t.id);
  // "Seen here before" reaches every phone on the transect, so it holds only what a checker
  // accepted, and a sensitive species only where this volunteer recorded it (not rejected):
  // never another volunteer's unchecked record, nor where someone else found a sensitive species.
  const shareable = or(
    and(eq(sightings.status, "accepted"), eq(species.sensitive, false)),
    and(eq(species.sensitive, true), eq(visits.volunteerId, actor.id), ne(sightings.status, "rejected")),
  );
  const seen = ids.length
    ? await db()
        .select({ transectId: visits.transectId, speciesId: sightings.speciesId, n: sql<number>`count(*)`.mapWith(Number) })
        .from(sightings)
        .innerJoin(visits, eq(visits.id, sightings.visitId))
        .innerJoin(species, eq(species.id, sightings.speciesId))
        .where(and(inArray(visits.transectId, ids), shareable))
        .groupBy(visits.transectId, sightings.speciesId)
    : [];
  const seenByTransect: Record<string, string[]> = {};
  for (const row of seen.sort((a, b) => b.n - a.n)) (seenByTransect[row.transectId] ??= []).push(row.speciesId);
  return {
    season: season ? { id: season.id, name: season.name, startsOn: season.startsOn, endsOn: season.endsOn, targetVisits: season.targetVisits } : null,
    /**
     * Seasons that take walks now, oldest first: open, or closed and in their grace period. The
     * start form's dates stay inside them; weather reports need an open one.
     */
    seasons: allSeasons
      .map((s) => ({ name: s.name, startsOn: s.startsOn, endsOn: s.endsOn, phase: phaseOf(s, graceDays, now) }))
      .filter((s) => takesFieldWalks(s.phase))
      .sort((a, b) => a.startsOn.localeCompare(b.startsOn)),
    transects,
    checklist,
    seenByTransect,
    /** The network's walk rules (lib/review/walk-rules.ts): the start form warns when one is broken. */
    rules: settings?.walkRules ?? DEFAULT_WALK_RULES,
    /** When this volunteer acknowledged the safety notice (the field screens ask until they have). */
    safetyAcceptedAt: acceptedAt?.toISOString() ?? null,
    savedAt: new Date().toISOString(),
  };
}

export type FieldReference = Awaited<ReturnType<typeof fieldReference>>;
