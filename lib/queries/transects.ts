import "server-only";
import { and, asc, count, desc, eq, gt, gte, inArray, max, ne, sql, type SQLWrapper } from "drizzle-orm";
import { db, type Transaction } from "@/db/client";
import { habitatGroups, sightings, transectRouteVersions, transectSections, transects, users, visits } from "@/db/schema";
import type { Actor } from "@/lib/auth/guard";
import { invalid, notFound } from "@/lib/errors";
import { readRouteFile, type RouteFile } from "@/lib/geo/route-file";
import { buildRoute, sectionLines } from "@/lib/geo/sections";
import { thinForOverview } from "@/lib/geo/thin";
import type { BuiltRoute, SectionDraft } from "@/lib/geo/types";
import { changedBetween, versionOn, type DateSpan, type VersionSpan } from "@/lib/geo/versions";
import { logChange } from "./change-log";
import { withVisibleRoutes, visibleRoute } from "./route-visibility";
import { currentSeason } from "./seasons";

// Transects, their sections and their route versions. transects.route, section_count and
// length_metres always repeat the latest version, so code that reads the transect alone sees
// the current route; walks are measured against the version of their date (lib/geo/versions.ts).

export type RouteInput = { sections?: SectionDraft[]; file?: RouteFile };

type Details = { code: string; name: string; habitatGroupId: string; sensitive: boolean; coastal: boolean; accessNotes: string | null };

const todayUtc = () => new Date().toISOString().slice(0, 10);

/** Checks and measures a route as sent; refuses (400, field "route") with every reason found. */
export function checkedRoute(input: RouteInput): { built: BuiltRoute; warnings: string[] } {
  const result = input.file ? readRouteFile(input.file) : buildRoute(input.sections ?? []);
  if (!result.ok) throw invalid({ route: result.errors }, result.errors[0]);
  return { built: result.value, warnings: result.warnings };
}

/** A route file read for the organiser's preview; nothing is stored. */
export function previewRouteFile(file: RouteFile) {
  const { built, warnings } = checkedRoute({ file });
  return { ...built, sectionLines: sectionLines(built.route, built.sections), warnings };
}

// ---- reading ---------------------------------------------------------------------------------

/** Every transect, retired ones too, with its habitat group and this season's walks against the target. */
export async function listTransects(actor: Actor) {
  const season = await currentSeason();
  const walks = db()
    .select({ transectId: visits.transectId, walks: count().as("walks"), lastWalk: max(visits.visitDate).as("last_walk") })
    .from(visits)
    .where(season ? eq(visits.seasonId, season.id) : sql`false`)
    .groupBy(visits.transectId)
    .as("walks");
  const rows = await db()
    .select({
      id: transects.id,
      code: transects.code,
      name: transects.name,
      habitatGroupId: transects.habitatGroupId,
      habitatName: habitatGroups.name,
      habitatColour: habitatGroups.colour,
      lengthMetres: transects.lengthMetres,
      sectionCount: transects.sectionCount,
      sensitive: transects.sensitive,
      active: transects.active,
      retiredAt: transects.retiredAt,
      route: transects.route,
      walks: sql<number>`coalesce(${walks.walks}, 0)`.mapWith(Number),
      lastWalk: walks.lastWalk,
    })
    .from(transects)
    .innerJoin(habitatGroups, eq(habitatGroups.id, transects.habitatGroupId))
    .leftJoin(walks, eq(walks.transectId, transects.id))
    .orderBy(desc(transects.active), asc(transects.code));
  // The overview map draws every route at once: a thinned line is enough there.
  const thinned = rows.map((r) => ({ ...r, retiredAt: r.retiredAt?.toISOString() ?? null, route: { type: "LineString" as const, coordinates: thinForOverview(r.route.coordinates) } }));
  return {
    season: season ? { id: season.id, name: season.name, status: season.status, targetVisits: season.targetVisits } : null,
    transects: await withVisibleRoutes(actor, thinned),
  };
}

export type TransectList = Awaited<ReturnType<typeof listTransects>>;

async function versionsOf(transectId: string) {
  return db()
    .select({
      id: transectRouteVersions.id,
      version: transectRouteVersions.version,
      validFrom: transectRouteVersions.validFrom,
      sectionCount: transectRouteVersions.sectionCount,
      lengthMetres: transectRouteVersions.lengthMetres,
      createdAt: transectRouteVersions.createdAt,
      createdBy: users.name,
    })
    .from(transectRouteVersions)
    .leftJoin(users, eq(users.id, transectRouteVersions.createdById))
    .where(eq(transectRouteVersions.transectId, transectId))
    .orderBy(desc(transectRouteVersions.version));
}

/** One transect: its details, current route and sections, and every route version. */
export async function getTransect(actor: Actor, id: string) {
  const [row] = await db()
    .select({ transect: transects, habitatName: habitatGroups.name, habitatColour: habitatGroups.colour })
    .from(transects)
    .innerJoin(habitatGroups, eq(habitatGroups.id, transects.habitatGroupId))
    .where(eq(transects.id, id));
  if (!row) throw notFound("That transect");
  const versions = await versionsOf(id);
  const current = versions[0];
  const sections = current
    ? await db().select().from(transectSections).where(eq(transectSections.versionId, current.id)).orderBy(asc(transectSections.number))
    : [];
  const [walked] = await db().select({ walks: count() }).from(visits).where(eq(visits.transectId, id));
  const t = row.transect;
  const { route } = await visibleRoute(actor, t);
  const exact = route.type === "LineString";
  return {
    id: t.id,
    ...detailsOf(t),
    retiredAt: t.retiredAt?.toISOString() ?? null,
    lengthMetres: t.lengthMetres,
    sectionCount: t.sectionCount,
    route,
    habitatName: row.habitatName,
    habitatColour: row.habitatColour,
    walks: walked?.walks ?? 0,
    sections: sections.map((s) => ({
      number: s.number,
      lengthMetres: s.lengthMetres,
      habitat: s.habitat,
      // A section's own stretch is part of the exact route: shown only with it.
      from: s.fromPoint,
      to: s.toPoint,
      coordinates: exact ? t.route.coordinates.slice(s.fromPoint, s.toPoint + 1) : null,
    })),
    versions: versions.map(({ id: _id, ...v }) => ({ ...v, createdAt: v.createdAt.toISOString() })),
  };
}

export type TransectDetail = Awaited<ReturnType<typeof getTransect>>;

// ---- versions by date (for sync and comparisons) ---------------------------------------------

/** Route versions of several transects (sync checks a batch's sections with one read). */
export async function versionSpansOf(transectIds: string[]): Promise<Map<string, VersionSpan[]>> {
  const spans = new Map<string, VersionSpan[]>();
  if (transectIds.length === 0) return spans;
  const rows = await db()
    .select({ transectId: transectRouteVersions.transectId, version: transectRouteVersions.version, validFrom: transectRouteVersions.validFrom, sectionCount: transectRouteVersions.sectionCount })
    .from(transectRouteVersions)
    .where(inArray(transectRouteVersions.transectId, [...new Set(transectIds)]));
  for (const { transectId, ...span } of rows) (spans.get(transectId) ?? spans.set(transectId, []).get(transectId)!).push(span);
  return spans;
}

/** The route version a walk on `date` (YYYY-MM-DD) was walked on, with its route; null for an unknown transect. */
export async function routeVersionOn(transectId: string, date: string) {
  const rows = await db().select().from(transectRouteVersions).where(eq(transectRouteVersions.transectId, transectId));
  return versionOn(rows, date);
}

/** Sections of the route a walk on `date` was walked on (what a sighting's section is checked against). */
export async function sectionCountOn(transectId: string, date: string): Promise<number | null> {
  const spans = (await versionSpansOf([transectId])).get(transectId) ?? [];
  return versionOn(spans, date)?.sectionCount ?? null;
}

/**
 * The same rule as sectionCountOn in SQL, for statements that check many walks at once (sync's
 * stored visits): the latest version valid on or before the date, else the first version.
 */
export function sectionCountOnSql(transectId: SQLWrapper, date: SQLWrapper) {
  return sql<number>`(select v.section_count from ${transectRouteVersions} v where v.transect_id = ${transectId}
    order by case when v.valid_from <= ${date} then 0 else 1 end, case when v.valid_from <= ${date} then v.valid_from end desc, v.valid_from limit 1)`;
}

/** Whether the transect's route changed between two seasons (either order): comparisons flag it. */
export async function routeChangedBetween(transectId: string, seasonA: DateSpan, seasonB: DateSpan): Promise<boolean> {
  const spans = (await versionSpansOf([transectId])).get(transectId) ?? [];
  return changedBetween(spans, seasonA, seasonB);
}

/** Every transect whose route changed between two seasons (the same rule, in one query). */
export async function routesChangedBetween(seasonA: DateSpan, seasonB: DateSpan): Promise<Set<string>> {
  const [earlier, later] = seasonA.startsOn <= seasonB.startsOn ? [seasonA, seasonB] : [seasonB, seasonA];
  const rows = await db()
    .selectDistinct({ transectId: transectRouteVersions.transectId })
    .from(transectRouteVersions)
    // Version 1 always has the earliest date (later versions must start after it): it is no change.
    .where(and(gt(transectRouteVersions.version, 1), gt(transectRouteVersions.validFrom, earlier.startsOn), sql`${transectRouteVersions.validFrom} <= ${later.endsOn}`));
  return new Set(rows.map((r) => r.transectId));
}

// ---- writing ---------------------------------------------------------------------------------

const routeSummary = (built: BuiltRoute, version: number, validFrom: string) => ({
  routeVersion: version,
  validFrom,
  lengthMetres: built.lengthMetres,
  sectionCount: built.sections.length,
  sectionLengths: built.sections.map((s) => s.lengthMetres),
  points: built.route.coordinates.length,
});

const detailsOf = (t: typeof transects.$inferSelect) => ({
  code: t.code,
  name: t.name,
  habitatGroupId: t.habitatGroupId,
  sensitive: t.sensitive,
  coastal: t.coastal,
  accessNotes: t.accessNotes,
  active: t.active,
});

// Serialises writers of transect codes so the clash check below holds under concurrency.
const lockCodes = (tx: Transaction) => tx.execute(sql`select pg_advisory_xact_lock(hashtext('turnstone:transect_codes'))`);

async function checkCodeAndHabitat(tx: Transaction, values: { code?: string; habitatGroupId?: string }, exceptId?: string) {
  const errors: Record<string, string[]> = {};
  if (values.code) {
    const [clash] = await tx
      .select({ id: transects.id })
      .from(transects)
      .where(and(eq(transects.code, values.code), exceptId ? ne(transects.id, exceptId) : sql`true`))
      .limit(1);
    if (clash) errors.code = ["Another transect has this code (retired ones keep theirs)."];
  }
  if (values.habitatGroupId) {
    // KEY SHARE: a habitat group cannot be deleted while a transect is being put in it.
    const [group] = await tx.select({ id: habitatGroups.id }).from(habitatGroups).where(eq(habitatGroups.id, values.habitatGroupId)).for("key share");
    if (!group) errors.habitatGroupId = ["That habitat group does not exist."];
  }
  if (Object.keys(errors).length) throw invalid(errors);
}

async function writeSections(tx: Transaction, versionId: string, built: BuiltRoute) {
  await tx.insert(transectSections).values(
    built.sections.map((s) => ({ versionId, number: s.number, fromPoint: s.from, toPoint: s.to, lengthMetres: s.lengthMetres, habitat: s.habitat })),
  );
}

/** A new transect with its first route version (valid from today; it also covers earlier walks). */
export async function createTransect(actor: Actor, input: Details & { route: RouteInput }) {
  const { built, warnings } = checkedRoute(input.route);
  const validFrom = todayUtc();
  return db().transaction(async (tx) => {
    await lockCodes(tx);
    await checkCodeAndHabitat(tx, input);
    const [row] = await tx
      .insert(transects)
      .values({
        code: input.code,
        name: input.name,
        habitatGroupId: input.habitatGroupId,
        sensitive: input.sensitive,
        coastal: input.coastal,
        accessNotes: input.accessNotes,
        route: built.route,
        sectionCount: built.sections.length,
        lengthMetres: built.lengthMetres,
      })
      .returning();
    const [version] = await tx
      .insert(transectRouteVersions)
      .values({ transectId: row!.id, version: 1, validFrom, route: built.route, sectionCount: built.sections.length, lengthMetres: built.lengthMetres, createdById: actor.id })
      .returning({ id: transectRouteVersions.id });
    await writeSections(tx, version!.id, built);
    await logChange(tx, actor, {
      entity: "transect",
      entityId: row!.id,
      action: "create",
      summary: `Created transect ${row!.code} ${row!.name}: ${built.lengthMetres.toLocaleString("en-GB")} m in ${built.sections.length} section${built.sections.length === 1 ? "" : "s"}`,
      after: { ...detailsOf(row!), ...routeSummary(built, 1, validFrom) },
    });
    return { id: row!.id, code: row!.code, lengthMetres: built.lengthMetres, sections: built.sections, warnings };
  });
}

async function lockedTransect(tx: Transaction, id: string) {
  const [row] = await tx.select().from(transects).where(eq(transects.id, id)).for("update");
  if (!row) throw notFound("That transect");
  return row;
}

/** Code, name, habitat group, flags and notes; the route has its own versioned change. */
export async function updateTransect(actor: Actor, id: string, patch: Partial<Details>) {
  return db().transaction(async (tx) => {
    if (patch.code) await lockCodes(tx);
    const before = await lockedTransect(tx, id);
    await checkCodeAndHabitat(tx, patch, id);
    const [after] = await tx
      .update(transects)
      .set({ ...patch, updatedAt: new Date() })
      .where(eq(transects.id, id))
      .returning();
    const changed = Object.keys(patch).filter((k) => JSON.stringify(before[k as keyof Details]) !== JSON.stringify(after![k as keyof Details]));
    if (changed.length > 0) {
      await logChange(tx, actor, {
        entity: "transect",
        entityId: id,
        action: "update",
        summary: `Changed ${changed.join(", ")} of transect ${after!.code}`,
        before: detailsOf(before),
        after: detailsOf(after!),
      });
    }
    return after!;
  });
}

const sameRoute = (built: BuiltRoute, current: { route: unknown }, sections: (typeof transectSections.$inferSelect)[]) =>
  JSON.stringify(built.route.coordinates) === JSON.stringify((current.route as BuiltRoute["route"]).coordinates) &&
  built.sections.length === sections.length &&
  built.sections.every((s, i) => s.from === sections[i]!.fromPoint && s.to === sections[i]!.toPoint && s.habitat === sections[i]!.habitat);

/**
 * A new route (or new sections) from `validFrom` on: a new version, so walks before that date
 * keep the version they were walked on. The same date as the latest version corrects that
 * version instead. Refused when it would start before the latest version, or when sightings on
 * walks from that date on name sections the new route does not have.
 */
export async function changeRoute(actor: Actor, id: string, input: { route: RouteInput; validFrom: string }) {
  const { built, warnings } = checkedRoute(input.route);
  const { validFrom } = input;
  return db().transaction(async (tx) => {
    const transect = await lockedTransect(tx, id);
    const [latest] = await tx.select().from(transectRouteVersions).where(eq(transectRouteVersions.transectId, id)).orderBy(desc(transectRouteVersions.version)).limit(1).for("update");
    if (!latest) throw notFound("That transect's route");
    if (validFrom < latest.validFrom) {
      throw invalid({ validFrom: [`Route version ${latest.version} starts on ${latest.validFrom}: a new route must start after it (or on that day, to correct it).`] });
    }
    const latestSections = await tx.select().from(transectSections).where(eq(transectSections.versionId, latest.id)).orderBy(asc(transectSections.number));
    if (sameRoute(built, latest, latestSections)) return { id, version: latest.version, validFrom: latest.validFrom, unchanged: true, lengthMetres: latest.lengthMetres, warnings };

    const [beyond] = await tx
      .select({ n: count(), highest: max(sightings.section) })
      .from(sightings)
      .innerJoin(visits, eq(visits.id, sightings.visitId))
      .where(and(eq(visits.transectId, id), gte(visits.visitDate, validFrom), gt(sightings.section, built.sections.length)));
    if ((beyond?.n ?? 0) > 0) {
      throw invalid({
        route: [
          `${beyond!.n} sighting${beyond!.n === 1 ? "" : "s"} on walks from ${validFrom} on ${beyond!.n === 1 ? "is" : "are"} in sections up to ${beyond!.highest}, but the new route has ${built.sections.length}: keep at least ${beyond!.highest} sections or start the new route later.`,
        ],
      });
    }
    const [moved] = await tx.select({ n: count() }).from(visits).where(and(eq(visits.transectId, id), gte(visits.visitDate, validFrom)));
    if ((moved?.n ?? 0) > 0) warnings.push(`${moved!.n} walk${moved!.n === 1 ? "" : "s"} from ${validFrom} on will be measured against this route.`);

    const correcting = validFrom === latest.validFrom;
    const version = correcting ? latest.version : latest.version + 1;
    const measured = { route: built.route, sectionCount: built.sections.length, lengthMetres: built.lengthMetres };
    let versionId: string;
    if (correcting) {
      await tx.update(transectRouteVersions).set({ ...measured, createdById: actor.id, createdAt: new Date() }).where(eq(transectRouteVersions.id, latest.id));
      await tx.delete(transectSections).where(eq(transectSections.versionId, latest.id));
      versionId = latest.id;
    } else {
      const [row] = await tx
        .insert(transectRouteVersions)
        .values({ ...measured, createdById: actor.id, transectId: id, version, validFrom })
        .returning({ id: transectRouteVersions.id });
      versionId = row!.id;
    }
    await writeSections(tx, versionId, built);
    await tx.update(transects).set({ ...measured, updatedAt: new Date() }).where(eq(transects.id, id));
    const before = { routeVersion: latest.version, validFrom: latest.validFrom, lengthMetres: latest.lengthMetres, sectionCount: latest.sectionCount, sectionLengths: latestSections.map((s) => s.lengthMetres), points: (latest.route as BuiltRoute["route"]).coordinates.length };
    await logChange(tx, actor, {
      entity: "transect",
      entityId: id,
      action: correcting ? "correct-route" : "new-route",
      summary: correcting
        ? `Corrected route version ${version} of transect ${transect.code} (from ${validFrom})`
        : `New route for transect ${transect.code} from ${validFrom} (version ${version})`,
      before,
      after: routeSummary(built, version, validFrom),
    });
    return { id, version, validFrom, unchanged: false, lengthMetres: built.lengthMetres, warnings };
  });
}

/** Retired: nobody records on it (phones stop getting it), its walks, history and past seasons stay. */
export async function setRetired(actor: Actor, id: string, retired: boolean) {
  return db().transaction(async (tx) => {
    const before = await lockedTransect(tx, id);
    if (before.active === !retired) return before;
    const [after] = await tx
      .update(transects)
      .set({ active: !retired, retiredAt: retired ? new Date() : null, updatedAt: new Date() })
      .where(eq(transects.id, id))
      .returning();
    await logChange(tx, actor, {
      entity: "transect",
      entityId: id,
      action: retired ? "retire" : "reinstate",
      summary: retired ? `Retired transect ${before.code}: no more walks are recorded on it` : `Brought transect ${before.code} back into use`,
      before: { active: before.active, retiredAt: before.retiredAt?.toISOString() ?? null },
      after: { active: after!.active, retiredAt: after!.retiredAt?.toISOString() ?? null },
    });
    return after!;
  });
}
