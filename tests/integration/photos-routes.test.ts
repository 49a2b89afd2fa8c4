import { randomUUID } from "node:crypto";
import { eq } from "drizzle-orm";
import { fileTypeFromBuffer } from "file-type";
import { beforeAll, beforeEach, describe, expect, it, vi } from "vitest";
import { db } from "@/db/client";
import { users, visits } from "@/db/schema";
import { resetToDemo } from "./support/db";
import { phoneJpeg, svgDrawing } from "../support/images";

// The route handlers read the session through Auth.js; here a test decides who is signed in.
const session = vi.hoisted(() => ({ userId: null as string | null }));
vi.mock("@/lib/auth/session", () => ({ sessionUserId: async () => session.userId }));

const { POST: requestTicket } = await import("@/app/(field)/api/field/photos/route");
const { POST: complete } = await import("@/app/(field)/api/field/photos/[id]/complete/route");
const { GET: viewPhoto } = await import("@/app/api/photos/[id]/route");

async function signInAs(email: string) {
  const [u] = await db().select({ id: users.id }).from(users).where(eq(users.email, email));
  session.userId = u!.id;
}

const post = (path: string, body?: unknown) =>
  new Request(`http://localhost${path}`, { method: "POST", headers: { "content-type": "application/json" }, body: body === undefined ? undefined : JSON.stringify(body) });
const params = (id: string) => ({ params: Promise.resolve({ id }) });

describe("photo routes: status codes and JSON shapes", () => {
  let visitId: string;

  async function uploadThroughRoutes(bytes: Buffer) {
    const id = randomUUID();
    const res = await requestTicket(post("/api/field/photos", { id, visitId, sightingId: null, contentType: "image/jpeg", bytes: bytes.length }), params(""));
    expect(res.status).toBe(200);
    const ticket = (await res.json()) as { uploadUrl: string; headers: Record<string, string> };
    expect((await fetch(ticket.uploadUrl, { method: "PUT", headers: ticket.headers, body: new Uint8Array(bytes) })).status).toBe(200);
    return { id, done: await complete(post(`/api/field/photos/${id}/complete`), params(id)) };
  }

  beforeAll(async () => {
    await resetToDemo();
    await signInAs("volunteer01@harrowmere.example");
    const [v] = await db().select({ id: visits.id }).from(visits).where(eq(visits.volunteerId, session.userId!)).limit(1);
    visitId = v!.id;
  });

  beforeEach(async () => {
    await signInAs("volunteer01@harrowmere.example");
  });

  it("answers 401 without a session and 403 for a role that does not upload", async () => {
    session.userId = null;
    expect((await requestTicket(post("/api/field/photos", {}), params(""))).status).toBe(401);
    await signInAs("checker@harrowmere.example");
    expect((await requestTicket(post("/api/field/photos", {}), params(""))).status).toBe(403);
  });

  it("answers 400 with field messages for a 20 MB request and a bad id, never a 500", async () => {
    const res = await requestTicket(post("/api/field/photos", { id: "IMG_0001", visitId, contentType: "image/jpeg", bytes: 20 * 1024 * 1024 }), params(""));
    expect(res.status).toBe(400);
    const body = (await res.json()) as { error: { code: string; fields: Record<string, string[]> } };
    expect(body.error.code).toBe("invalid");
    expect(body.error.fields).toEqual({ id: ["The photo id must be a UUID."], bytes: ["Photos can be at most 15 MB."] });
    expect((await complete(post("/api/field/photos/x/complete"), params("x"))).status).toBe(400);
  });

  it("answers a refused SVG with 400 photo_refused and its message", async () => {
    const { done } = await uploadThroughRoutes(svgDrawing);
    expect(done.status).toBe(400);
    expect(await done.json()).toEqual({
      error: { code: "photo_refused", message: "SVG drawings are not accepted: please share a JPEG, PNG, WebP or HEIC photo." },
    });
  });

  it("redirects allowed people to a short-lived signed URL, and refuses the rest", async () => {
    const { id, done } = await uploadThroughRoutes(await phoneJpeg());
    expect(await done.json()).toEqual({ photo: { id, status: "ready", width: 50, height: 100 } });

    const view = (size?: string, photoId: string = id) =>
      viewPhoto(new Request(`http://localhost/api/photos/${photoId}${size ? `?size=${size}` : ""}`), params(photoId));
    const redirect = await view("thumbnail");
    expect(redirect.status).toBe(302);
    expect(redirect.headers.get("cache-control")).toBe("private, no-store");
    const image = await fetch(redirect.headers.get("location")!);
    expect((await fileTypeFromBuffer(Buffer.from(await image.arrayBuffer())))?.mime).toBe("image/jpeg");
    expect((await view()).status).toBe(302); // display by default

    const badSize = await view("huge");
    expect(badSize.status).toBe(400);
    expect(await badSize.json()).toMatchObject({ error: { fields: { size: ["size must be thumbnail or display."] } } });
    expect((await view("display", "not-a-uuid")).status).toBe(400);
    expect((await view("display", randomUUID())).status).toBe(404);

    await signInAs("checker@harrowmere.example");
    expect((await view("display")).status).toBe(302);
    await signInAs("partner@harrowmere.example");
    expect((await view("display")).status).toBe(403);
    await signInAs("volunteer02@harrowmere.example");
    expect((await view("display")).status).toBe(403);
  });
});
