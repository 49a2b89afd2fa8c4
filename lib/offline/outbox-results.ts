import { settledStatuses, type ItemResult } from "@/lib/sync/protocol";
import { phoneStore, type LocalSighting, type LocalVisit, type LocalWeatherMiss } from "./phone-store";
import type { Batch } from "./outbox-batches";
import type { OutboxRun } from "./outbox";

// Records the server's answer to a batch in the phone's store: each item sent, kept on the
// server, back on the phone for the next pass, or needing the volunteer's attention.

export type OutboxBatch = Batch<LocalVisit, LocalSighting, LocalWeatherMiss>;

/** The ids of a batch's items, by kind. */
export type BatchIds = { visitIds: string[]; sightingIds: string[]; weatherIds: string[] };

const SIGHTING_NEEDS_ATTENTION = "A sighting on this walk needs attention.";

/**
 * The server's answer for one item in the volunteer's words. Field messages are whole sentences,
 * so the field names (visitDate, speciesId: code, not words) are left out; a reason the server
 * also put on its field (a date outside the season, say) is said once.
 */
export function resultInWords(result: ItemResult): string {
  if (result.status === "forbidden") return result.reason ?? "This transect is not assigned to you any more.";
  const said = new Set(result.reason ? [result.reason] : []);
  const fieldMessages: string[] = [];
  for (const m of Object.values(result.errors ?? {}).flat()) {
    if (!said.has(m)) fieldMessages.push(m);
    said.add(m);
  }
  return [result.reason, ...fieldMessages].filter(Boolean).join(" ") || "Turnstone could not take this as it is.";
}

/** The same change to many sightings by key, in one request (a batch holds hundreds). */
export function setSightings(ids: string[], changes: Partial<Pick<LocalSighting, "outbox" | "attention">>) {
  return phoneStore().sightings.bulkUpdate(ids.map((key) => ({ key, changes })));
}

/** Leaves items on the phone for the next pass, with a note the outbox can show. */
export async function backToPhone({ visitIds, sightingIds, weatherIds }: BatchIds, note?: string) {
  const db = phoneStore();
  const again = (item: { outbox: string; attention: string | null; attempts: number }) => {
    item.outbox = "on-phone";
    item.attention = note ?? null;
    item.attempts += 1;
  };
  await db.transaction("rw", db.visits, db.sightings, db.weatherMisses, async () => {
    await db.visits.where("id").anyOf(visitIds).modify(again);
    await setSightings(sightingIds, { outbox: "on-phone" });
    await db.weatherMisses.where("id").anyOf(weatherIds).modify(again);
  });
}

/** The server refused the whole batch: every item in it needs the volunteer, with the server's words. */
export async function refuseBatch(batch: OutboxBatch, message: string, run: OutboxRun, held: Set<string>) {
  const db = phoneStore();
  const visitIds = new Set(batch.visits.map((v) => v.item.id));
  const parentsOnServer = new Set(batch.sightings.map((s) => s.item.visitId).filter((id) => !visitIds.has(id)));
  const weatherIds = (batch.weather ?? []).map((w) => w.item.id);
  await db.transaction("rw", db.visits, db.sightings, db.weatherMisses, async () => {
    await db.weatherMisses.where("id").anyOf(weatherIds).modify({ outbox: "needs-attention", attention: message });
    await db.visits.where("id").anyOf([...visitIds]).modify({ outbox: "needs-attention", attention: message });
    await setSightings(batch.sightings.map((s) => s.item.id), { outbox: "needs-attention", attention: message });
    await db.visits.where("id").anyOf([...parentsOnServer]).modify({ outbox: "needs-attention", attention: `${SIGHTING_NEEDS_ATTENTION} ${message}` });
  });
  for (const id of [...visitIds, ...parentsOnServer]) held.add(id);
  run.needsAttention += batch.visits.length + batch.sightings.length + weatherIds.length;
}

async function noteKeptOnServer(visitId: string, what: "visit" | "sighting") {
  const visits = phoneStore().visits;
  const visit = await visits.get(visitId);
  if (!visit) return;
  const kept = visit.keptOnServer ?? { visit: false, sightings: 0 };
  await visits.update(visitId, { keptOnServer: what === "visit" ? { ...kept, visit: true } : { ...kept, sightings: kept.sightings + 1 } });
}

export async function applyResults(results: ItemResult[], batch: OutboxBatch, run: OutboxRun, held: Set<string>) {
  const db = phoneStore();
  const byKey = new Map(results.map((r) => [`${r.kind}:${r.index}`, r]));
  const settled = (r: ItemResult | undefined): r is ItemResult => !!r && settledStatuses.includes(r.status);
  const refusedVisits = new Set<string>();
  await db.transaction("rw", db.visits, db.sightings, db.weatherMisses, async () => {
    for (const [index, { item: w }] of (batch.weather ?? []).entries()) {
      const r = byKey.get(`weather:${index}`);
      if (settled(r)) {
        await db.weatherMisses.update(w.id, { outbox: "sent", attention: null });
        run.sent++;
      } else {
        await db.weatherMisses.update(w.id, { outbox: "needs-attention", attention: r ? resultInWords(r) : "Turnstone did not answer for this weather report." });
        run.needsAttention++;
      }
    }
    for (const [index, { item: v }] of batch.visits.entries()) {
      const r = byKey.get(`visit:${index}`);
      if (settled(r)) {
        await db.visits.update(v.id, { outbox: "sent", attention: null });
        if (r.status === "kept-server") {
          await noteKeptOnServer(v.id, "visit");
          run.keptOnServer++;
        } else run.sent++;
      } else {
        await db.visits.update(v.id, { outbox: "needs-attention", attention: r ? resultInWords(r) : "Turnstone did not answer for this walk." });
        refusedVisits.add(v.id);
        held.add(v.id);
        run.needsAttention++;
      }
    }
    const sightingChanges: { key: string; changes: Pick<LocalSighting, "outbox" | "attention"> }[] = [];
    for (const [index, { item: s }] of batch.sightings.entries()) {
      const r = byKey.get(`sighting:${index}`);
      if (settled(r)) {
        sightingChanges.push({ key: s.id, changes: { outbox: "sent", attention: null } });
        if (r.status === "kept-server") {
          await noteKeptOnServer(s.visitId, "sighting");
          run.keptOnServer++;
        } else run.sent++;
      } else {
        sightingChanges.push({ key: s.id, changes: { outbox: "needs-attention", attention: r ? resultInWords(r) : "Turnstone did not answer for this sighting." } });
        run.needsAttention++;
        // The visit is not done until all its sightings are; its own reason, if any, says more.
        if (!refusedVisits.has(s.visitId)) await db.visits.update(s.visitId, { outbox: "needs-attention", attention: SIGHTING_NEEDS_ATTENTION });
        held.add(s.visitId);
      }
    }
    await db.sightings.bulkUpdate(sightingChanges);
  });
}
