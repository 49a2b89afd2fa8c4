import "server-only";
import { and, asc, count, eq, ne, sql } from "drizzle-orm";
import { db, type Transaction } from "@/db/client";
import { habitatGroups, transects } from "@/db/schema";
import type { Actor } from "@/lib/auth/guard";
import { conflict, invalid, notFound, type FieldErrors } from "@/lib/errors";
import type { HabitatColour } from "@/lib/geo/palette";
import { logChange } from "./change-log";

type HabitatGroupValues = { code: string; name: string; colour: HabitatColour; description: string | null };
type HabitatGroupPatch = Partial<HabitatGroupValues>;

export type HabitatGroupRow = typeof habitatGroups.$inferSelect & { transects: number; activeTransects: number };

export function listHabitatGroups(): Promise<HabitatGroupRow[]> {
  return db()
    .select({
      id: habitatGroups.id,
      code: habitatGroups.code,
      name: habitatGroups.name,
      description: habitatGroups.description,
      colour: habitatGroups.colour,
      transects: count(transects.id),
      activeTransects: sql<number>`count(${transects.id}) filter (where ${transects.active})`.mapWith(Number),
    })
    .from(habitatGroups)
    .leftJoin(transects, eq(transects.habitatGroupId, habitatGroups.id))
    .groupBy(habitatGroups.id)
    .orderBy(asc(habitatGroups.name));
}

/** Codes and names are unique (names in any letter case): say which field clashes, before the index would. */
async function clashes(tx: Transaction, values: { code?: string; name?: string }, exceptId?: string): Promise<FieldErrors> {
  const errors: FieldErrors = {};
  const others = exceptId ? ne(habitatGroups.id, exceptId) : sql`true`;
  if (values.code) {
    const [row] = await tx.select({ id: habitatGroups.id }).from(habitatGroups).where(and(eq(habitatGroups.code, values.code), others)).limit(1);
    if (row) errors.code = ["Another habitat group has this code."];
  }
  if (values.name) {
    const [row] = await tx.select({ id: habitatGroups.id }).from(habitatGroups).where(and(eq(sql`lower(${habitatGroups.name})`, values.name.toLowerCase()), others)).limit(1);
    if (row) errors.name = ["Another habitat group has this name."];
  }
  return errors;
}

const logged = (g: typeof habitatGroups.$inferSelect) => ({ code: g.code, name: g.name, colour: g.colour, description: g.description });

// Concurrent writers of the same code or name: serialise them so the check above holds.
const lockNames = (tx: Transaction) => tx.execute(sql`select pg_advisory_xact_lock(hashtext('turnstone:habitat_groups'))`);

export async function createHabitatGroup(actor: Actor, input: HabitatGroupValues) {
  return db().transaction(async (tx) => {
    await lockNames(tx);
    const errors = await clashes(tx, input);
    if (Object.keys(errors).length) throw invalid(errors);
    const [row] = await tx.insert(habitatGroups).values(input).returning();
    await logChange(tx, actor, { entity: "habitat_group", entityId: row!.id, action: "create", summary: `Created habitat group ${row!.name} (${row!.code})`, after: logged(row!) });
    return row!;
  });
}

export async function updateHabitatGroup(actor: Actor, id: string, patch: HabitatGroupPatch) {
  return db().transaction(async (tx) => {
    await lockNames(tx);
    const [before] = await tx.select().from(habitatGroups).where(eq(habitatGroups.id, id)).for("update");
    if (!before) throw notFound("That habitat group");
    const errors = await clashes(tx, patch, id);
    if (Object.keys(errors).length) throw invalid(errors);
    const [after] = await tx.update(habitatGroups).set(patch).where(eq(habitatGroups.id, id)).returning();
    const renamed = before.name !== after!.name ? `Renamed habitat group ${before.name} to ${after!.name}` : `Changed habitat group ${after!.name}`;
    await logChange(tx, actor, { entity: "habitat_group", entityId: id, action: "update", summary: renamed, before: logged(before), after: logged(after!) });
    return after!;
  });
}

/** Only an empty group can go: every transect, retired ones included, belongs to a group. */
export async function deleteHabitatGroup(actor: Actor, id: string) {
  return db().transaction(async (tx) => {
    const [before] = await tx.select().from(habitatGroups).where(eq(habitatGroups.id, id)).for("update");
    if (!before) throw notFound("That habitat group");
    const [used] = await tx.select({ n: count() }).from(transects).where(eq(transects.habitatGroupId, id));
    const n = used?.n ?? 0;
    if (n > 0) throw conflict(`${before.name} has ${n} transect${n === 1 ? "" : "s"} (retired ones count too): move them to another group first.`);
    await tx.delete(habitatGroups).where(eq(habitatGroups.id, id));
    await logChange(tx, actor, { entity: "habitat_group", entityId: id, action: "delete", summary: `Deleted habitat group ${before.name} (${before.code})`, before: logged(before) });
  });
}
