import "server-only";
import { and, count, desc, eq, ne, or, sql } from "drizzle-orm";
import { db, type Database, type Transaction } from "@/db/client";
import { networkSettings, seasons, visits } from "@/db/schema";
import type { Actor } from "@/lib/auth/guard";
import { conflict, invalid, notFound, type FieldErrors } from "@/lib/errors";
import { DEFAULT_SEASON_GRACE_DAYS } from "@/lib/limits/seasons";
import { canMove, datesEditable, firstOverlap, graceEndsAt, overlapMessage, phaseOf, type SeasonPhase, type SeasonStatus } from "@/lib/seasons/rules";
import { logChange } from "./change-log";

/** The season covering today, else the most recent one to have started. */
export async function currentSeason() {
  const [covering] = await db()
    .select()
    .from(seasons)
    .where(sql`current_date between ${seasons.startsOn} and ${seasons.endsOn}`)
    .limit(1);
  if (covering) return covering;
  const [latest] = await db().select().from(seasons).where(sql`${seasons.startsOn} <= current_date`).orderBy(desc(seasons.startsOn)).limit(1);
  return latest ?? null;
}

export function listSeasons() {
  return db().select().from(seasons).orderBy(desc(seasons.startsOn));
}

type Season = typeof seasons.$inferSelect;
type SeasonValues = { name: string; startsOn: string; endsOn: string; targetVisits: number; minVisits: number };
type SeasonPatch = Partial<SeasonValues>;

/** Days of grace after closing (network_settings.season_grace_days; the default before any settings row). */
export async function seasonGraceDays(tx: Database | Transaction = db()): Promise<number> {
  const [row] = await tx.select({ days: networkSettings.seasonGraceDays }).from(networkSettings).limit(1);
  return row?.days ?? DEFAULT_SEASON_GRACE_DAYS;
}

export type SeasonOverviewRow = Season & { phase: SeasonPhase; graceEndsAt: Date | null; walks: number };

/** Every season, newest first, with its phase now and the walks recorded in it. */
export async function seasonsOverview(now: Date = new Date()): Promise<{ seasons: SeasonOverviewRow[]; graceDays: number }> {
  const [rows, graceDays] = await Promise.all([
    db()
      .select({ season: seasons, walks: count(visits.id) })
      .from(seasons)
      .leftJoin(visits, eq(visits.seasonId, seasons.id))
      .groupBy(seasons.id)
      .orderBy(desc(seasons.startsOn)),
    seasonGraceDays(),
  ]);
  return {
    graceDays,
    seasons: rows.map(({ season, walks }) => ({ ...season, walks, phase: phaseOf(season, graceDays, now), graceEndsAt: graceEndsAt(season, graceDays) })),
  };
}

const logged = (s: Season) => ({ name: s.name, startsOn: s.startsOn, endsOn: s.endsOn, status: s.status, targetVisits: s.targetVisits, minVisits: s.minVisits, openedAt: s.openedAt, closedAt: s.closedAt });

// Writers of seasons are serialised, so the overlap and name checks below hold until commit.
const lockSeasons = (tx: Transaction) => tx.execute(sql`select pg_advisory_xact_lock(hashtext('turnstone:seasons'))`);

async function clashes(tx: Transaction, values: { name?: string; startsOn: string; endsOn: string }, exceptId?: string): Promise<FieldErrors> {
  const errors: FieldErrors = {};
  const others = await tx.select({ id: seasons.id, name: seasons.name, startsOn: seasons.startsOn, endsOn: seasons.endsOn }).from(seasons);
  const other = firstOverlap(values, others, exceptId);
  if (other) errors.startsOn = [overlapMessage(other)];
  const name = values.name?.toLowerCase();
  if (name && others.some((o) => o.id !== exceptId && o.name.toLowerCase() === name)) errors.name = ["Another season has this name."];
  return errors;
}

function codeOf(error: unknown): string | null {
  for (let e: unknown = error; e; e = (e as { cause?: unknown }).cause) {
    const code = (e as { code?: unknown }).code;
    if (typeof code === "string") return code;
  }
  return null;
}

/** The database constraints are the backstop: their refusals become the same field messages, never a 500. */
async function constrained<T>(write: Promise<T>): Promise<T> {
  try {
    return await write;
  } catch (error) {
    const code = codeOf(error);
    if (code === "23P01") throw invalid({ startsOn: ["These dates overlap another season. Seasons never share a day."] });
    if (code === "23505") throw invalid({ name: ["Another season has this name."] });
    throw error;
  }
}

export async function createSeason(actor: Actor, input: SeasonValues): Promise<Season> {
  return db().transaction(async (tx) => {
    await lockSeasons(tx);
    const errors = await clashes(tx, input);
    if (Object.keys(errors).length) throw invalid(errors);
    const [row] = await constrained(tx.insert(seasons).values({ ...input, status: "planning" }).returning());
    await logChange(tx, actor, { entity: "season", entityId: row!.id, action: "create", summary: `Created the ${row!.name} (${row!.startsOn} to ${row!.endsOn})`, after: logged(row!) });
    return row!;
  });
}

async function lockedSeason(tx: Transaction, id: string): Promise<Season> {
  const [row] = await tx.select().from(seasons).where(eq(seasons.id, id)).for("update");
  if (!row) throw notFound("That season");
  return row;
}

/** Name and targets change at any time; dates only while planning, and never away from walks already in the season. */
export async function updateSeason(actor: Actor, id: string, patch: SeasonPatch): Promise<Season> {
  return db().transaction(async (tx) => {
    await lockSeasons(tx);
    const before = await lockedSeason(tx, id);
    const dates = { startsOn: patch.startsOn ?? before.startsOn, endsOn: patch.endsOn ?? before.endsOn };
    const datesChanged = dates.startsOn !== before.startsOn || dates.endsOn !== before.endsOn;
    if (datesChanged && !datesEditable(before.status)) {
      throw invalid({ startsOn: [`The ${before.name} has opened, so its dates are fixed. Its name and targets can still change.`] });
    }
    if (dates.endsOn < dates.startsOn) throw invalid({ endsOn: ["The season cannot end before it starts."] });
    const target = patch.targetVisits ?? before.targetVisits;
    const min = patch.minVisits ?? before.minVisits;
    if (min > target) throw invalid({ minVisits: ["The minimum cannot be more than the target."] });
    const errors = await clashes(tx, { name: patch.name, ...dates }, id);
    if (Object.keys(errors).length) throw invalid(errors);
    if (datesChanged) {
      const [outside] = await tx
        .select({ n: count() })
        .from(visits)
        .where(and(eq(visits.seasonId, id), or(sql`${visits.visitDate} < ${dates.startsOn}`, sql`${visits.visitDate} > ${dates.endsOn}`)));
      if (outside && outside.n > 0) throw invalid({ startsOn: [`${outside.n} walk${outside.n === 1 ? " is" : "s are"} dated outside these dates.`] });
    }
    const [after] = await constrained(tx.update(seasons).set({ ...patch }).where(eq(seasons.id, id)).returning());
    await logChange(tx, actor, { entity: "season", entityId: id, action: "update", summary: `Changed the ${after!.name}`, before: logged(before), after: logged(after!) });
    return after!;
  });
}

const MOVE_WORDS: Record<Exclude<SeasonStatus, "planning">, string> = { open: "Opened", closed: "Closed" };

async function moveSeason(actor: Actor, id: string, to: "open" | "closed"): Promise<Season> {
  return db().transaction(async (tx) => {
    const before = await lockedSeason(tx, id);
    if (!canMove(before.status, to)) {
      const why = before.status === "closed" ? "is closed; a closed season is not reopened" : before.status === to ? `is already ${to}` : "has not opened yet";
      throw conflict(`The ${before.name} ${why}.`);
    }
    const now = new Date();
    const set = to === "open" ? { status: to, openedAt: now } : { status: to, closedAt: now };
    const [after] = await tx.update(seasons).set(set).where(and(eq(seasons.id, id), ne(seasons.status, to))).returning();
    const graceDays = to === "closed" ? await seasonGraceDays(tx) : 0;
    const summary = to === "open" ? `${MOVE_WORDS.open} the ${after!.name}` : `${MOVE_WORDS.closed} the ${after!.name}; late walks and their review until ${graceEndsAt(after!, graceDays)!.toISOString().slice(0, 10)}, then frozen`;
    await logChange(tx, actor, { entity: "season", entityId: id, action: to === "open" ? "open" : "close", summary, before: logged(before), after: logged(after!) });
    return after!;
  });
}

export const openSeason = (actor: Actor, id: string) => moveSeason(actor, id, "open");
export const closeSeason = (actor: Actor, id: string) => moveSeason(actor, id, "closed");

/** The grace period after closing, for every season (frozen ones thaw if it grows: the log says when). */
export async function setSeasonGraceDays(actor: Actor, graceDays: number): Promise<{ graceDays: number }> {
  return db().transaction(async (tx) => {
    const [before] = await tx.select({ days: networkSettings.seasonGraceDays }).from(networkSettings).where(eq(networkSettings.id, 1)).for("update");
    if (!before) throw notFound("The network's settings");
    await tx.update(networkSettings).set({ seasonGraceDays: graceDays, updatedAt: new Date() }).where(eq(networkSettings.id, 1));
    await logChange(tx, actor, {
      entity: "settings",
      entityId: "season_grace_days",
      action: "update",
      summary: `Grace period after closing a season: ${before.days} → ${graceDays} days`,
      before: { seasonGraceDays: before.days },
      after: { seasonGraceDays: graceDays },
    });
    return { graceDays };
  });
}
