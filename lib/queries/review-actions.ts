import "server-only";
import { sql } from "drizzle-orm";
import { uuidArray } from "@/lib/sync/sql-arrays";
import { db, type Transaction } from "@/db/client";
import type { SightingStatus } from "@/db/schema/field";
import type { Actor } from "@/lib/auth/guard";
import { AppError, invalid, notFound } from "@/lib/errors";
import type { ActionResult, BulkInput, BulkResult, Conflict, ReviewActionInput } from "@/lib/review/contract";
import { BULK_LIMIT } from "@/lib/review/queue-filter";
import { phaseOf, type SeasonStatus } from "@/lib/seasons/rules";
import { reopenAllowed } from "./review-detail";
import { matchingSql, queueRowsByIds, UNDECIDED } from "./review-queue";
import { seasonGraceDays } from "./seasons";

// A reviewer's actions on sightings. Each changes the sighting and writes its history row in one
// transaction, holding the sighting's row lock; the revision the reviewer was shown must still be
// the sighting's, or nothing changes and the answer says who changed it (409).

type Locked = {
  id: string; revision: number; status: SightingStatus; species_id: string; species_name: string; count: number;
  season_status: SeasonStatus | null; season_closed_at: Date | null;
};

/** The action is not one this sighting's state allows (409, like a conflict: nothing changed). */
const notAllowed = (why: string) => new AppError(409, "not_allowed", why);

async function lock(tx: Transaction, id: string): Promise<Locked | undefined> {
  const [row] = await tx.execute<Locked>(sql`
    select s.id, s.revision, s.status, s.species_id, sp.vernacular_name || ' (' || sp.scientific_name || ')' as species_name, s.count,
      se.status as season_status, se.closed_at as season_closed_at
    from sightings s join visits v on v.id = s.visit_id join species sp on sp.id = s.species_id left join seasons se on se.id = v.season_id
    where s.id = ${id} for update of s`);
  return row;
}

/** Who made the sighting's latest change, as far as the history or the walk says. */
async function lastChange(tx: Transaction, id: string): Promise<{ by: string | null; at: string | null }> {
  const [row] = await tx.execute<{ by: string | null; at: Date | null }>(sql`
    select coalesce(
        (select u.name from verification_events e join users u on u.id = e.actor_id where e.sighting_id = s.id and e.created_at >= s.updated_at order by e.created_at desc, e.id desc limit 1),
        (select u.name from visits v join users u on u.id = v.volunteer_id where v.id = s.visit_id)) as by,
      s.updated_at as at
    from sightings s where s.id = ${id}`);
  return { by: row?.by ?? null, at: row?.at ? new Date(row.at).toISOString() : null };
}

type Event = {
  action: ReviewActionInput["action"] | "reply";
  fromStatus: SightingStatus; toStatus: SightingStatus; message?: string | null; reason?: string | null;
  fromSpecies?: { id: string; name: string }; toSpecies?: { id: string; name: string }; fromCount?: number; toCount?: number;
};

async function writeEvents(tx: Transaction, actor: Pick<Actor, "id">, ids: readonly string[], e: Event): Promise<void> {
  if (ids.length === 0) return;
  await tx.execute(sql`
    insert into verification_events (sighting_id, actor_id, action, from_status, to_status, message, reason,
      from_species_id, from_species_name, to_species_id, to_species_name, from_count, to_count, created_at)
    select id, ${actor.id}, ${e.action}::review_action, ${e.fromStatus}::sighting_status, ${e.toStatus}::sighting_status, ${e.message || null}, ${e.reason ?? null},
      ${e.fromSpecies?.id ?? null}::uuid, ${e.fromSpecies?.name ?? null}, ${e.toSpecies?.id ?? null}::uuid, ${e.toSpecies?.name ?? null},
      ${e.fromCount ?? null}::int, ${e.toCount ?? null}::int, clock_timestamp()
    from unnest(${uuidArray(ids)}) as id`);
}

async function setStatus(tx: Transaction, actor: Pick<Actor, "id">, ids: readonly string[], status: SightingStatus): Promise<void> {
  if (ids.length === 0) return;
  const reviewed = status === "accepted" || status === "rejected";
  await tx.execute(sql`
    update sightings set status = ${status}::sighting_status,
      reviewed_by_id = ${reviewed ? actor.id : null}::uuid, reviewed_at = ${reviewed ? sql`clock_timestamp()` : sql`null`}
    where id = any(${uuidArray(ids)})`);
}

/** A checklist entry to correct to: it must exist (a merged-away or unknown id is a field error). */
async function targetSpecies(tx: Transaction, id: string): Promise<{ id: string; name: string }> {
  const [row] = await tx.execute<{ id: string; name: string }>(sql`
    select id, vernacular_name || ' (' || scientific_name || ')' as name from species where id = ${id}`);
  if (!row) throw invalid({ speciesId: ["That species is not on the network's checklist."] });
  return row;
}

export type ActionOutcome = { ok: true; result: ActionResult } | { ok: false; conflict: Conflict };

export async function reviewAction(actor: Actor, id: string, input: ReviewActionInput): Promise<ActionOutcome> {
  const graceDays = await seasonGraceDays();
  const changed = await db().transaction(async (tx) => {
    const s = await lock(tx, id);
    if (!s) throw notFound("That sighting");
    if (s.revision !== input.revision) return lastChange(tx, id);
    const undecided = UNDECIDED.includes(s.status);
    const message = "message" in input ? (input.message ?? null) : null;
    switch (input.action) {
      case "accept":
      case "reject":
      case "query": {
        if (!undecided) throw notAllowed("This sighting has already been reviewed: reopen it first.");
        const to: SightingStatus = input.action === "accept" ? "accepted" : input.action === "reject" ? "rejected" : "queried";
        await setStatus(tx, actor, [id], to);
        await writeEvents(tx, actor, [id], { action: input.action, fromStatus: s.status, toStatus: to, message, reason: input.action === "reject" ? input.reason : null });
        break;
      }
      case "edit": {
        if (!undecided) throw notAllowed("This sighting has already been reviewed: reopen it before correcting it.");
        const species = input.speciesId && input.speciesId !== s.species_id ? await targetSpecies(tx, input.speciesId) : undefined;
        const count = input.count !== undefined && input.count !== s.count ? input.count : undefined;
        if (!species && count === undefined) throw invalid({ speciesId: ["Choose another species or another count."] }, "Nothing would change.");
        await tx.execute(sql`update sightings set
          species_id = ${species?.id ?? s.species_id}::uuid, count = ${count ?? s.count}::int where id = ${id}`);
        await writeEvents(tx, actor, [id], {
          action: "edit", fromStatus: s.status, toStatus: s.status, message,
          ...(species ? { fromSpecies: { id: s.species_id, name: s.species_name }, toSpecies: species } : {}),
          ...(count !== undefined ? { fromCount: s.count, toCount: count } : {}),
        });
        break;
      }
      case "reopen": {
        if (undecided) throw notAllowed("This sighting has not been reviewed yet.");
        const phase = s.season_status ? phaseOf({ status: s.season_status, closedAt: s.season_closed_at }, graceDays) : null;
        if (!reopenAllowed(phase)) throw notAllowed("Its season is closed and its grace period is over, so its sightings can no longer change.");
        await setStatus(tx, actor, [id], "pending");
        await writeEvents(tx, actor, [id], { action: "reopen", fromStatus: s.status, toStatus: "pending", message });
        break;
      }
    }
    return null;
  });
  const [row] = await queueRowsByIds([id]);
  if (!row) throw notFound("That sighting");
  if (changed) {
    return {
      ok: false,
      conflict: {
        error: { code: "changed", message: `${changed.by ?? "Someone"} changed this sighting after it was shown to you. It has been refreshed: look again before acting.`, changedBy: changed.by, changedAt: changed.at },
        row,
      },
    };
  }
  return { ok: true, result: { row } };
}

type Candidate = { id: string; revision: number; status: SightingStatus; warned: boolean; changed: boolean };

/**
 * Confirms the selected sightings that have no warnings (on themselves or their walk), or sets
 * them aside with one reason, in one transaction. Sightings changed since they were listed, or
 * already decided, or (to confirm) with warnings are skipped and listed; the rest go ahead.
 */
export async function bulkReview(actor: Actor, input: BulkInput): Promise<BulkResult> {
  return db().transaction(async (tx) => {
    let candidates: Candidate[];
    if ("ids" in input.selection) {
      const wanted = new Map(input.selection.ids.map((x) => [x.id, x.revision]));
      const rows = await tx.execute<Omit<Candidate, "changed">>(sql`
        select s.id, s.revision, s.status, (cardinality(s.warnings) > 0 or cardinality(v.rule_breaches) > 0) as warned
        from sightings s join visits v on v.id = s.visit_id
        where s.id = any(${uuidArray([...wanted.keys()])}) order by s.id for update of s`);
      const found = new Set(rows.map((r) => r.id));
      const missing = [...wanted.keys()].filter((id) => !found.has(id));
      if (missing.length) throw invalid({ "selection.ids": [`${missing.length} of the selected sightings no longer exist: refresh the list.`] });
      candidates = rows.map((r) => ({ ...r, changed: wanted.get(r.id) !== r.revision }));
    } else {
      const { filter, listedAt } = input.selection;
      const [counted] = await tx.execute<{ n: number }>(sql`select count(*)::int as n ${matchingSql(filter)}`);
      if ((counted?.n ?? 0) > BULK_LIMIT) {
        throw invalid({ selection: [`${counted!.n.toLocaleString("en-GB")} sightings match: narrow the filter to ${BULK_LIMIT.toLocaleString("en-GB")} or fewer.`] });
      }
      candidates = [...(await tx.execute<Candidate>(sql`
        select s.id, s.revision, s.status, (cardinality(s.warnings) > 0 or cardinality(v.rule_breaches) > 0) as warned,
          s.updated_at > ${listedAt}::timestamptz as changed
        from sightings s join visits v on v.id = s.visit_id
        where s.id in (select s.id ${matchingSql(filter)}) order by s.id for update of s`))];
    }
    const skipped: BulkResult["skipped"] = [];
    const byStatus = new Map<SightingStatus, string[]>();
    for (const c of candidates) {
      if (c.changed) skipped.push({ id: c.id, why: "changed" });
      else if (!UNDECIDED.includes(c.status)) skipped.push({ id: c.id, why: "not_waiting" });
      else if (input.action === "accept" && c.warned) skipped.push({ id: c.id, why: "has_warnings" });
      else byStatus.set(c.status, [...(byStatus.get(c.status) ?? []), c.id]);
    }
    const to: SightingStatus = input.action === "accept" ? "accepted" : "rejected";
    const reason = input.action === "reject" ? input.reason : null;
    for (const [from, ids] of byStatus) {
      await setStatus(tx, actor, ids, to);
      await writeEvents(tx, actor, ids, { action: input.action, fromStatus: from, toStatus: to, message: input.message ?? null, reason });
    }
    return { done: [...byStatus.values()].reduce((n, ids) => n + ids.length, 0), skipped };
  });
}
