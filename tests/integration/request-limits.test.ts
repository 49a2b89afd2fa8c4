import { randomUUID } from "node:crypto";
import { asc, eq } from "drizzle-orm";
import { beforeAll, beforeEach, describe, expect, it, vi } from "vitest";
import { z } from "zod";
import { db } from "@/db/client";
import { species, transectAssignments, users, visits } from "@/db/schema";
import { demoPeople } from "@/db/seed/network";
import { route } from "@/lib/http/route";
import { requestBodyLimits } from "@/lib/limits/request-bodies";
import { resetToDemo } from "./support/db";

// Body caps and body types, through the sync route and test-only handlers built with the same
// route(). Only Auth.js's cookie decoding is replaced; the person is read from the database.
// Status codes: RFC 9110 §15.5.14 (413 Content Too Large) and §15.5.16 (415 Unsupported Media Type).
const session = vi.hoisted(() => ({ userId: null as string | null }));
vi.mock("@/lib/auth/session", () => ({ sessionUserId: async () => session.userId }));

const { POST: sync } = await import("@/app/(field)/api/field/sync/route");

const noParams = { params: Promise.resolve({}) };
const url = "http://localhost/api/test";

type Answer = { status: number; json: { error?: { code: string; message: string; fields?: Record<string, string[]> } } & Record<string, unknown> };
async function answer(response: Response): Promise<Answer> {
  return { status: response.status, json: await response.json() };
}

const request = (body: BodyInit | null, headers: Record<string, string> = { "content-type": "application/json" }, method = "POST") =>
  new Request(url, { method, body, headers, duplex: "half" } as RequestInit);

// Test-only handlers. `reached` counts the calls that got past route()'s checks.
const reached = { count: 0 };
const note = route({ roles: ["volunteer"], body: z.object({ note: z.string() }) }, async ({ body }) => {
  reached.count++;
  return { got: body };
});
// A write that takes no body, as the photo completion the phones send.
const bodiless = route({ roles: ["volunteer"] }, async () => {
  reached.count++;
  return { done: true };
});
// A route declaring a form post, as RFC 8058's one-click unsubscribe will need: its body is the
// single pair List-Unsubscribe=One-Click (§3.1).
const oneClick = route({ roles: ["volunteer"], accepts: "form", body: z.object({ "List-Unsubscribe": z.literal("One-Click") }) }, async ({ body }) => ({ got: body }));

/**
 * A body stream with no end in sight (as a slow or hostile client can send), counting how many
 * 16 KiB chunks were asked of it. It gives up with an error after 4 MiB, far past every cap, so a
 * server that reads everything fails the test instead of hanging it.
 */
function endlessBody() {
  const state = { pulls: 0 };
  const stream = new ReadableStream<Uint8Array>({
    async pull(controller) {
      state.pulls++;
      await new Promise((r) => setImmediate(r)); // as from a network: let timers run in between
      if (state.pulls > 256) controller.error(new Error("the server read 4 MiB of an endless body"));
      else controller.enqueue(new Uint8Array(16 * 1024).fill(0x20));
    },
  });
  return { stream, state };
}

/** A JSON body of exactly `bytes` UTF-8 bytes that the `note` handler accepts. */
function noteOf(bytes: number): string {
  const empty = JSON.stringify({ note: "" });
  return JSON.stringify({ note: "x".repeat(bytes - empty.length) });
}

let volunteer: string;
let syncBatch: () => { visits: Record<string, unknown>[]; sightings: Record<string, unknown>[] };

beforeAll(async () => {
  await resetToDemo();
  const [u] = await db().select({ id: users.id }).from(users).where(eq(users.email, demoPeople.volunteers[0]!.email));
  volunteer = u!.id;
  const [a] = await db().select().from(transectAssignments).where(eq(transectAssignments.userId, volunteer)).limit(1);
  const [sp] = await db().select({ id: species.id }).from(species).orderBy(asc(species.sortOrder)).limit(1);
  syncBatch = () => {
    const visitId = randomUUID();
    const stamp = "2026-06-02T12:00:00.000Z";
    return {
      visits: [{ id: visitId, transectId: a!.transectId, visitDate: "2026-06-02", startTime: "11:00", clientUpdatedAt: stamp }],
      sightings: [{ id: randomUUID(), visitId, speciesId: sp!.id, count: 2, section: 1, clientUpdatedAt: stamp }],
    };
  };
});
beforeEach(() => {
  session.userId = volunteer;
  reached.count = 0;
});

const stored = async (batch: ReturnType<typeof syncBatch>) => db().select().from(visits).where(eq(visits.id, batch.visits[0]!.id as string));

describe("request bodies: byte caps (413)", () => {
  it("answers 413 too_large to a JSON body one byte over the default cap, and takes one at the cap", async () => {
    const over = await answer(await note(request(noteOf(requestBodyLimits.json + 1)), noParams));
    expect(over.status).toBe(413);
    expect(over.json.error).toMatchObject({ code: "too_large", message: expect.stringMatching(/too large/) });
    expect(reached.count).toBe(0);
    expect((await note(request(noteOf(requestBodyLimits.json)), noParams)).status).toBe(200);
    expect(reached.count).toBe(1);
  });

  it("refuses from a Content-Length over the cap without reading the body", async () => {
    const { stream, state } = endlessBody();
    const { status, json } = await answer(await note(request(stream, { "content-type": "application/json", "content-length": String(requestBodyLimits.json + 1) }), noParams));
    expect(status).toBe(413);
    expect(json.error!.code).toBe("too_large");
    expect(state.pulls).toBeLessThanOrEqual(1); // a stream may be asked once as it is built; never read through
  });

  it("counts the bytes itself: a Content-Length that claims less does not let more through", async () => {
    const { status } = await answer(await note(request(noteOf(requestBodyLimits.json + 100), { "content-type": "application/json", "content-length": "60" }), noParams));
    expect(status).toBe(413);
    expect(reached.count).toBe(0);
  });

  it("stops reading an endless body soon after the cap instead of buffering it", async () => {
    const { stream, state } = endlessBody();
    const response = await note(request(stream), noParams);
    expect(response.status).toBe(413);
    const pullsAtAnswer = state.pulls;
    expect(pullsAtAnswer * 16 * 1024).toBeLessThanOrEqual(requestBodyLimits.json + 3 * 16 * 1024);
    await new Promise((r) => setTimeout(r, 50));
    expect(state.pulls).toBeLessThanOrEqual(pullsAtAnswer + 1); // nothing keeps reading afterwards
  });

  it("gives the sync route its own, larger cap: a batch over the default cap but under the sync cap is stored", async () => {
    const batch = syncBatch();
    const body = JSON.stringify({ ...batch, padding: "x".repeat(requestBodyLimits.json * 2) });
    const { status, json } = await answer(await sync(new Request("http://localhost/api/field/sync", { method: "POST", body, headers: { "content-type": "application/json" } }), noParams));
    expect(status).toBe(200);
    expect((json.results as { status: string }[]).map((r) => r.status)).toEqual(["created", "created"]);
    expect(await stored(batch)).toHaveLength(1);
  });

  it("refuses a body that is not valid UTF-8 (RFC 8259 §8.1) instead of passing on replacement characters", async () => {
    const bytes = new TextEncoder().encode(JSON.stringify({ note: "Left wing#" }));
    bytes[bytes.indexOf(0x23)] = 0xc3; // a UTF-8 lead byte followed by `"`: an invalid sequence
    const { status, json } = await answer(await note(request(bytes), noParams));
    expect(status).toBe(400);
    expect(json.error!.fields).toEqual({ _: ["The request body is not valid JSON."] });
    expect(reached.count).toBe(0);
  });
});

describe("request bodies: JSON only (415)", () => {
  // What an HTML form on another site can send: the three enctypes of the HTML standard's form
  // submission (application/x-www-form-urlencoded, multipart/form-data, text/plain). text/plain can
  // carry text that parses as JSON, which is why the declared type is checked, not the text.
  it.each([
    ["text/plain", JSON.stringify({ note: "from another site" })],
    ["application/x-www-form-urlencoded", "note=from+another+site"],
    ["multipart/form-data; boundary=b", '--b\r\nContent-Disposition: form-data; name="note"\r\n\r\nfrom another site\r\n--b--\r\n'],
  ])("answers 415 to a write sent as %s, before the handler", async (type, body) => {
    const { status, json } = await answer(await note(request(body, { "content-type": type }), noParams));
    expect(status).toBe(415);
    expect(json.error).toMatchObject({ code: "unsupported_media_type", message: expect.stringMatching(/application\/json/) });
    expect(reached.count).toBe(0);
  });

  it("answers 415 to a sync batch posted as text/plain, and stores nothing", async () => {
    const batch = syncBatch();
    const response = await sync(new Request("http://localhost/api/field/sync", { method: "POST", body: JSON.stringify(batch), headers: { "content-type": "text/plain" } }), noParams);
    expect(response.status).toBe(415);
    expect(await stored(batch)).toHaveLength(0);
  });

  it("answers 415 to a body without any Content-Type", async () => {
    const untyped = request(new Blob([JSON.stringify({ note: "untyped" })]), {});
    expect(untyped.headers.get("content-type")).toBeNull();
    expect((await note(untyped, noParams)).status).toBe(415);
    expect(reached.count).toBe(0);
  });

  it("answers 415 to an empty form post: a form with no fields still says it is one", async () => {
    expect((await bodiless(request("", { "content-type": "application/x-www-form-urlencoded" }), noParams)).status).toBe(415);
    expect(reached.count).toBe(0);
  });

  it("takes application/json with parameters and in any letter case (RFC 9110 §8.3.1)", async () => {
    const body = JSON.stringify({ note: "ok" });
    expect((await note(request(body, { "content-type": "application/json; charset=utf-8" }), noParams)).status).toBe(200);
    expect((await note(request(body, { "content-type": "Application/JSON" }), noParams)).status).toBe(200);
  });

  it("lets a write with no body at all through, as the phones' photo completion sends it", async () => {
    const { status, json } = await answer(await bodiless(new Request(url, { method: "POST" }), noParams));
    expect(status).toBe(200);
    expect(json).toEqual({ done: true });
    expect((await bodiless(new Request(url, { method: "DELETE", headers: { "content-length": "0" } }), noParams)).status).toBe(200);
  });

  it("leaves reads alone whatever they declare", async () => {
    expect((await bodiless(new Request(url, { headers: { "content-type": "text/plain" } }), noParams)).status).toBe(200);
  });

  it("a route that declares accepts: 'form' takes a form post and refuses JSON", async () => {
    const form = await answer(await oneClick(request("List-Unsubscribe=One-Click", { "content-type": "application/x-www-form-urlencoded" }), noParams));
    expect(form).toEqual({ status: 200, json: { got: { "List-Unsubscribe": "One-Click" } } });
    const multipart = new FormData();
    multipart.set("List-Unsubscribe", "One-Click");
    expect((await oneClick(new Request(url, { method: "POST", body: multipart }), noParams)).status).toBe(200);
    const json = await answer(await oneClick(request(JSON.stringify({ "List-Unsubscribe": "One-Click" })), noParams));
    expect(json.status).toBe(415);
    expect(json.json.error!.message).toMatch(/form/);
  });
});
