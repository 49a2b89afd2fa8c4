import { eq } from "drizzle-orm";
import { beforeAll, beforeEach, describe, expect, it, vi } from "vitest";
import { db } from "@/db/client";
import { users } from "@/db/schema";
import type { Actor } from "@/lib/auth/guard";
import { fieldReference } from "@/lib/queries/field-reference";
import { resetToDemo } from "./support/db";

// The handler's own session check runs for real; only Auth.js's cookie decoding is replaced.
const session = vi.hoisted(() => ({ userId: null as string | null }));
vi.mock("@/lib/auth/session", () => ({ sessionUserId: async () => session.userId }));

const { POST } = await import("@/app/(field)/api/field/safety/route");

type Answer = { safetyAcceptedAt?: string; error?: { code: string; message: string; fields?: Record<string, string[]> } };

async function post(body: string) {
  const request = new Request("http://localhost/api/field/safety", { method: "POST", body, headers: { "content-type": "application/json" } });
  const response = await POST(request, { params: Promise.resolve({}) });
  return { status: response.status, json: (await response.json()) as Answer };
}

async function person(email: string): Promise<Actor> {
  const [u] = await db().select().from(users).where(eq(users.email, email));
  return { id: u!.id, roles: u!.roles, name: u!.name, email: u!.email };
}

async function storedAt(userId: string) {
  const [u] = await db().select({ at: users.acceptedSafetyAt }).from(users).where(eq(users.id, userId));
  return u!.at;
}

describe("POST /api/field/safety: the volunteer has read the safety notice", () => {
  let volunteer: Actor;
  let other: Actor;

  beforeAll(async () => {
    await resetToDemo();
    volunteer = await person("volunteer01@harrowmere.example");
    other = await person("volunteer02@harrowmere.example");
  });

  beforeEach(() => {
    session.userId = volunteer.id;
  });

  it("answers 401 without a session and 403 for a signed-in non-volunteer, storing nothing", async () => {
    session.userId = null;
    expect((await post(JSON.stringify({ acceptedAt: "2026-06-01T08:00:00.000Z" }))).status).toBe(401);
    const checker = await person("checker@harrowmere.example");
    session.userId = checker.id;
    const refused = await post(JSON.stringify({ acceptedAt: "2026-06-01T08:00:00.000Z" }));
    expect(refused.status).toBe(403);
    expect(refused.json.error?.code).toBe("forbidden");
    expect(await storedAt(checker.id)).toBeNull();
    expect(await storedAt(volunteer.id)).toBeNull();
  });

  it("answers 400 with a field message to a missing, malformed or implausible time", async () => {
    for (const body of [{}, { acceptedAt: "yesterday" }, { acceptedAt: "1899-12-31T23:00:00Z" }, { acceptedAt: 1717228800000 }]) {
      const { status, json } = await post(JSON.stringify(body));
      expect(status, JSON.stringify(body)).toBe(400);
      expect(json.error?.code).toBe("invalid");
      expect(json.error?.fields?.acceptedAt?.length, JSON.stringify(body)).toBeGreaterThan(0);
    }
    expect((await post("{acceptedAt:")).status).toBe(400);
    expect(await storedAt(volunteer.id)).toBeNull();
  });

  it("keeps the first acceptance: a resend or a later one changes nothing", async () => {
    const first = await post(JSON.stringify({ acceptedAt: "2026-06-01T08:00:00.000Z" }));
    expect(first.status).toBe(200);
    expect(first.json).toEqual({ safetyAcceptedAt: "2026-06-01T08:00:00.000Z" });
    const resend = await post(JSON.stringify({ acceptedAt: "2026-06-01T08:00:00.000Z" }));
    const later = await post(JSON.stringify({ acceptedAt: "2026-06-03T10:00:00+02:00" }));
    expect(resend.json).toEqual(first.json);
    expect(later.json).toEqual(first.json);
    expect((await storedAt(volunteer.id))?.toISOString()).toBe("2026-06-01T08:00:00.000Z");
    // It is this volunteer's alone.
    expect(await storedAt(other.id)).toBeNull();
  });

  it("records a phone clock that runs ahead as the server's now", async () => {
    session.userId = other.id;
    const before = Date.now();
    const { status, json } = await post(JSON.stringify({ acceptedAt: "2099-01-01T00:00:00.000Z" }));
    expect(status).toBe(200);
    const at = Date.parse(json.safetyAcceptedAt!);
    expect(at).toBeGreaterThanOrEqual(before - 1000);
    expect(at).toBeLessThanOrEqual(Date.now() + 1000);
  });

  it("is carried to the phone in each volunteer's own reference data", async () => {
    const fresh = await person("volunteer03@harrowmere.example");
    expect((await fieldReference(volunteer)).safetyAcceptedAt).toBe("2026-06-01T08:00:00.000Z");
    expect((await fieldReference(fresh)).safetyAcceptedAt).toBeNull();
  });
});
