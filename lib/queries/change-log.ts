import "server-only";
import { and, desc, eq, sql, type SQL } from "drizzle-orm";
import { db, type Database, type Transaction } from "@/db/client";
import { networkChanges, users } from "@/db/schema";
import type { Actor } from "@/lib/auth/guard";

export type NetworkEntity = (typeof networkChanges.$inferInsert)["entity"];

export type ChangeEntry = {
  entity: NetworkEntity;
  entityId?: string | null;
  action: string;
  summary: string;
  before?: unknown;
  after?: unknown;
};

/** Writes change-log rows inside the caller's transaction, so a change and its record stand or fall together. */
export async function logChanges(tx: Database | Transaction, actor: Pick<Actor, "id">, entries: ChangeEntry[]): Promise<void> {
  // In slices: one INSERT may carry at most 65,535 parameters (PostgreSQL's wire protocol).
  for (let start = 0; start < entries.length; start += LOG_SLICE) await insertSlice(tx, actor, entries.slice(start, start + LOG_SLICE));
}

const LOG_SLICE = 500;

async function insertSlice(tx: Database | Transaction, actor: Pick<Actor, "id">, entries: ChangeEntry[]): Promise<void> {
  await tx.insert(networkChanges).values(
    entries.map((e) => ({
      actorId: actor.id,
      entity: e.entity,
      entityId: e.entityId ?? null,
      action: e.action,
      summary: e.summary,
      before: e.before ?? null,
      after: e.after ?? null,
    })),
  );
}

export const logChange = (tx: Database | Transaction, actor: Pick<Actor, "id">, entry: ChangeEntry) => logChanges(tx, actor, [entry]);

export type ChangePage = {
  rows: { id: string; at: string; actorName: string | null; entity: NetworkEntity; entityId: string | null; action: string; summary: string; before: unknown; after: unknown }[];
  /** Pass back as `after` for the next (older) page; null on the last page. */
  next: string | null;
};

const PAGE = 50;

// The cursor carries PostgreSQL's own text of the timestamp: a JavaScript Date would drop its
// microseconds, and rows written in one transaction share one timestamp anyway.
function cursorOf(row: { at: string; id: string }): string {
  return Buffer.from(`${row.at}|${row.id}`).toString("base64url");
}

function parseCursor(cursor: string | undefined): { at: string; id: string } | null {
  if (!cursor) return null;
  const [at, id] = Buffer.from(cursor, "base64url").toString().split("|");
  return at && id && !Number.isNaN(Date.parse(at)) && /^[0-9a-f-]{36}$/i.test(id) ? { at, id } : null;
}

/** Newest first, keyset-paged (an index scan however long the log grows). */
export async function listChanges(filter: { entity?: NetworkEntity; entityId?: string; after?: string; limit?: number } = {}): Promise<ChangePage> {
  const limit = Math.min(filter.limit ?? PAGE, 200);
  const where: SQL[] = [];
  if (filter.entity) where.push(eq(networkChanges.entity, filter.entity));
  if (filter.entityId) where.push(eq(networkChanges.entityId, filter.entityId));
  const cursor = parseCursor(filter.after);
  if (cursor) {
    where.push(sql`(${networkChanges.createdAt}, ${networkChanges.id}) < (${cursor.at}::timestamptz, ${cursor.id}::uuid)`);
  }
  const rows = await db()
    .select({
      id: networkChanges.id,
      createdAt: networkChanges.createdAt,
      exactAt: sql<string>`${networkChanges.createdAt}::text`,
      actorName: users.name,
      entity: networkChanges.entity,
      entityId: networkChanges.entityId,
      action: networkChanges.action,
      summary: networkChanges.summary,
      before: networkChanges.before,
      after: networkChanges.after,
    })
    .from(networkChanges)
    .leftJoin(users, eq(users.id, networkChanges.actorId))
    .where(where.length ? and(...where) : sql`true`)
    .orderBy(desc(networkChanges.createdAt), desc(networkChanges.id))
    .limit(limit + 1);
  const page = rows.slice(0, limit);
  return {
    rows: page.map(({ createdAt, exactAt: _exact, ...r }) => ({ ...r, at: createdAt.toISOString() })),
    next: rows.length > limit ? cursorOf({ at: page[page.length - 1]!.exactAt, id: page[page.length - 1]!.id }) : null,
  };
}
