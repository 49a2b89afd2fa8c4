import { eq } from "drizzle-orm";
import { beforeAll, beforeEach, describe, expect, it, vi } from "vitest";
import { z } from "zod";
import { db } from "@/db/client";
import { invitations, users } from "@/db/schema";
import { demoPeople } from "@/db/seed/network";
import { route } from "@/lib/http/route";
import { requestBodyLimits } from "@/lib/limits/request-bodies";
import { resetToDemo } from "./support/db";

// Body caps and body types, through real route handlers and a few test-only ones built with the
// same route(). Only Auth.js's cookie decoding is replaced; the person is read from the database.
// Status codes: RFC 9110 §15.5.14 (413 Content Too Large) and §15.5.16 (415 Unsupported Media Type).
const session = vi.hoisted(() => ({ userId: null as string | null }));
vi.mock("@/lib/auth/session", () => ({ sessionUserId: async () => session.userId }));

const { POST: invite } = await import("@/app/(network)/api/network/people/route");
const { POST: sync } = await import("@/app/(field)/api/field/sync/route");

const noParams = { params: Promise.resolve({}) };
const url = "http://localhost/api/test";

async function signInAs(email: string) {
  const [u] = await db().select({ id: users.id }).from(users).where(eq(users.email, email));
  session.userId = u!.id;
}

async function answer(response: Response) {
  return { status: response.status, json: (await response.json()) as { error?: { code: string; message: string; fields?: Record<string, string[]> } } & Record<string, unknown> };
}

const post = (body: BodyInit | null, headers: Record<string, string> = { "content-type": "application/json" }) =>
  new Request("http://localhost/api/network/people", { method: "POST", body, headers, duplex: "half" } as RequestInit);

const goodInvite = (email = "nia.holt@example.org") => JSON.stringify({ name: "Nia Holt", email, role: "volunteer" });

async function invitationsFor(email: string) {
  return db().select().from(invitations).where(eq(invitations.email, email));
}

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

// A test-only handler for a write that takes no body (as the photo completion the phones send).
const bodiless = route({ roles: ["organiser"] }, async () => ({ done: true }));
// A test-only handler declaring a form post, as RFC 8058's one-click unsubscribe will need:
// its §3.1 body is the single pair List-Unsubscribe=One-Click.
const oneClick = route({ roles: ["organiser"], accepts: "form", body: z.object({ "List-Unsubscribe": z.literal("One-Click") }) }, async ({ body }) => ({ got: body }));

describe("request bodies: byte caps (413)", () => {
  beforeAll(async () => {
    await resetToDemo();
  });
  beforeEach(async () => {
    await signInAs(demoPeople.organiser.email);
  });

  it("answers 413 too_large to a JSON body over the default cap, and stores nothing", async () => {
    const email = "too.big@example.org";
    const body = JSON.stringify({ name: "Nia Holt", email, role: "volunteer", padding: "x".repeat(requestBodyLimits.json) });
    const { status, json } = await answer(await invite(post(body), noParams));
    expect(status).toBe(413);
    expect(json.error).toMatchObject({ code: "too_large", message: expect.stringMatching(/too large/) });
    expect(await invitationsFor(email)).toHaveLength(0);
  });

  it("refuses from a Content-Length over the cap without reading the body", async () => {
    const { stream, state } = endlessBody();
    const request = post(stream, { "content-type": "application/json", "content-length": String(requestBodyLimits.json + 1) });
    const { status, json } = await answer(await invite(request, noParams));
    expect(status).toBe(413);
    expect(json.error!.code).toBe("too_large");
    expect(state.pulls).toBeLessThanOrEqual(1); // a stream may be asked once as it is built; never read through
  });

  it("counts the bytes itself: a Content-Length that claims less does not let more through", async () => {
    const email = "liar@example.org";
    const body = JSON.stringify({ name: "Nia Holt", email, role: "volunteer", padding: "x".repeat(requestBodyLimits.json) });
    const { status } = await answer(await invite(post(body, { "content-type": "application/json", "content-length": "60" }), noParams));
    expect(status).toBe(413);
    expect(await invitationsFor(email)).toHaveLength(0);
  });

  it("stops reading an endless body soon after the cap instead of buffering it", async () => {
    const { stream, state } = endlessBody();
    const response = await invite(post(stream), noParams);
    expect(response.status).toBe(413);
    const pullsAtAnswer = state.pulls;
    expect(pullsAtAnswer * 16 * 1024).toBeLessThanOrEqual(requestBodyLimits.json + 3 * 16 * 1024);
    await new Promise((r) => setTimeout(r, 50));
    expect(state.pulls).toBeLessThanOrEqual(pullsAtAnswer + 1); // nothing keeps reading afterwards
  });

  it("gives the sync route its own, larger cap: a batch over the default but under the sync cap is read", async () => {
    await signInAs(demoPeople.volunteers[0]!.email);
    const body = JSON.stringify({ visits: [], sightings: [], padding: "x".repeat(requestBodyLimits.json * 2) });
    const { status, json } = await answer(await sync(new Request("http://localhost/api/field/sync", { method: "POST", body, headers: { "content-type": "application/json" } }), noParams));
    expect(status).toBe(200);
    expect(json.results).toEqual([]);
  });

  it("still takes a body just under the cap", async () => {
    const email = "just.under@example.org";
    const base = JSON.stringify({ name: "Nia Holt", email, role: "volunteer", padding: "" });
    const body = base.replace(`"padding":""`, `"padding":"${"x".repeat(requestBodyLimits.json - base.length)}"`);
    expect(new TextEncoder().encode(body).byteLength).toBe(requestBodyLimits.json);
    expect((await invite(post(body), noParams)).status).toBe(201);
  });

  it("refuses a body that is not valid UTF-8 (RFC 8259 §8.1) instead of storing replacement characters", async () => {
    const email = "broken.bytes@example.org";
    const bytes = new TextEncoder().encode(JSON.stringify({ name: "Nia Holt##", email, role: "volunteer" }));
    const at = bytes.indexOf(0x23); // the first "#"
    bytes[at] = 0xc3; // a UTF-8 lead byte followed by "#": an invalid sequence
    const { status, json } = await answer(await invite(post(bytes), noParams));
    expect(status).toBe(400);
    expect(json.error!.fields).toEqual({ _: ["The request body is not valid JSON."] });
    expect(await invitationsFor(email)).toHaveLength(0);
  });
});

describe("request bodies: JSON only (415)", () => {
  beforeAll(async () => {
    await resetToDemo();
  });
  beforeEach(async () => {
    await signInAs(demoPeople.organiser.email);
  });

  // What an HTML form on another site can send: the three enctypes of the HTML standard's form
  // submission (application/x-www-form-urlencoded, multipart/form-data, text/plain). text/plain can
  // carry text that parses as JSON, which is why the declared type is checked, not the text.
  it.each([
    ["text/plain", goodInvite("plain@example.org"), "plain@example.org"],
    ["application/x-www-form-urlencoded", "name=Nia+Holt&email=form%40example.org&role=volunteer", "form@example.org"],
    ["multipart/form-data; boundary=b", '--b\r\nContent-Disposition: form-data; name="name"\r\n\r\nNia\r\n--b--\r\n', "multipart@example.org"],
  ])("answers 415 to a write sent as %s, and stores nothing", async (type, body, email) => {
    const { status, json } = await answer(await invite(post(body, { "content-type": type }), noParams));
    expect(status).toBe(415);
    expect(json.error).toMatchObject({ code: "unsupported_media_type", message: expect.stringMatching(/application\/json/) });
    expect(await invitationsFor(email)).toHaveLength(0);
  });

  it("answers 415 to a body without any Content-Type", async () => {
    const request = post(new Blob([goodInvite("untyped@example.org")]), {});
    expect(request.headers.get("content-type")).toBeNull();
    expect((await invite(request, noParams)).status).toBe(415);
    expect(await invitationsFor("untyped@example.org")).toHaveLength(0);
  });

  it("answers 415 to an empty form post: a form with no fields still says it is one", async () => {
    const { status } = await answer(await bodiless(new Request(url, { method: "POST", body: "", headers: { "content-type": "application/x-www-form-urlencoded" } }), noParams));
    expect(status).toBe(415);
  });

  it("takes application/json with parameters and in any letter case (RFC 9110 §8.3.1)", async () => {
    expect((await invite(post(goodInvite("charset@example.org"), { "content-type": "application/json; charset=utf-8" }), noParams)).status).toBe(201);
    expect((await invite(post(goodInvite("upper@example.org"), { "content-type": "Application/JSON" }), noParams)).status).toBe(201);
  });

  it("lets a write with no body at all through, as the phones' photo completion sends it", async () => {
    const { status, json } = await answer(await bodiless(new Request(url, { method: "POST" }), noParams));
    expect(status).toBe(200);
    expect(json).toEqual({ done: true });
    expect((await bodiless(new Request(url, { method: "DELETE", headers: { "content-length": "0" } }), noParams)).status).toBe(200);
  });

  it("leaves reads alone whatever they declare", async () => {
    const read = route({ roles: ["organiser"] }, async () => ({ ok: true }));
    expect((await read(new Request(url, { headers: { "content-type": "text/plain" } }), noParams)).status).toBe(200);
  });

  it("a route that declares accepts: 'form' takes a form post and refuses JSON", async () => {
    const form = await answer(await oneClick(new Request(url, { method: "POST", body: "List-Unsubscribe=One-Click", headers: { "content-type": "application/x-www-form-urlencoded" } }), noParams));
    expect(form).toEqual({ status: 200, json: { got: { "List-Unsubscribe": "One-Click" } } });
    const multipart = new FormData();
    multipart.set("List-Unsubscribe", "One-Click");
    expect((await oneClick(new Request(url, { method: "POST", body: multipart }), noParams)).status).toBe(200);
    const json = await answer(await oneClick(new Request(url, { method: "POST", body: JSON.stringify({ "List-Unsubscribe": "One-Click" }), headers: { "content-type": "application/json" } }), noParams));
    expect(json.status).toBe(415);
    expect(json.json.error!.message).toMatch(/form/);
  });
});
