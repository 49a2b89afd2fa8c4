// A stand-in for the field API (sync batches and the photo flow) for the outbox's unit tests.
// It validates with the real contract (lib/sync/contract.ts), applies the server's size limits,
// records every write and every answer, and can lose answers or fail on request.
import { batchStatus, MAX_SYNC_BODY_BYTES, sightingPayload, syncEnvelope, visitPayloadFor, weatherPayload, type ItemResult } from "@/lib/sync/contract";

export type Write = { kind: "visit" | "sighting" | "weather"; id: string; op: "create" | "update" };

export type FakeServerOptions = {
  /** Every request fails as with no signal. */
  down?: boolean;
  status401?: boolean;
  forbidTransect?: string;
  /** Ids a reviewer has reviewed: later edits to them are kept-server. */
  reviewed?: Set<string>;
  /** Sync answers to lose after the batch was applied (the connection drops on the way back). */
  loseSyncAnswers?: number;
  /** Answers a sync request with this instead (no per-item results) while it returns something. */
  syncOverride?: (body: string) => Response | undefined;
  /** Answers a photo request (ticket, store PUT, completion) with this instead while it returns something. */
  photoOverride?: (step: "ticket" | "put" | "complete", photoId: string) => Response | undefined;
};

const json = (body: unknown, status: number) => new Response(JSON.stringify(body), { status, headers: { "Content-Type": "application/json" } });

export function fakeServer(options: FakeServerOptions = {}) {
  const visits = new Map<string, string>();
  const sightings = new Map<string, string>();
  const weather = new Map<string, string>();
  const photos = new Set<string>();
  const requests: string[] = [];
  const writes: Write[] = [];
  const answers: ItemResult[][] = [];
  const bodies: string[] = [];
  let toLose = options.loseSyncAnswers ?? 0;
  const utf8 = new TextEncoder();
  const bodyLimit = MAX_SYNC_BODY_BYTES; // the sync route's own limit (tests/integration/sync-route.test.ts)

  function store(kind: Write["kind"], table: Map<string, string>, id: string, value: unknown, index: number): ItemResult {
    // Compared without the time of the edit, as the server's `sameFields` does.
    const { clientUpdatedAt: _at, ...fields } = value as { clientUpdatedAt: string };
    const text = JSON.stringify(fields);
    const before = table.get(id);
    if (before === text) return { kind, id, index, status: "unchanged" };
    if (before !== undefined && options.reviewed?.has(id)) return { kind, id, index, status: "kept-server", reason: "Reviewed." };
    table.set(id, text);
    writes.push({ kind, id, op: before === undefined ? "create" : "update" });
    return { kind, id, index, status: before === undefined ? "created" : "updated" };
  }

  function sync(body: string): Response {
    bodies.push(body);
    const overridden = options.syncOverride?.(body);
    if (overridden) return overridden;
    // The route counts characters; UTF-8 bytes are never fewer, so this is the stricter check.
    if (utf8.encode(body).length > bodyLimit) return json({ error: { code: "too_large", message: "The sync batch is too large: send fewer items at a time." } }, 413);
    const envelope = syncEnvelope.safeParse(JSON.parse(body));
    if (!envelope.success) return json({ error: { code: "invalid", message: "The sync batch is not in the expected shape." } }, 400);
    const results: ItemResult[] = [];
    const visitsInBatch = new Set<string>();
    envelope.data.visits.forEach((raw, index) => {
      // The envelope's protocol decides the visit's schema, as on the server (lib/sync/apply-batch.ts).
      const parsed = visitPayloadFor(envelope.data.protocol).safeParse(raw);
      if (!parsed.success) return results.push({ kind: "visit", id: null, index, status: "invalid", errors: { [String(parsed.error.issues[0]!.path[0] ?? "_")]: [parsed.error.issues[0]!.message] } });
      if (parsed.data.transectId === options.forbidTransect) return results.push({ kind: "visit", id: parsed.data.id, index, status: "forbidden", reason: "Not your transect." });
      visitsInBatch.add(parsed.data.id);
      results.push(store("visit", visits, parsed.data.id, parsed.data, index));
    });
    envelope.data.sightings.forEach((raw, index) => {
      const parsed = sightingPayload.safeParse(raw);
      if (!parsed.success) return results.push({ kind: "sighting", id: null, index, status: "invalid", errors: { count: [parsed.error.issues[0]!.message] } });
      // Sightings need their visit, in this batch or already stored.
      if (!visitsInBatch.has(parsed.data.visitId) && !visits.has(parsed.data.visitId)) {
        return results.push({ kind: "sighting", id: parsed.data.id, index, status: "invalid", errors: { visitId: ["No such visit."] } });
      }
      results.push(store("sighting", sightings, parsed.data.id, parsed.data, index));
    });
    envelope.data.weatherMisses.forEach((raw, index) => {
      const parsed = weatherPayload.safeParse(raw);
      if (!parsed.success) return results.push({ kind: "weather", id: null, index, status: "invalid", errors: { reportedOn: [parsed.error.issues[0]!.message] } });
      if (parsed.data.transectId === options.forbidTransect) return results.push({ kind: "weather", id: parsed.data.id, index, status: "forbidden", reason: "You are not assigned to that transect." });
      results.push(store("weather", weather, parsed.data.id, parsed.data, index));
    });
    answers.push(results);
    if (toLose > 0) {
      toLose--;
      throw new TypeError("Failed to fetch");
    }
    return json({ results, serverTime: new Date().toISOString() }, batchStatus(results));
  }

  const fetcher = (async (input: RequestInfo | URL, init?: RequestInit) => {
    const url = String(input);
    requests.push(`${init?.method ?? "GET"} ${url}`);
    if (options.down) throw new TypeError("Failed to fetch");
    if (options.status401) return json({ error: { code: "unauthorized", message: "Please sign in." } }, 401);
    if (url === "/api/field/sync") return sync(String(init?.body));
    if (url === "/api/field/photos") {
      const { id } = JSON.parse(String(init?.body)) as { id: string };
      return options.photoOverride?.("ticket", id) ?? json({ id, uploadUrl: `http://store.test/${id}`, headers: {}, expiresAt: new Date().toISOString() }, 201);
    }
    if (url.startsWith("http://store.test/")) return options.photoOverride?.("put", url.slice("http://store.test/".length)) ?? new Response(null, { status: 200 });
    const complete = url.match(/^\/api\/field\/photos\/(.+)\/complete$/);
    if (complete) {
      const overridden = options.photoOverride?.("complete", complete[1]!);
      if (overridden) return overridden;
      photos.add(complete[1]!);
      return json({ photo: { id: complete[1], status: "ready", width: 1, height: 1 } }, 200);
    }
    return new Response("not found", { status: 404 });
  }) as typeof fetch;
  return { fetcher, visits, sightings, weather, photos, requests, writes, answers, bodies };
}
